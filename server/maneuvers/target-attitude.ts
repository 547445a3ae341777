/** The target reorientation of a sequence as a unit quaternion [w,x,y,z] (body at t = 0 → target). */
import type { SequenceTarget } from '../../shared/contracts/maneuver.ts';
import { yprToQuat } from '../../shared/math/euler-zyx.ts';
import { type Quat, quatCanonical, quatFromAxisAngle } from '../../shared/math/quaternion.ts';

const RAD = Math.PI / 180;

/** Target attitude [w,x,y,z], w ≥ 0. */
export function targetQuat(target: SequenceTarget): Quat {
  const q = target.mode === 'ypr'
    ? yprToQuat({ yaw: target.yprDeg.yaw * RAD, pitch: target.yprDeg.pitch * RAD, roll: target.yprDeg.roll * RAD })
    : quatFromAxisAngle(target.axisAngle.axis, target.axisAngle.angleDeg * RAD);
  return quatCanonical(q);
}
