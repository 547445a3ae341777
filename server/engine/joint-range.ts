/**
 * Range violations (angles beyond a dof's [min, max], with time and margin) and peak joint rates,
 * from the analytic joint motion: scan points plus the analytic extrema, crossings refined by bisection.
 */
import type { RangeViolation } from '../../shared/contracts/result.ts';
import type { BodyModel } from '../../shared/kinematics/body-model.ts';
import { MINIMUM_JERK_PEAK_SLOPE, minimumJerk } from '../../shared/math/minimum-jerk.ts';
import { evalPiece, type MotionPiece, type MotionPlan } from './joint-motion.ts';

const DEG = 180 / Math.PI;
/** Scan points per piece (moves, holds) or per harmonic cycle. */
const SCAN_POINTS = 128;

/** Times inside [t0, t1] where a harmonic dof reaches sin(arg) = ±1 (angle extrema) or cos(arg) = ±1 (rate extrema). */
function harmonicCriticalTimes(piece: MotionPiece, j: number, base: number): number[] {
  const out: number[] = [];
  const { omega, hPhase, t0, t1 } = piece;
  // arg = ω(t − t0) + φ = base + kπ.
  const kStart = Math.ceil((hPhase[j] - base) / Math.PI - 1e-12);
  for (let k = kStart; ; k++) {
    const t = t0 + (base + k * Math.PI - hPhase[j]) / omega;
    if (t > t1) break;
    if (t >= t0) out.push(t);
    if (out.length > 1e6) break;
  }
  return out;
}

/** Real roots of b + 2c·u + 3d·u² (a track cubic's rate: angle extrema) inside [0, span], as times from t0. */
function trackExtremumTimes(piece: MotionPiece, j: number): number[] {
  const b = piece.tCoeffs[4 * j + 1], c = piece.tCoeffs[4 * j + 2], d = piece.tCoeffs[4 * j + 3];
  const span = piece.t1 - piece.t0;
  const roots: number[] = [];
  if (Math.abs(d) < 1e-300) { if (c !== 0) roots.push(-b / (2 * c)); } else {
    const disc = 4 * c * c - 12 * d * b;
    if (disc >= 0) { const r = Math.sqrt(disc); roots.push((-2 * c - r) / (6 * d), (-2 * c + r) / (6 * d)); }
  }
  return roots.filter((u) => u > 0 && u < span).sort((x, y) => x - y).map((u) => piece.t0 + u);
}

