/**
 * Yaw-pitch-roll as intrinsic z-y′-x″ angles: R = Rz(yaw)·Ry(pitch)·Rx(roll), body → inertial.
 * Yaw about z (toward the head), pitch about y (to the left), roll about x (out of the chest).
 */
import type { Mat3 } from './mat3.ts';
import { type Quat, quatToMatrix } from './quaternion.ts';

/** Yaw, pitch, roll in radians; pitch in [−π/2, π/2]. */
export interface YawPitchRoll { yaw: number; pitch: number; roll: number }

/** Yaw-pitch-roll (rad) of a row-major rotation matrix; at gimbal lock (|pitch| = 90°) roll is set to 0. */
export function matrixToYpr(m: ArrayLike<number>): YawPitchRoll {
  const sp = Math.max(-1, Math.min(1, -m[6]));
  const pitch = Math.asin(sp);
  // Near gimbal lock yaw and roll share one axis: put all of it in yaw.
  if (Math.abs(sp) > 1 - 1e-12) {
    return { yaw: Math.atan2(-m[1], m[4]), pitch, roll: 0 };
  }
  return { yaw: Math.atan2(m[3], m[0]), pitch, roll: Math.atan2(m[7], m[8]) };
}

/** Yaw-pitch-roll (rad) of a unit quaternion [w,x,y,z]. */
export function quatToYpr(q: ArrayLike<number>): YawPitchRoll {
  return matrixToYpr(quatToMatrix(q));
}

/** Unit quaternion [w,x,y,z] of yaw-pitch-roll (rad), q = qz(yaw) ⊗ qy(pitch) ⊗ qx(roll). */
export function yprToQuat(ypr: YawPitchRoll, out: Quat = [1, 0, 0, 0]): Quat {
  const cy = Math.cos(ypr.yaw / 2), sy = Math.sin(ypr.yaw / 2);
  const cp = Math.cos(ypr.pitch / 2), sp = Math.sin(ypr.pitch / 2);
  const cr = Math.cos(ypr.roll / 2), sr = Math.sin(ypr.roll / 2);
  out[0] = cy * cp * cr + sy * sp * sr;
  out[1] = cy * cp * sr - sy * sp * cr;
  out[2] = cy * sp * cr + sy * cp * sr;
  out[3] = sy * cp * cr - cy * sp * sr;
  return out;
}

/** Row-major rotation matrix Rz(yaw)·Ry(pitch)·Rx(roll) (rad). */
export function yprToMatrix(ypr: YawPitchRoll, out: Mat3 = new Array<number>(9)): Mat3 {
  const cy = Math.cos(ypr.yaw), sy = Math.sin(ypr.yaw);
  const cp = Math.cos(ypr.pitch), sp = Math.sin(ypr.pitch);
  const cr = Math.cos(ypr.roll), sr = Math.sin(ypr.roll);
  out[0] = cy * cp; out[1] = cy * sp * sr - sy * cr; out[2] = cy * sp * cr + sy * sr;
  out[3] = sy * cp; out[4] = sy * sp * sr + cy * cr; out[5] = sy * sp * cr - cy * sr;
  out[6] = -sp; out[7] = cp * sr; out[8] = cp * cr;
  return out;
}
