/**
 * The l_/r_ naming of the standard model's limbs (shared/model/body-sides.ts) and the closed name
 * lists built on it (shared/contracts/labelled-names.ts). Checked against the model's own order
 * (left chain, then right chain: the derived body's tree order, tested in standard-human.test.ts).
 */
import { describe, expect, it } from 'vitest';

import { labelledNames } from '../../shared/contracts/labelled-names.ts';
import { limbOnBothSides, sameOnBothSides } from '../../shared/model/body-sides.ts';
import { DOF_NAMES, isDofName } from '../../shared/model/dof-names.ts';
import { mirrorSegmentName, SEGMENT_LABELS, SEGMENT_NAMES } from '../../shared/model/segment-names.ts';

describe('both sides of a limb', () => {
  it('lists the whole left chain, then the right one, with side words in the labels', () => {
    expect(limbOnBothSides([['thigh', 'thigh'], ['shank', 'shank']])).toEqual([
      ['l_thigh', 'Left thigh'], ['l_shank', 'Left shank'], ['r_thigh', 'Right thigh'], ['r_shank', 'Right shank'],
    ]);
  });

  it('gives each side its own copy of a value', () => {
    const both = sameOnBothSides({ foot: { mass: 2.5, inertia: [0.004, 0.02, 0.02] } });
    expect(Object.keys(both)).toEqual(['l_foot', 'r_foot']);
    expect(both.r_foot).toEqual(both.l_foot);
    both.l_foot.inertia[0] = 1;
    expect(both.r_foot.inertia[0]).toBe(0.004);
  });

  it('names every sided segment so that its mirror is also a segment, labelled with the other side', () => {
    for (const name of SEGMENT_NAMES.filter((n) => n.startsWith('l_') || n.startsWith('r_'))) {
      const mirror = mirrorSegmentName(name);
      expect(SEGMENT_NAMES).toContain(mirror);
      expect(SEGMENT_LABELS[mirror].replace(/^(Left|Right) /, '')).toBe(SEGMENT_LABELS[name].replace(/^(Left|Right) /, ''));
    }
  });
});

describe('labelled names', () => {
  it('keeps the written order and answers only for its own names', () => {
    const colours = labelledNames([['teal', 'Teal'], ['amber', 'Amber']]);
    expect(colours.names).toEqual(['teal', 'amber']);
    expect(colours.labels.amber).toBe('Amber');
    expect(colours.has('amber')).toBe(true);
    // Not fooled by what every object inherits.
    expect(colours.has('toString')).toBe(false);
    expect(isDofName('constructor')).toBe(false);
    expect(isDofName(DOF_NAMES[0])).toBe(true);
  });
});
