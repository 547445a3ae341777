/**
 * The cue card's step pictograms: stick figures from the body's forward kinematics at the two ends
 * of a step's widest joint swing. Checked against geometry that does not depend on the kinematics
 * code: a rigid segment keeps the length of its joint offset (|joint.origin| from the body contract),
 * and a shoulder flexed by 90° points the arm straight ahead (closed form); and against poppler's
 * pdftoppm/pdftotext (Debian poppler-utils) reading the rendered card.
 */
import { describe, expect, it } from 'vitest';

import { deriveProfile } from '../../server/crew/derive-profile.ts';
import { projectedFigure, stepPictograms } from '../../server/cue-card/step-pictograms.ts';
import { BUILT_IN_SUITS } from '../../server/model/suits/index.ts';
import type { Body } from '../../shared/contracts/body.ts';
import type { VerificationReport } from '../../shared/contracts/maneuver.ts';

const body: Body = deriveProfile(
  { sex: 'female', stature: 1.68, mass: 61, lengths: {}, gear: [] },
  BUILT_IN_SUITS.find((s) => s.id === 'cabin-clothing') ?? null,
  'pictogram test',
).body;

/** A report carrying only what pictograms read: a 20 Hz series of one dof swinging from `from` to `to` over 2 s, others at 0. */
function swing(dof: string, from: number, to: number): VerificationReport {
  const t = Array.from({ length: 41 }, (_, k) => k / 20);
  const values = t.map((s) => from + ((to - from) * (1 - Math.cos((Math.PI * s) / 2))) / 2);
  return { final: { jointsDeg: { [dof]: to } }, series: { t, jointsDeg: { [dof]: values } } } as unknown as VerificationReport;
}

const length = ([x1, y1, x2, y2]: number[]) => Math.hypot(x2 - x1, y2 - y1);

describe('step pictograms', () => {
  it('draw the two ends of a shoulder flexion from the side, the arm hanging then straight ahead', () => {
    const [pic] = stepPictograms(body, swing('r_sh_flex', 0, 90), [{ startS: 0, durationS: 2 }]);
    expect(pic.view).toBe('side');
    expect(pic.dof).toBe('r_sh_flex');
    expect(pic.poses).toHaveLength(2);
    // The upper arm line: from the shoulder joint to the elbow joint; its length is |origin| of the forearm segment.
    const forearm = body.segments.find((s) => s.parent === body.segments.find((p) => p.joint?.dofs.some((d) => d.name === 'r_sh_flex'))!.name)!;
    const upperArmLength = Math.hypot(...(forearm.joint!.origin));
    const matches = (pose: number[][]) => pose.filter((l) => Math.abs(length(l) - upperArmLength) < 1e-9);
    // In the side view (x ahead, z up): hanging, the elbow is straight below the shoulder; flexed 90°, straight ahead of it.
    const hanging = matches(pic.poses[0]).find((l) => Math.abs(l[0] - l[2]) < 0.02 && l[3] < l[1]);
    const ahead = matches(pic.poses[1]).find((l) => Math.abs(l[1] - l[3]) < 0.02 && l[2] > l[0]);
    expect(hanging, 'upper arm hanging in the first pose').toBeTruthy();
    expect(ahead, 'upper arm straight ahead in the second pose').toBeTruthy();
  });

  it('keep every segment rigid: over the three views each parent-to-child line has the 3-D length of the child joint offset in the body contract', () => {
    // A line (dx, dy, dz) is (dy, dz) from the front, (dx, dz) from the side and (dy, dx) from above: the squares sum to twice its 3-D length squared.
    const angles = { l_hip_flex: 60, r_sh_flex: 120, r_sh_abd: 30, l_elbow_flex: 90, waist_flex: 20 };
    const [front, side, above] = (['front', 'side', 'above'] as const).map((v) => projectedFigure(body, angles, v));
    const offsets = body.segments.filter((s) => s.parent !== undefined).map((s) => Math.hypot(...(s.joint!.origin)));
    expect(offsets.length).toBeGreaterThan(10);
    offsets.forEach((o, i) => {
      const sumSq = length(front[i]) ** 2 + length(side[i]) ** 2 + length(above[i]) ** 2;
      expect(Math.sqrt(sumSq / 2)).toBeCloseTo(o, 12);
    });
  });

  it('draw an arm swept out to the side from the front, and a still step as one pose from the front', () => {
    const [abduct] = stepPictograms(body, swing('l_sh_abd', 0, 80), [{ startS: 0, durationS: 2 }]);
    expect(abduct.view).toBe('front');
    const still = stepPictograms(body, swing('l_sh_abd', 0, 80), [{ startS: 2, durationS: 0 }])[0];
    expect(still.poses).toHaveLength(1);
    expect(still.dof).toBeNull();
  });
});
