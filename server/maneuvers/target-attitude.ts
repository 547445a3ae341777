/**
 * A sequence target (shared/contracts/maneuver.ts) as the attitude it asks for: the
 * planner, verification, robustness runs, the player's target ghost and rehearsal captures read
 * targets here; its words are shared/product/target-words.ts.
 */
import type { SequenceTarget } from '../../shared/contracts/maneuver.ts';
import type { Attitude } from '../../shared/contracts/result.ts';
import { yprToQuat } from '../../shared/math/euler-zyx.ts';
import { type Quat, quatCanonical, quatFromAxisAngle } from '../../shared/math/quaternion.ts';

const RAD = Math.PI / 180;

/** Target reorientation [w,x,y,z] (body at t = 0 → target), w ≥ 0. */
export function targetQuat(target: SequenceTarget): Quat {
  const q = target.mode === 'ypr'
    ? yprToQuat({ yaw: target.yprDeg.yaw * RAD, pitch: target.yprDeg.pitch * RAD, roll: target.yprDeg.roll * RAD })
    : quatFromAxisAngle(target.axisAngle.axis, target.axisAngle.angleDeg * RAD);
  return quatCanonical(q);
}

/** The target as an attitude {w,x,y,z}, w ≥ 0 (the player's target ghost). */
export function targetAttitude(target: SequenceTarget): Attitude {
  const [w, x, y, z] = targetQuat(target);
  return { w, x, y, z };
}
