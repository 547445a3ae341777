/**
 * The samples a trainee plays, read from the verification report stored with the version — never a
 * new simulation — so what is rehearsed is what the reviewer approved, under the engine version the
 * approval binds to. The report keeps the attitude as yaw/pitch/roll (degrees, 1e-6° resolution) and
 * the moving joints at its own rate; the still joints sit at their final angle throughout.
 */
import type { VerificationReport } from '../../shared/contracts/maneuver.ts';
import type { SimulationResult } from '../../shared/contracts/result.ts';
import { yprToQuat } from '../../shared/math/euler-zyx.ts';

type Samples = SimulationResult['samples'];
type Frame = Samples['frames'][number];

const RAD = Math.PI / 180;

/** A stored report whose samples cannot be read back (names the field). */
export class UnreadableResultError extends Error {}

/**
 * The verified samples at the report's own rate, joint angles in `dofs` order (the body's). Throws
 * UnreadableResultError when a series is short or a dof has neither a series nor a final angle.
 */
export function verifiedSamples(report: VerificationReport, dofs: readonly string[]): Samples {
  const s = report.series;
  const n = s.t.length;
  if (n === 0) throw new UnreadableResultError('report.series.t is empty');
  for (const [name, series] of [['yawDeg', s.yawDeg], ['pitchDeg', s.pitchDeg], ['rollDeg', s.rollDeg]] as const) {
    if (series.length !== n) throw new UnreadableResultError(`report.series.${name} has ${series.length} values for ${n} sample times`);
  }
  const columns = dofs.map((dof) => {
    const series = s.jointsDeg[dof];
    if (series) {
      if (series.length !== n) throw new UnreadableResultError(`report.series.jointsDeg.${dof} has ${series.length} values for ${n} sample times`);
      return series;
    }
    const still = report.final.jointsDeg[dof];
    if (typeof still !== 'number') throw new UnreadableResultError(`report.final.jointsDeg.${dof} is missing`);
    return null;
  });
  const frames: Frame[] = new Array<Frame>(n);
  for (let k = 0; k < n; k++) {
    const q = yprToQuat({ yaw: s.yawDeg[k] * RAD, pitch: s.pitchDeg[k] * RAD, roll: s.rollDeg[k] * RAD });
    frames[k] = {
      t: s.t[k],
      attitude: { w: q[0], x: q[1], y: q[2], z: q[3] },
      jointsDeg: columns.map((c, d) => (c ? c[k] : report.final.jointsDeg[dofs[d]])),
    };
  }
  return { rateHz: s.rateHz, dofs: [...dofs], frames };
}

/** Spherical linear interpolation between unit quaternions, the short way. */
function slerp(a: Frame['attitude'], b: Frame['attitude'], u: number): Frame['attitude'] {
  let { w, x, y, z } = b;
  let dot = a.w * w + a.x * x + a.y * y + a.z * z;
  if (dot < 0) {
    w = -w; x = -x; y = -y; z = -z; dot = -dot;
  }
  let ka = 1 - u, kb = u;
  if (dot < 1 - 1e-12) {
    const theta = Math.acos(Math.min(1, dot));
    const sin = Math.sin(theta);
    ka = Math.sin((1 - u) * theta) / sin;
    kb = Math.sin(u * theta) / sin;
  }
  const r = { w: ka * a.w + kb * w, x: ka * a.x + kb * x, y: ka * a.y + kb * y, z: ka * a.z + kb * z };
  const norm = Math.hypot(r.w, r.x, r.y, r.z);
  return { w: r.w / norm, x: r.x / norm, y: r.y / norm, z: r.z / norm };
}

/**
 * The verified samples at another rate, derived from them as the 3D view plays them (attitude by
 * slerp, joints linearly between neighbouring verified samples); first at 0, last at the end.
 * The same samples when `rateHz` is their own rate.
 */
export function resampleVerified(samples: Samples, rateHz: number): Samples {
  const frames = samples.frames;
  if (rateHz === samples.rateHz || frames.length < 2) return samples;
  const duration = frames[frames.length - 1].t;
  const times: number[] = [];
  const count = Math.floor(duration * rateHz + 1e-9);
  for (let k = 0; k <= count; k++) times.push(Math.min(duration, k / rateHz));
  if (duration - times[times.length - 1] > 1e-12) times.push(duration);
  let j = 0;
  const out = times.map((t): Frame => {
    while (j < frames.length - 2 && frames[j + 1].t <= t) j++;
    const a = frames[j], b = frames[j + 1];
    const u = b.t > a.t ? Math.min(1, Math.max(0, (t - a.t) / (b.t - a.t))) : 0;
    if (u === 0) return { ...a, t };
    if (u === 1) return { ...b, t };
    return { t, attitude: slerp(a.attitude, b.attitude, u), jointsDeg: a.jointsDeg.map((v, d) => v + u * (b.jointsDeg[d] - v)) };
  });
  return { rateHz, dofs: samples.dofs, frames: out };
}
