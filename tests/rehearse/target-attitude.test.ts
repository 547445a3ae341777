/** The target ghost's attitude from a sequence's stored target, against closed-form quaternions. */
import { describe, expect, it } from 'vitest';

import { targetAttitude, targetLabel } from '../../server/motion/target-attitude.ts';

const c = (deg: number) => Math.cos((deg * Math.PI) / 360);
const s = (deg: number) => Math.sin((deg * Math.PI) / 360);

describe('target attitude', () => {
  it('reads the maneuver contract’s yaw/pitch/roll target: yaw 90° is (cos 45°, 0, 0, sin 45°)', () => {
    const q = targetAttitude({ mode: 'ypr', yprDeg: { yaw: 90, pitch: 0, roll: 0 }, toleranceDeg: 2 })!;
    expect(q.w).toBeCloseTo(c(90), 14);
    expect(q.z).toBeCloseTo(s(90), 14);
  });

  it('reads an axis-angle target with an unnormalised axis: 120° about (1,1,1) is (½, ½, ½, ½)', () => {
    const q = targetAttitude({ mode: 'axis_angle', axisAngle: { axis: [2, 2, 2], angleDeg: 120 } })!;
    for (const v of [q.w, q.x, q.y, q.z]) expect(v).toBeCloseTo(0.5, 14);
  });

  it('composes yaw then pitch (z-y′-x″): yaw 90°, pitch 90° equals q_z(90°) ⊗ q_y(90°) = (½, −½, ½, ½)', () => {
    const q = targetAttitude({ yprDeg: { yaw: 90, pitch: 90, roll: 0 } })!;
    expect([q.w, q.x, q.y, q.z].map((v) => Math.round(v * 1e12) / 1e12)).toEqual([0.5, -0.5, 0.5, 0.5]);
  });

  it('returns a canonical quaternion (w ≥ 0) for a 180° yaw given as a quaternion with w < 0', () => {
    const q = targetAttitude({ w: -0.1, x: 0, y: 0, z: -1 })!;
    expect(q.w).toBeGreaterThanOrEqual(0);
    expect(Math.hypot(q.w, q.x, q.y, q.z)).toBeCloseTo(1, 14);
  });

  it('gives null for shapes it cannot read (the view then shows the simulated final attitude)', () => {
    expect(targetAttitude(null)).toBeNull();
    expect(targetAttitude({ axis: [0, 0, 0], angleDeg: 30 })).toBeNull();
    expect(targetAttitude('yaw 90')).toBeNull();
  });

  it('words targets for the list', () => {
    expect(targetLabel({ mode: 'ypr', yprDeg: { yaw: -39.04, pitch: 0, roll: 1 } })).toBe('yaw -39°, pitch 0°, roll 1°');
    expect(targetLabel({ mode: 'axis_angle', axisAngle: { axis: [0, 0, 1], angleDeg: 45 } })).toBe('45° about [0, 0, 1]');
  });
});
