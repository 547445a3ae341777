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

/** A growable list of times (s) reused across the dofs and pieces of one check (no array per dof). */
class TimeList {
  data = new Float64Array(64);
  length = 0;
  push(t: number): void {
    if (this.length === this.data.length) { const d = new Float64Array(2 * this.length); d.set(this.data); this.data = d; }
    this.data[this.length++] = t;
  }
}

/** Appends the times inside [t0, t1] where a harmonic dof reaches sin(arg) = ±1 (angle extrema) or cos(arg) = ±1 (rate extrema) to `out`. */
function harmonicCriticalTimes(piece: MotionPiece, j: number, base: number, out: TimeList): void {
  const { omega, hPhase, t0, t1 } = piece;
  const start = out.length;
  // arg = ω(t − t0) + φ = base + kπ.
  const kStart = Math.ceil((hPhase[j] - base) / Math.PI - 1e-12);
  for (let k = kStart; ; k++) {
    const t = t0 + (base + k * Math.PI - hPhase[j]) / omega;
    if (t > t1) break;
    if (t >= t0) out.push(t);
    if (out.length - start > 1e6) break;
  }
}

/** Appends the real roots of b + 2c·u + 3d·u² (a track cubic's rate: angle extrema) inside (0, span), ascending, as times from t0, to `out`. */
function trackExtremumTimes(piece: MotionPiece, j: number, out: TimeList): void {
  const b = piece.tCoeffs[4 * j + 1], c = piece.tCoeffs[4 * j + 2], d = piece.tCoeffs[4 * j + 3];
  const span = piece.t1 - piece.t0;
  let r0 = NaN, r1 = NaN;
  if (Math.abs(d) < 1e-300) { if (c !== 0) r0 = -b / (2 * c); } else {
    const disc = 4 * c * c - 12 * d * b;
    if (disc >= 0) { const r = Math.sqrt(disc); r0 = (-2 * c - r) / (6 * d); r1 = (-2 * c + r) / (6 * d); }
  }
  if (r1 < r0) { const x = r0; r0 = r1; r1 = x; }
  if (r0 > 0 && r0 < span) out.push(piece.t0 + r0);
  if (r1 > 0 && r1 < span) out.push(piece.t0 + r1);
}

