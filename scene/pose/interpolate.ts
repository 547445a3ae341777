/**
 * Playback between samples: attitude by spherical linear interpolation (slerp, Shoemake 1985),
 * joint angles linearly. Allocation-free: results go into caller-owned arrays.
 */
import type { MotionTrack } from './motion-track';

/** Index k of the sample interval [times[k], times[k+1]] holding t (clamped to the first/last interval). */
export function sampleIndexAt(times: Float64Array, t: number): number {
  const n = times.length;
  if (n < 2 || t <= times[0]) return 0;
  if (t >= times[n - 1]) return n - 2;
  let lo = 0, hi = n - 1;
  // Invariant: times[lo] ≤ t < times[hi].
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (times[mid] <= t) lo = mid; else hi = mid;
  }
  return lo;
}

/** Below this |sin θ| the two quaternions are treated as equal and blended linearly. */
const SLERP_LINEAR_BELOW = 1e-6;

/**
 * out = slerp(a, b, u) for unit quaternions [w,x,y,z] read at offsets ao, bo; takes the short way
 * (flips b when a·b < 0), renormalises. u = 0 gives a, u = 1 gives b (up to sign).
 */
export function slerpInto(a: ArrayLike<number>, ao: number, b: ArrayLike<number>, bo: number, u: number, out: Float64Array | number[], oo = 0): void {
  let bw = b[bo], bx = b[bo + 1], by = b[bo + 2], bz = b[bo + 3];
  const aw = a[ao], ax = a[ao + 1], ay = a[ao + 2], az = a[ao + 3];
  let dot = aw * bw + ax * bx + ay * by + az * bz;
  if (dot < 0) { dot = -dot; bw = -bw; bx = -bx; by = -by; bz = -bz; }
  let ka: number, kb: number;
  const theta = Math.acos(Math.min(1, dot));
  const s = Math.sin(theta);
  if (s < SLERP_LINEAR_BELOW) { ka = 1 - u; kb = u; } else { ka = Math.sin((1 - u) * theta) / s; kb = Math.sin(u * theta) / s; }
  let w = ka * aw + kb * bw, x = ka * ax + kb * bx, y = ka * ay + kb * by, z = ka * az + kb * bz;
  const n = Math.hypot(w, x, y, z);
  w /= n; x /= n; y /= n; z /= n;
  out[oo] = w; out[oo + 1] = x; out[oo + 2] = y; out[oo + 3] = z;
}

/**
 * The interpolated state at time t (s, clamped to [0, duration]): attitude [w,x,y,z] into `attitude`,
 * joint angles (rad, model dof order) into `q`. Exactly the sample values at sample times.
 */
export function trackStateAt(track: MotionTrack, t: number, attitude: Float64Array, q: Float64Array): void {
  const { times, attitudes, joints, dofCount: nd } = track;
  if (track.count === 1) {
    for (let c = 0; c < 4; c++) attitude[c] = attitudes[c];
    for (let d = 0; d < nd; d++) q[d] = joints[d];
    return;
  }
  const k = sampleIndexAt(times, t);
  const t0 = times[k], t1 = times[k + 1];
  const u = Math.min(1, Math.max(0, t1 > t0 ? (t - t0) / (t1 - t0) : 0));
  if (u === 0 || u === 1) {
    // Sample times: copy the sample exactly (no rounding from the blend).
    const s = u === 0 ? k : k + 1;
    for (let c = 0; c < 4; c++) attitude[c] = attitudes[4 * s + c];
    for (let d = 0; d < nd; d++) q[d] = joints[nd * s + d];
    return;
  }
  slerpInto(attitudes, 4 * k, attitudes, 4 * (k + 1), u, attitude, 0);
  for (let d = 0; d < nd; d++) q[d] = joints[nd * k + d] + u * (joints[nd * (k + 1) + d] - joints[nd * k + d]);
}
