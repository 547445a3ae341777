/**
 * Range violations (angles beyond a dof's [min, max], with time and margin) and peak joint rates,
 * from the analytic joint motion: scan points plus the analytic extrema, crossings refined by bisection.
 */
import type { RangeViolation } from '../../shared/contracts/result.ts';
import type { BodyModel } from '../../shared/kinematics/body-model.ts';
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

/** Range violations of every dof over the plan. */
export function findRangeViolations(model: BodyModel, plan: MotionPlan): RangeViolation[] {
  const out: RangeViolation[] = [];
  // No closures inside the loops: a transpiler that keeps function names (tsx) would wrap each one.
  for (const piece of plan.pieces) {
    const span = piece.t1 - piece.t0;
    const cycles = piece.kind === 'harmonic' ? Math.ceil((span * piece.omega) / (2 * Math.PI)) : 1;
    for (let k = 0; k < model.dofCount; k++) {
      const hj = piece.kind === 'harmonic' ? piece.hDofs.indexOf(k) : -1;
      const moving = hj >= 0 || (piece.kind === 'move' && piece.to[k] !== piece.from[k]);
      // Scan grid (a still dof: its two ends; a move is monotone: a coarse grid finds every crossing)
      // plus the analytic extrema of a harmonic dof.
      const n = !moving ? 1 : hj < 0 ? 16 : Math.min(20_000, SCAN_POINTS * Math.max(1, cycles));
      const grid: number[] = [];
      for (let s = 0; s <= n; s++) grid.push(piece.t0 + (span * s) / n);
      const times = hj >= 0 ? mergeSorted(grid, harmonicCriticalTimes(piece, hj, Math.PI / 2)) : grid;
      for (let b = 0; b < 2; b++) {
        const bound = b === 0 ? 'max' : 'min';
        const limit = bound === 'max' ? model.dofMax[k] : model.dofMin[k];
        // g > 0 means beyond the limit.
        let inside = false, from = 0, worstT = 0, worstG = 0;
        let prevT = times[0];
        for (const t of times) {
          const gt = beyond(piece, k, hj, bound, limit, t);
          if (gt > 0 && !inside) { inside = true; from = t === times[0] ? t : crossing(piece, k, hj, bound, limit, prevT, t); worstT = t; worstG = gt; }
          else if (gt > 0 && gt > worstG) { worstT = t; worstG = gt; }
          else if (gt <= 0 && inside) {
            inside = false;
            out.push(violation(model, piece, k, bound, limit, from, crossing(piece, k, hj, bound, limit, prevT, t), worstT, worstG));
          }
          prevT = t;
        }
        if (inside) out.push(violation(model, piece, k, bound, limit, from, piece.t1, worstT, worstG));
      }
    }
  }
  return out;
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

/** Angle (rad) of dof k at time t in a piece; hj is its index among the harmonic dofs or −1. */
function dofAngle(piece: MotionPiece, k: number, hj: number, t: number): number {
  if (hj >= 0) return piece.hOffset[hj] + piece.hAmplitude[hj] * Math.sin(piece.omega * (t - piece.t0) + piece.hPhase[hj]);
  if (piece.kind !== 'move') return piece.from[k];
  const tau = Math.min(1, Math.max(0, (t - piece.t0) / (piece.t1 - piece.t0)));
  return piece.from[k] + (piece.to[k] - piece.from[k]) * tau * tau * tau * (10 - 15 * tau + 6 * tau * tau);
}

function violation(model: BodyModel, piece: MotionPiece, k: number, bound: 'min' | 'max', limit: number, from: number, to: number, worstT: number, worstG: number): RangeViolation {
  return {
    dof: model.dofNames[k], step: piece.step, bound, limitDeg: limit * DEG, from, to, worstTime: worstT,
    worstAngleDeg: (bound === 'max' ? limit + worstG : limit - worstG) * DEG, marginDeg: worstG * DEG,
  };
}

/** Peak |joint rate| per dof and overall (deg/s), analytic: minimum-jerk peak 1.875·|Δθ|/T at mid-move; harmonic |A|ω at cos = ±1. */
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
      for (let k = 0; k < model.dofCount; k++) consider(k, (1.875 * Math.abs(piece.to[k] - piece.from[k]) * DEG) / T, piece.t0 + T / 2);
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
