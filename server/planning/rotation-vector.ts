/**
 * Rotation vectors (axis × angle, radians) and the quaternion algebra the planner composes with:
 * log/exp maps, conjugate, products and real powers of unit quaternions [w,x,y,z].
 */
import { type Quat, quatMultiply } from '../../shared/math/quaternion.ts';

/** A rotation vector: axis × angle, radians. */
export type RotVec = [number, number, number];

/** Rotation vector of a unit quaternion (the shorter way round, angle ≤ π). */
export function quatLog(q: ArrayLike<number>): RotVec {
  const s = q[0] < 0 ? -1 : 1;
  const w = s * q[0], x = s * q[1], y = s * q[2], z = s * q[3];
  const n = Math.hypot(x, y, z);
  if (n < 1e-12) return [2 * x, 2 * y, 2 * z];
  const k = (2 * Math.atan2(n, w)) / n;
  return [k * x, k * y, k * z];
}

/** Unit quaternion of a rotation vector. */
export function quatExp(v: ArrayLike<number>): Quat {
  const a = Math.hypot(v[0], v[1], v[2]);
  if (a < 1e-12) return [1, v[0] / 2, v[1] / 2, v[2] / 2];
  const s = Math.sin(a / 2) / a;
  return [Math.cos(a / 2), v[0] * s, v[1] * s, v[2] * s];
}

/** Inverse of a unit quaternion. */
export function quatConj(q: ArrayLike<number>): Quat {
  return [q[0], -q[1], -q[2], -q[3]];
}

/** Product of several quaternions, left to right (successive body-frame rotations). */
export function quatChain(...qs: ArrayLike<number>[]): Quat {
  let out: Quat = [1, 0, 0, 0];
  for (const q of qs) out = quatMultiply(out, q, [0, 0, 0, 0]);
  return out;
}

/** q^n for a unit quaternion and a whole n ≥ 0, by squaring (exact products, no log/exp). */
export function quatIntPower(q: ArrayLike<number>, n: number): Quat {
  let out: Quat = [1, 0, 0, 0];
  let base: Quat = [q[0], q[1], q[2], q[3]];
  let k = Math.max(0, Math.round(n));
  while (k > 0) {
    if (k & 1) out = quatMultiply(out, base, [0, 0, 0, 0]);
    base = quatMultiply(base, base, [0, 0, 0, 0]);
    k >>= 1;
  }
  return out;
}

/** Angle of a unit quaternion's rotation, radians, 0…π. */
export function quatAngle(q: ArrayLike<number>): number {
  return 2 * Math.atan2(Math.hypot(q[1], q[2], q[3]), Math.abs(q[0]));
}
