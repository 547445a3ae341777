/**
 * Reads a sequence's stored target as an attitude quaternion for the view's target ghost.
 * Accepted shapes (degrees): `{ yaw, pitch, roll }`, `{ yprDeg: { yaw, pitch, roll } }`,
 * `{ axis: [x,y,z], angleDeg }` (also nested under `axisAngle`), or a quaternion `{ w, x, y, z }`.
 */
import type { Attitude } from '../../shared/contracts/result.ts';
import { yprToQuat } from '../../shared/math/euler-zyx.ts';
import { quatCanonical, quatFromAxisAngle, quatNormalize } from '../../shared/math/quaternion.ts';

const DEG = Math.PI / 180;
const isNum = (v: unknown): v is number => typeof v === 'number' && Number.isFinite(v);
const isObj = (v: unknown): v is Record<string, unknown> => typeof v === 'object' && v !== null && !Array.isArray(v);

function toAttitude(q: ArrayLike<number>): Attitude {
  const c = quatCanonical(quatNormalize([q[0], q[1], q[2], q[3]]));
  return { w: c[0], x: c[1], y: c[2], z: c[3] };
}

/** The target as a unit attitude (w ≥ 0), or null when its shape is not one of the accepted ones. */
export function targetAttitude(target: unknown): Attitude | null {
  if (!isObj(target)) return null;
  const ypr = isObj(target.yprDeg) ? target.yprDeg : target;
  if (isNum(ypr.yaw) || isNum(ypr.pitch) || isNum(ypr.roll)) {
    const get = (k: string) => (isNum(ypr[k]) ? (ypr[k]) : 0);
    return toAttitude(yprToQuat({ yaw: get('yaw') * DEG, pitch: get('pitch') * DEG, roll: get('roll') * DEG }));
  }
  const aa = isObj(target.axisAngle) ? target.axisAngle : target;
  const axis = aa.axis;
  if (Array.isArray(axis) && axis.length === 3 && axis.every(isNum) && isNum(aa.angleDeg) && Math.hypot(...(axis)) > 0) {
    return toAttitude(quatFromAxisAngle(axis, (aa.angleDeg) * DEG));
  }
  if (isNum(target.w) && isNum(target.x) && isNum(target.y) && isNum(target.z)) {
    const n = Math.hypot(target.w, target.x, target.y, target.z);
    if (n > 0) return toAttitude([target.w, target.x, target.y, target.z]);
  }
  return null;
}

/** The target in words for lists, e.g. "yaw 90°, pitch 0°, roll 0°"; "—" when unreadable. */
export function targetLabel(target: unknown): string {
  if (!isObj(target)) return '—';
  const ypr = isObj(target.yprDeg) ? target.yprDeg : target;
  if (isNum(ypr.yaw) || isNum(ypr.pitch) || isNum(ypr.roll)) {
    const f = (k: string) => `${k} ${Math.round((isNum(ypr[k]) ? (ypr[k]) : 0) * 10) / 10}°`;
    return [f('yaw'), f('pitch'), f('roll')].join(', ');
  }
  const aa = isObj(target.axisAngle) ? target.axisAngle : target;
  if (Array.isArray(aa.axis) && isNum(aa.angleDeg)) {
    return `${Math.round(aa.angleDeg * 10) / 10}° about [${(aa.axis as unknown[]).map((v) => (isNum(v) ? Math.round(v * 100) / 100 : '?')).join(', ')}]`;
  }
  return '—';
}
