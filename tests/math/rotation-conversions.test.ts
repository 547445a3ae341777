/**
 * Quaternion ↔ rotation matrix ↔ yaw-pitch-roll (z-y′-x″) against two general-purpose reference
 * libraries: three.js (Quaternion, Matrix4, Euler order 'ZYX' = Rz·Ry·Rx) and gl-matrix (64-bit).
 */
import { glMatrix, mat3, quat } from 'gl-matrix';
import { Euler, Matrix4, Quaternion } from 'three';
import { beforeAll, describe, expect, it } from 'vitest';

import { matrixToYpr, quatToYpr, yprToMatrix, yprToQuat } from '../../shared/math/euler-zyx.ts';
import { matrixToQuat, quatAngleBetween, quatFromAxisAngle, quatMultiply, quatToAxisAngle, quatToMatrix } from '../../shared/math/quaternion.ts';

const TOL = 1e-12;

/** Deterministic pseudo-random unit quaternions (a fixed LCG: reproducible inputs). */
function testQuaternions(): number[][] {
  let seed = 12345;
  const rnd = () => ((seed = (seed * 1103515245 + 12345) % 2 ** 31) / 2 ** 31) * 2 - 1;
  const out: number[][] = [];
  for (let i = 0; i < 200; i++) {
    const q = [rnd(), rnd(), rnd(), rnd()];
    const n = Math.hypot(...q);
    out.push(q.map((v) => v / n));
  }
  // Edge cases: identity, 180° turns, tiny angles, gimbal lock pitch ±90°.
  out.push([1, 0, 0, 0], [0, 1, 0, 0], [0, 0, 1, 0], [0, 0, 0, 1], [Math.cos(1e-9), Math.sin(1e-9), 0, 0]);
  out.push([Math.SQRT1_2, 0, Math.SQRT1_2, 0], [Math.SQRT1_2, 0, -Math.SQRT1_2, 0]);
  return out;
}

beforeAll(() => { glMatrix.setMatrixArrayType(Float64Array as unknown as Float32ArrayConstructor); });

describe('quaternion → matrix', () => {
  it('agrees with three.js Matrix4.makeRotationFromQuaternion', () => {
    for (const q of testQuaternions()) {
      const m = quatToMatrix(q);
      const e = new Matrix4().makeRotationFromQuaternion(new Quaternion(q[1], q[2], q[3], q[0])).elements; // column-major 4×4
      for (let r = 0; r < 3; r++) for (let c = 0; c < 3; c++) expect(m[3 * r + c]).toBeCloseTo(e[4 * c + r], 12);
    }
  });

  it('agrees with gl-matrix mat3.fromQuat (column-major)', () => {
    for (const q of testQuaternions()) {
      const m = quatToMatrix(q);
      const g = mat3.fromQuat(mat3.create(), quat.fromValues(q[1], q[2], q[3], q[0]));
      for (let r = 0; r < 3; r++) for (let c = 0; c < 3; c++) expect(Math.abs(m[3 * r + c] - g[3 * c + r])).toBeLessThan(TOL);
    }
  });
});

describe('matrix → quaternion', () => {
  it('round-trips and agrees with gl-matrix quat.fromMat3 up to sign', () => {
    for (const q of testQuaternions()) {
      const back = matrixToQuat(quatToMatrix(q));
      expect(back[0]).toBeGreaterThanOrEqual(0);
      expect(quatAngleBetween(back, q)).toBeLessThan(2e-8);
      const g = quat.fromMat3(quat.create(), mat3.fromQuat(mat3.create(), quat.fromValues(q[1], q[2], q[3], q[0])));
      expect(quatAngleBetween(back, [g[3], g[0], g[1], g[2]])).toBeLessThan(2e-8);
    }
  });
});

