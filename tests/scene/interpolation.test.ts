/**
 * Interpolation between samples: slerp (Shoemake 1985, "Animating rotation with quaternion curves")
 * checked against the closed form and gl-matrix; exact endpoints; linear joint angles.
 */
import { glMatrix, quat } from 'gl-matrix';
import { describe, expect, it } from 'vitest';

import { sampleIndexAt, slerpInto, trackStateAt } from '../../scene/pose/interpolate.ts';
import { createMotionTrack } from '../../scene/pose/motion-track.ts';
import { compileBody } from '../../shared/kinematics/body-model.ts';

glMatrix.setMatrixArrayType(Float64Array as unknown as ArrayConstructor);

const TOL = 1e-12;
const s45 = Math.sin(Math.PI / 8), c45 = Math.cos(Math.PI / 8);

/** A one-dof body: a rod on a trunk (invented). */
const model = compileBody({
  name: 'rod', segments: [
    { name: 'trunk', mass: 10, com: [0, 0, 0], inertia: [1, 1, 0.5] },
    { name: 'rod', parent: 'trunk', mass: 1, com: [0, 0, -0.2], inertia: [0.01, 0.01, 0.001], joint: { origin: [0, 0.2, 0.3], dofs: [{ name: 'swing', axis: [0, 1, 0], min: -180, max: 180 }] } },
  ],
});

describe('slerp', () => {
  it('midpoint of identity and 90° about z is 45° about z (closed form)', () => {
    const out = new Float64Array(4);
    slerpInto([1, 0, 0, 0], 0, [Math.SQRT1_2, 0, 0, Math.SQRT1_2], 0, 0.5, out);
    expect(out[0]).toBeCloseTo(c45, 14);
    expect(out[3]).toBeCloseTo(s45, 14);
  });

  it('agrees with gl-matrix quat.slerp on a general pair at u = 0.3', () => {
    const a = quat.normalize(quat.create(), [0.1, 0.7, -0.2, 0.6]); // gl-matrix order [x,y,z,w]
    const b = quat.normalize(quat.create(), [-0.5, 0.2, 0.4, 0.7]);
    const ref = quat.slerp(quat.create(), a, b, 0.3);
    const out = new Float64Array(4);
    slerpInto([a[3], a[0], a[1], a[2]], 0, [b[3], b[0], b[1], b[2]], 0, 0.3, out);
    expect(Math.abs(out[0] - ref[3]) + Math.abs(out[1] - ref[0]) + Math.abs(out[2] - ref[1]) + Math.abs(out[3] - ref[2])).toBeLessThan(1e-10);
  });

  it('takes the short way when the second quaternion has the opposite sign (q and −q)', () => {
    const out = new Float64Array(4);
    slerpInto([1, 0, 0, 0], 0, [-Math.SQRT1_2, 0, 0, -Math.SQRT1_2], 0, 0.5, out);
    expect(Math.abs(out[3])).toBeCloseTo(s45, 14);
    expect(Math.abs(out[0])).toBeCloseTo(c45, 14);
  });

  it('is exact at u = 0 and u = 1 for nearly equal quaternions (the linear branch)', () => {
    const out = new Float64Array(4);
    const b = [Math.cos(1e-9), 0, 0, Math.sin(1e-9)];
    slerpInto([1, 0, 0, 0], 0, b, 0, 1, out);
    expect(Math.abs(out[3] - b[3])).toBeLessThan(TOL);
  });
});

describe('track state', () => {
  const frames = [
    { t: 0, attitude: { w: 1, x: 0, y: 0, z: 0 }, jointsDeg: [0] },
    { t: 0.5, attitude: { w: Math.SQRT1_2, x: 0, y: 0, z: Math.SQRT1_2 }, jointsDeg: [40] },
    // Stored with w < 0 (same rotation as +): the track flips it for continuity.
    { t: 1, attitude: { w: -0, x: 0, y: 0, z: -1 }, jointsDeg: [80] },
  ];
  const track = createMotionTrack(model, { dofs: ['swing'], frames });
  const att = new Float64Array(4), q = new Float64Array(1);

  it('returns the sample exactly at a sample time (t = 0.5 s)', () => {
    trackStateAt(track, 0.5, att, q);
    expect([...att]).toEqual([Math.SQRT1_2, 0, 0, Math.SQRT1_2]);
    expect(q[0]).toBe((40 * Math.PI) / 180);
  });

  it('is halfway in angle and joint at the midpoint between samples (t = 0.25 s)', () => {
    trackStateAt(track, 0.25, att, q);
    expect(att[0]).toBeCloseTo(c45, 14);
    expect(att[3]).toBeCloseTo(s45, 14);
    expect(q[0]).toBeCloseTo((20 * Math.PI) / 180, 14);
  });

  it('continues smoothly across a stored sign flip (t = 0.75 s is 135° about z)', () => {
    trackStateAt(track, 0.75, att, q);
    expect(Math.abs(att[3])).toBeCloseTo(Math.sin((3 * Math.PI) / 8), 14);
  });

  it('clamps before the start and after the end to the first and last sample', () => {
    trackStateAt(track, -1, att, q);
    expect(q[0]).toBe(0);
    trackStateAt(track, 5, att, q);
    expect(q[0]).toBe((80 * Math.PI) / 180);
  });

  it('finds the interval by binary search: t = 0.5 s exactly starts interval 1', () => {
    expect(sampleIndexAt(track.times, 0.5)).toBe(1);
    expect(sampleIndexAt(track.times, 0.4999)).toBe(0);
    expect(sampleIndexAt(track.times, 1)).toBe(1);
  });
});
