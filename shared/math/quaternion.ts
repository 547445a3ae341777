/**
 * Unit-quaternion helpers. A quaternion is a flat array [w, x, y, z] (scalar first, like the
 * product's JSON {w,x,y,z}); an attitude quaternion rotates body-frame vectors into the inertial frame.
 */
import type { Mat3 } from './mat3.ts';

/** A quaternion [w, x, y, z], scalar first. */
export type Quat = Float64Array | number[];

/** out = a ⊗ b (Hamilton product; applying b first, then a). `out` may alias either input. */
export function quatMultiply(a: ArrayLike<number>, b: ArrayLike<number>, out: Quat): Quat {
  const aw = a[0], ax = a[1], ay = a[2], az = a[3];
  const bw = b[0], bx = b[1], by = b[2], bz = b[3];
  out[0] = aw * bw - ax * bx - ay * by - az * bz;
  out[1] = aw * bx + ax * bw + ay * bz - az * by;
  out[2] = aw * by - ax * bz + ay * bw + az * bx;
  out[3] = aw * bz + ax * by - ay * bx + az * bw;
  return out;
}

/** Quaternion of a right-handed rotation by `angle` (rad) about `axis` (normalised here; zero axis gives identity). */
export function quatFromAxisAngle(axis: ArrayLike<number>, angle: number, out: Quat = [1, 0, 0, 0]): Quat {
  const n = Math.hypot(axis[0], axis[1], axis[2]);
  if (n === 0) { out[0] = 1; out[1] = 0; out[2] = 0; out[3] = 0; return out; }
  const s = Math.sin(angle / 2) / n;
  out[0] = Math.cos(angle / 2); out[1] = axis[0] * s; out[2] = axis[1] * s; out[3] = axis[2] * s;
  return out;
}

/** Normalises q in place to unit length and returns it. */
export function quatNormalize(q: Quat): Quat {
  const n = Math.hypot(q[0], q[1], q[2], q[3]);
  q[0] /= n; q[1] /= n; q[2] /= n; q[3] /= n;
  return q;
}

/** Flips the sign of q in place so that w ≥ 0 (the same rotation; the product's canonical form). */
export function quatCanonical(q: Quat): Quat {
  if (q[0] < 0) { q[0] = -q[0]; q[1] = -q[1]; q[2] = -q[2]; q[3] = -q[3]; }
  return q;
}

/** Rotation matrix (row-major 3×3) of unit quaternion q; maps body-frame vectors to the inertial frame. */
export function quatToMatrix(q: ArrayLike<number>, out: Mat3 = new Array<number>(9)): Mat3 {
  const w = q[0], x = q[1], y = q[2], z = q[3];
  out[0] = 1 - 2 * (y * y + z * z); out[1] = 2 * (x * y - w * z); out[2] = 2 * (x * z + w * y);
  out[3] = 2 * (x * y + w * z); out[4] = 1 - 2 * (x * x + z * z); out[5] = 2 * (y * z - w * x);
  out[6] = 2 * (x * z - w * y); out[7] = 2 * (y * z + w * x); out[8] = 1 - 2 * (x * x + y * y);
  return out;
}

/** Unit quaternion (w ≥ 0) of a rotation matrix (row-major), by Shepperd's method (largest pivot for stability). */
export function matrixToQuat(m: ArrayLike<number>, out: Quat = [1, 0, 0, 0]): Quat {
  const tr = m[0] + m[4] + m[8];
  if (tr >= m[0] && tr >= m[4] && tr >= m[8]) {
    const s = 2 * Math.sqrt(1 + tr);
    out[0] = s / 4; out[1] = (m[7] - m[5]) / s; out[2] = (m[2] - m[6]) / s; out[3] = (m[3] - m[1]) / s;
  } else if (m[0] >= m[4] && m[0] >= m[8]) {
    const s = 2 * Math.sqrt(1 + m[0] - m[4] - m[8]);
    out[0] = (m[7] - m[5]) / s; out[1] = s / 4; out[2] = (m[1] + m[3]) / s; out[3] = (m[2] + m[6]) / s;
  } else if (m[4] >= m[8]) {
    const s = 2 * Math.sqrt(1 + m[4] - m[0] - m[8]);
    out[0] = (m[2] - m[6]) / s; out[1] = (m[1] + m[3]) / s; out[2] = s / 4; out[3] = (m[5] + m[7]) / s;
  } else {
    const s = 2 * Math.sqrt(1 + m[8] - m[0] - m[4]);
    out[0] = (m[3] - m[1]) / s; out[1] = (m[2] + m[6]) / s; out[2] = (m[5] + m[7]) / s; out[3] = s / 4;
  }
  return quatCanonical(quatNormalize(out));
}

/** Rotation angle (rad, in [0, π]) and unit axis of q; the axis is [1, 0, 0] for a zero rotation. */
export function quatToAxisAngle(q: ArrayLike<number>): { angle: number; axis: [number, number, number] } {
  // Use the w ≥ 0 representative so the angle is the short way round.
  const sign = q[0] < 0 ? -1 : 1;
  const w = sign * q[0], x = sign * q[1], y = sign * q[2], z = sign * q[3];
  const s = Math.hypot(x, y, z);
  // atan2 keeps full precision for tiny and near-π angles (acos(w) does not).
  const angle = 2 * Math.atan2(s, w);
  if (s === 0) return { angle: 0, axis: [1, 0, 0] };
  return { angle, axis: [x / s, y / s, z / s] };
}

/** Angle (rad, in [0, π]) of the rotation that takes attitude a to attitude b: the attitude error between them. */
export function quatAngleBetween(a: ArrayLike<number>, b: ArrayLike<number>): number {
  // conj(a) ⊗ b; 2·atan2(|vector|, |scalar|) stays accurate for tiny angles, unlike 2·acos.
  const d = a[0] * b[0] + a[1] * b[1] + a[2] * b[2] + a[3] * b[3];
  const vx = a[0] * b[1] - b[0] * a[1] - (a[2] * b[3] - a[3] * b[2]);
  const vy = a[0] * b[2] - b[0] * a[2] - (a[3] * b[1] - a[1] * b[3]);
  const vz = a[0] * b[3] - b[0] * a[3] - (a[1] * b[2] - a[2] * b[1]);
  return 2 * Math.atan2(Math.hypot(vx, vy, vz), Math.abs(d));
}