describe('yaw-pitch-roll z-y′-x″', () => {
  it('agrees with three.js Euler order ZYX away from gimbal lock', () => {
    for (const q of testQuaternions()) {
      const ypr = quatToYpr(q);
      if (Math.abs(Math.abs(ypr.pitch) - Math.PI / 2) < 1e-6) continue; // checked separately below
      const e = new Euler().setFromQuaternion(new Quaternion(q[1], q[2], q[3], q[0]), 'ZYX');
      expect(ypr.yaw).toBeCloseTo(e.z, 10);
      expect(ypr.pitch).toBeCloseTo(e.y, 10);
      expect(ypr.roll).toBeCloseTo(e.x, 10);
    }
  });

  it('yprToQuat agrees with three.js Quaternion.setFromEuler(ZYX) and with gl-matrix fromEuler(zyx)', () => {
    for (const [y, p, r] of [[0.3, -0.4, 1.2], [-2.9, 1.1, -0.2], [1.0, Math.PI / 2, 0.5], [0, 0, Math.PI]]) {
      const ours = yprToQuat({ yaw: y, pitch: p, roll: r });
      const t = new Quaternion().setFromEuler(new Euler(r, p, y, 'ZYX'));
      expect(quatAngleBetween(ours, [t.w, t.x, t.y, t.z])).toBeLessThan(1e-7);
      const g = quat.fromEuler(quat.create(), (r * 180) / Math.PI, (p * 180) / Math.PI, (y * 180) / Math.PI, 'zyx');
      expect(quatAngleBetween(ours, [g[3], g[0], g[1], g[2]])).toBeLessThan(1e-7);
      // And the matrix path.
      const m = yprToMatrix({ yaw: y, pitch: p, roll: r });
      const mq = quatToMatrix(ours);
      for (let i = 0; i < 9; i++) expect(Math.abs(m[i] - mq[i])).toBeLessThan(TOL);
    }
  });

  it('at gimbal lock (pitch ±90°) the angles still reproduce the rotation', () => {
    for (const pitch of [Math.PI / 2, -Math.PI / 2]) {
      const q = yprToQuat({ yaw: 0.7, pitch, roll: -0.3 });
      const ypr = quatToYpr(q);
      expect(Math.abs(ypr.pitch)).toBeCloseTo(Math.PI / 2, 6);
      expect(quatAngleBetween(yprToQuat(ypr), q)).toBeLessThan(1e-6);
    }
  });

  it('matrixToYpr inverts yprToMatrix for random angles', () => {
    for (const q of testQuaternions().slice(0, 50)) {
      const ypr = matrixToYpr(quatToMatrix(q));
      const m = yprToMatrix(ypr), m0 = quatToMatrix(q);
      for (let i = 0; i < 9; i++) expect(Math.abs(m[i] - m0[i])).toBeLessThan(1e-9);
    }
  });
});

describe('axis-angle and products', () => {
  it('quatFromAxisAngle / quatToAxisAngle agree with gl-matrix setAxisAngle / getAxisAngle', () => {
    for (const [axis, angle] of [[[1, 2, 3], 0.5], [[0, 0, 1], Math.PI - 1e-9], [[-1, 0.5, 0], 1e-8], [[0.2, -0.9, 0.1], 2.5]] as const) {
      const n = Math.hypot(...axis), unit = axis.map((v) => v / n);
      const ours = quatFromAxisAngle(axis, angle);
      const g = quat.setAxisAngle(quat.create(), unit, angle);
      for (const [i, j] of [[0, 3], [1, 0], [2, 1], [3, 2]]) expect(Math.abs(ours[i] - g[j])).toBeLessThan(TOL);
      const back = quatToAxisAngle(ours);
      expect(Math.abs(back.angle - angle)).toBeLessThan(1e-15 + angle * 1e-12);
      for (let k = 0; k < 3; k++) expect(Math.abs(back.axis[k] - unit[k])).toBeLessThan(1e-9);
    }
  });

  it('quatMultiply agrees with three.js multiplyQuaternions and gl-matrix multiply', () => {
    const qs = testQuaternions();
    for (let i = 0; i + 1 < qs.length; i += 2) {
      const [a, b] = [qs[i], qs[i + 1]];
      const ours = quatMultiply(a, b, [0, 0, 0, 0]);
      const t = new Quaternion().multiplyQuaternions(new Quaternion(a[1], a[2], a[3], a[0]), new Quaternion(b[1], b[2], b[3], b[0]));
      const g = quat.multiply(quat.create(), quat.fromValues(a[1], a[2], a[3], a[0]), quat.fromValues(b[1], b[2], b[3], b[0]));
      expect(Math.abs(ours[0] - t.w) + Math.abs(ours[1] - t.x) + Math.abs(ours[2] - t.y) + Math.abs(ours[3] - t.z)).toBeLessThan(TOL);
      expect(Math.abs(ours[0] - g[3]) + Math.abs(ours[1] - g[0]) + Math.abs(ours[2] - g[1]) + Math.abs(ours[3] - g[2])).toBeLessThan(TOL);
    }
  });
});