/** Range violations of every dof over the plan. */
export function findRangeViolations(model: BodyModel, plan: MotionPlan): RangeViolation[] {
  const out: RangeViolation[] = [];
  // A track step is one piece per frame interval: a violation running across intervals is one violation.
  const lastOf = new Map<string, RangeViolation>();
  let angles = new Float64Array(256);
  // No closures inside the loops: a transpiler that keeps function names (tsx) would wrap each one.
  for (const piece of plan.pieces) {
    const span = piece.t1 - piece.t0;
    const cycles = piece.kind === 'harmonic' ? Math.ceil((span * piece.omega) / (2 * Math.PI)) : 1;
    for (let k = 0; k < model.dofCount; k++) {
      // hj: the dof's index among the harmonic dofs, or (for a track interval) among the tracked dofs.
      const hj = piece.kind === 'harmonic' ? piece.hDofs.indexOf(k) : piece.kind === 'track' ? piece.tDofs.indexOf(k) : -1;
      const moving = hj >= 0 || (piece.kind === 'move' && piece.to[k] !== piece.from[k]);
      // Scan grid (a still dof: its two ends; a move is monotone: a coarse grid finds every crossing;
      // a track interval is one cubic) plus the analytic extrema of a harmonic or tracked dof.
      const n = !moving ? 1 : piece.kind !== 'harmonic' ? (piece.kind === 'track' ? 4 : 16) : Math.min(20_000, SCAN_POINTS * Math.max(1, cycles));
      const grid: number[] = [];
      for (let s = 0; s <= n; s++) grid.push(piece.t0 + (span * s) / n);
      const times = hj < 0 ? grid : mergeSorted(grid, piece.kind === 'track' ? trackExtremumTimes(piece, hj) : harmonicCriticalTimes(piece, hj, Math.PI / 2));
      // The angles once for both bounds (beyond() below is the same difference).
      if (angles.length < times.length) angles = new Float64Array(2 * times.length);
      for (let i = 0; i < times.length; i++) angles[i] = dofAngle(piece, k, hj, times[i]);
      for (let b = 0; b < 2; b++) {
        const bound = b === 0 ? 'max' : 'min';
        const limit = bound === 'max' ? model.dofMax[k] : model.dofMin[k];
        // g > 0 means beyond the limit.
        let inside = false, from = 0, worstT = 0, worstG = 0;
        let prevT = times[0];
        for (let i = 0; i < times.length; i++) {
          const t = times[i];
          const gt = bound === 'max' ? angles[i] - limit : limit - angles[i];
          if (gt > 0 && !inside) { inside = true; from = t === times[0] ? t : crossing(piece, k, hj, bound, limit, prevT, t); worstT = t; worstG = gt; }
          else if (gt > 0 && gt > worstG) { worstT = t; worstG = gt; }
          else if (gt <= 0 && inside) {
            inside = false;
            addViolation(out, lastOf, violation(model, piece, k, bound, limit, from, crossing(piece, k, hj, bound, limit, prevT, t), worstT, worstG));
          }
          prevT = t;
        }
        if (inside) addViolation(out, lastOf, violation(model, piece, k, bound, limit, from, piece.t1, worstT, worstG));
      }
    }
  }
  return out;
}

/** Appends a violation, or extends the same dof's, step's and bound's previous one when it ends where this one starts. */
function addViolation(out: RangeViolation[], lastOf: Map<string, RangeViolation>, v: RangeViolation): void {
  const key = `${v.dof}|${v.step}|${v.bound}`;
  const last = lastOf.get(key);
  if (last && Math.abs(last.to - v.from) < 1e-9) {
    last.to = v.to;
    if (v.marginDeg > last.marginDeg) { last.marginDeg = v.marginDeg; last.worstTime = v.worstTime; last.worstAngleDeg = v.worstAngleDeg; }
    return;
  }
  out.push(v);
  lastOf.set(key, v);
}

/** The union of two ascending lists, ascending (a merge: both are already sorted). */
function mergeSorted(a: number[], b: number[]): number[] {
  const out = new Array<number>(a.length + b.length);
  let i = 0, j = 0, o = 0;
  while (i < a.length && j < b.length) out[o++] = a[i] <= b[j] ? a[i++] : b[j++];
  while (i < a.length) out[o++] = a[i++];
  while (j < b.length) out[o++] = b[j++];
  return out;
}

/** How far dof k is beyond `limit` at time t (rad; > 0 means beyond, on the side of `bound`). */
function beyond(piece: MotionPiece, k: number, hj: number, bound: 'min' | 'max', limit: number, t: number): number {
  return bound === 'max' ? dofAngle(piece, k, hj, t) - limit : limit - dofAngle(piece, k, hj, t);
}

/** Bisection for the sign change of `beyond` between times a and b (s). */
function crossing(piece: MotionPiece, k: number, hj: number, bound: 'min' | 'max', limit: number, a: number, b: number): number {
  let ga = beyond(piece, k, hj, bound, limit, a);
  for (let it = 0; it < 60 && b - a > 1e-9; it++) {
    const m = (a + b) / 2, gm = beyond(piece, k, hj, bound, limit, m);
    if ((gm > 0) === (ga > 0)) { a = m; ga = gm; } else b = m;
  }
  return (a + b) / 2;
}