/** Range violations of every dof over the plan. */
export function findRangeViolations(model: BodyModel, plan: MotionPlan): RangeViolation[] {
  const out: RangeViolation[] = [];
  // A track step is one piece per frame interval: a violation running across intervals is one violation.
  const lastOf = new Map<string, RangeViolation>();
  // One set of buffers for every dof: the scan grid, the analytic extrema, their merge, the angles there.
  const grid = new TimeList(), extrema = new TimeList(), merged = new TimeList();
  let angles = new Float64Array(256);
  // No closures inside the loops: a transpiler that keeps function names (tsx) would wrap each one.
  for (const piece of plan.pieces) {
    const span = piece.t1 - piece.t0;
    const cycles = piece.kind === 'harmonic' ? Math.ceil((span * piece.omega) / (2 * Math.PI)) : 1;
    for (let k = 0; k < model.dofCount; k++) {
      // hj: the dof's index among the harmonic dofs, or (for a track interval) among the tracked dofs.
      const hj = piece.kind === 'harmonic' ? piece.hDofs.indexOf(k) : piece.kind === 'track' ? piece.tDofs.indexOf(k) : -1;
      const moving = hj >= 0 || (piece.kind === 'move' && piece.to[k] !== piece.from[k]);
      if (!moving) {
        // A still dof keeps its angle over the piece: beyond a limit from t0 to t1 or not at all.
        for (let b = 0; b < 2; b++) {
          const bound = b === 0 ? 'max' : 'min';
          const limit = bound === 'max' ? model.dofMax[k] : model.dofMin[k];
          const g = bound === 'max' ? piece.from[k] - limit : limit - piece.from[k];
          if (g > 0) addViolation(out, lastOf, violation(model, piece, k, bound, limit, piece.t0, piece.t1, piece.t0, g));
        }
        continue;
      }
      // A move (monotone between its ends) or a sweep (offset ± amplitude) that stays clear of both
      // limits by more than rounding can reach has nothing for the scan to find: skipped (the planner
      // and robustness runs check thousands of such dofs).
      if (clearOfLimits(piece, k, hj, model.dofMin[k], model.dofMax[k])) continue;
      // Scan grid (a move is monotone: a coarse grid finds every crossing; a track interval is one
      // cubic) plus the analytic extrema of a harmonic or tracked dof.
      const n = piece.kind !== 'harmonic' ? (piece.kind === 'track' ? 4 : 16) : Math.min(20_000, SCAN_POINTS * Math.max(1, cycles));
      grid.length = 0;
      for (let s = 0; s <= n; s++) grid.push(piece.t0 + (span * s) / n);
      let times = grid;
      if (hj >= 0) {
        extrema.length = 0;
        if (piece.kind === 'track') trackExtremumTimes(piece, hj, extrema); else harmonicCriticalTimes(piece, hj, Math.PI / 2, extrema);
        mergeSorted(grid, extrema, merged);
        times = merged;
      }
      const T = times.data, count = times.length;
      // The angles once for both bounds (beyond() below is the same difference).
      if (angles.length < count) angles = new Float64Array(2 * count);
      for (let i = 0; i < count; i++) angles[i] = dofAngle(piece, k, hj, T[i]);
      for (let b = 0; b < 2; b++) {
        const bound = b === 0 ? 'max' : 'min';
        const limit = bound === 'max' ? model.dofMax[k] : model.dofMin[k];
        // g > 0 means beyond the limit.
        let inside = false, from = 0, worstT = 0, worstG = 0;
        let prevT = T[0];
        for (let i = 0; i < count; i++) {
          const t = T[i];
          const gt = bound === 'max' ? angles[i] - limit : limit - angles[i];
          if (gt > 0 && !inside) { inside = true; from = t === T[0] ? t : crossing(piece, k, hj, bound, limit, prevT, t); worstT = t; worstG = gt; }
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

/** Margin (rad) by which a dof's analytic range must clear a limit for the scan to be skipped: far above rounding (≈1e-15 rad). */
const CLEAR_MARGIN = 1e-9;

/**
 * True when dof k's angle over a move or harmonic piece provably stays inside [min, max] with
 * CLEAR_MARGIN to spare: a minimum-jerk move lies between its two ends, a sweep within offset ± |amplitude|.
 */
function clearOfLimits(piece: MotionPiece, k: number, hj: number, min: number, max: number): boolean {
  let lo: number, hi: number;
  if (piece.kind === 'move') {
    const a = piece.from[k], b = piece.to[k];
    lo = Math.min(a, b); hi = Math.max(a, b);
  } else if (piece.kind === 'harmonic' && hj >= 0) {
    const c = piece.hOffset[hj], r = Math.abs(piece.hAmplitude[hj]);
    lo = c - r; hi = c + r;
  } else return false;
  return hi - max < -CLEAR_MARGIN && min - lo < -CLEAR_MARGIN;
}

/** The union of two ascending lists into `out`, ascending (a merge: both are already sorted). */
function mergeSorted(a: TimeList, b: TimeList, out: TimeList): void {
  const A = a.data, B = b.data, na = a.length, nb = b.length;
  out.length = 0;
  let i = 0, j = 0;
  while (i < na && j < nb) out.push(A[i] <= B[j] ? A[i++] : B[j++]);
  while (i < na) out.push(A[i++]);
  while (j < nb) out.push(B[j++]);
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
  const q = new Float64Array(model.dofCount), qd = new Float64Array(model.dofCount), candidates = new TimeList();
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
      for (let j = 0; j < piece.hDofs.length; j++) {
        const k = piece.hDofs[j];
        // Candidates: the ends and every cos(arg) = ±1 inside.
        candidates.length = 0;
        candidates.push(piece.t0); candidates.push(piece.t1);
        harmonicCriticalTimes(piece, j, 0, candidates);
        for (let c = 0; c < candidates.length; c++) {
          const t = candidates.data[c];
          evalPiece(piece, t, q, qd);
          consider(k, Math.abs(qd[k]) * DEG, t);
        }
      }
    }
  }
  return { max, dof, time, byDof };
}
