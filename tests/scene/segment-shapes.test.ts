/** Drawing sizes from inertia: the elliptic-cylinder inversion recovers known solids. */
import { describe, expect, it } from 'vitest';

import { segmentShapes, segmentSide } from '../../scene/pose/segment-shapes.ts';
import { compileBody } from '../../shared/kinematics/body-model.ts';

describe('segment shapes', () => {
  it('recovers a solid circular cylinder (r = 0.05 m, L = 0.4 m, 2 kg) from I = mr²/2 and m(3r²+L²)/12 (standard table of moments of inertia)', () => {
    const m = 2, r = 0.05, L = 0.4;
    const It = (m * (3 * r * r + L * L)) / 12, Ia = (m * r * r) / 2;
    const model = compileBody({ name: 'c', segments: [{ name: 'rod', mass: m, com: [0, 0, 0.1], inertia: [It, It, Ia] }] });
    const [s] = segmentShapes(model);
    expect(s.longAxis).toBe(2);
    expect(s.semiAxes[2]).toBeCloseTo(L / 2, 12);
    expect(s.semiAxes[0]).toBeCloseTo(r, 12);
    expect(s.semiAxes[1]).toBeCloseTo(r, 12);
    expect(s.centre).toEqual([0, 0, 0.1]);
  });

  it('finds a long axis along x (a foot-like box lying forward)', () => {
    const m = 1, a = 0.04, b = 0.03, L = 0.25; // semi-axes a (y), b (z), length L along x
    const Ix = (m * (a * a + b * b)) / 4, Iy = m * (b * b / 4 + L * L / 12), Iz = m * (a * a / 4 + L * L / 12);
    const [s] = segmentShapes(compileBody({ name: 'f', segments: [{ name: 'foot', mass: m, com: [0, 0, 0], inertia: [Ix, Iy, Iz] }] }));
    expect(s.longAxis).toBe(0);
    expect(s.semiAxes[0]).toBeCloseTo(L / 2, 12);
    expect(s.semiAxes[1]).toBeCloseTo(a, 12);
    expect(s.semiAxes[2]).toBeCloseTo(b, 12);
  });

  it('draws a sphere-like point mass no smaller than the minimum semi-axis (1.2 cm)', () => {
    const [s] = segmentShapes(compileBody({ name: 'p', segments: [{ name: 'ball', mass: 1, com: [0, 0, 0], inertia: [1e-9, 1e-9, 1e-9] }] }));
    expect(Math.min(...s.semiAxes)).toBeGreaterThanOrEqual(0.012);
  });

  it('tells left from right by name first, then by the CoM side (+y is the person’s left)', () => {
    expect(segmentSide('l_forearm', -1)).toBe('left');
    expect(segmentSide('r_hand', 1)).toBe('right');
    expect(segmentSide('tool', 0.2)).toBe('left');
    expect(segmentSide('head_neck', 0)).toBe('centre');
  });
});