/** Angle (rad) of dof k at time t in a piece; hj is its index among the harmonic (or tracked) dofs or −1. */
function dofAngle(piece: MotionPiece, k: number, hj: number, t: number): number {
  if (hj >= 0 && piece.kind === 'track') {
    const c = piece.tCoeffs, u = Math.min(piece.t1 - piece.t0, Math.max(0, t - piece.t0));
    return c[4 * hj] + u * (c[4 * hj + 1] + u * (c[4 * hj + 2] + u * c[4 * hj + 3]));
  }
  if (hj >= 0) return piece.hOffset[hj] + piece.hAmplitude[hj] * Math.sin(piece.omega * (t - piece.t0) + piece.hPhase[hj]);
  if (piece.kind !== 'move') return piece.from[k];
  return piece.from[k] + (piece.to[k] - piece.from[k]) * minimumJerk((t - piece.t0) / (piece.t1 - piece.t0));
}

function violation(model: BodyModel, piece: MotionPiece, k: number, bound: 'min' | 'max', limit: number, from: number, to: number, worstT: number, worstG: number): RangeViolation {
  return {
    dof: model.dofNames[k], step: piece.step, bound, limitDeg: limit * DEG, from, to, worstTime: worstT,
    worstAngleDeg: (bound === 'max' ? limit + worstG : limit - worstG) * DEG, marginDeg: worstG * DEG,
  };
}

/**
 * Peak |joint rate| per dof and overall (deg/s), analytic: minimum-jerk peak 1.875·|Δθ|/T at mid-move;
 * harmonic |A|ω at cos = ±1; a track interval's quadratic rate at its ends and its vertex.
 */
export function peakJointRates(model: BodyModel, plan: MotionPlan): { max: number; dof: string | null; time: number; byDof: Record<string, number> } {
  const byDof: Record<string, number> = Object.fromEntries(model.dofNames.map((d) => [d, 0]));
  let max = 0, dof: string | null = null, time = 0;
  const consider = (k: number, rate: number, t: number) => {
    const name = model.dofNames[k];
    if (rate > byDof[name]) byDof[name] = rate;
    if (rate > max) { max = rate; dof = name; time = t; }
  };
  const q = new Float64Array(model.dofCount), qd = new Float64Array(model.dofCount);
  for (const piece of plan.pieces) {
    if (piece.kind === 'move') {
      const T = piece.t1 - piece.t0;
      for (let k = 0; k < model.dofCount; k++) consider(k, (MINIMUM_JERK_PEAK_SLOPE * Math.abs(piece.to[k] - piece.from[k]) * DEG) / T, piece.t0 + T / 2);
    } else if (piece.kind === 'track') {
      const span = piece.t1 - piece.t0;
      for (let j = 0; j < piece.tDofs.length; j++) {
        const b = piece.tCoeffs[4 * j + 1], c = piece.tCoeffs[4 * j + 2], d = piece.tCoeffs[4 * j + 3];
        // Rate b + 2cu + 3du²: its ends and, when inside, its vertex u = −c/(3d).
        const vertex = d !== 0 ? -c / (3 * d) : -1;
        consider(piece.tDofs[j], Math.abs(b) * DEG, piece.t0);
        consider(piece.tDofs[j], Math.abs(b + span * (2 * c + 3 * span * d)) * DEG, piece.t1);
        if (vertex > 0 && vertex < span) consider(piece.tDofs[j], Math.abs(b + vertex * (2 * c + 3 * vertex * d)) * DEG, piece.t0 + vertex);
      }
    } else if (piece.kind === 'harmonic') {
      piece.hDofs.forEach((k, j) => {
        // Candidates: the ends and every cos(arg) = ±1 inside.
        for (const t of [piece.t0, piece.t1, ...harmonicCriticalTimes(piece, j, 0)]) {
          evalPiece(piece, t, q, qd);
          consider(k, Math.abs(qd[k]) * DEG, t);
        }
      });
    }
  }
  return { max, dof, time, byDof };
}
