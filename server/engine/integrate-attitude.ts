/**
 * Attitude integration: q̇ = ½ q ⊗ (0, ω) with ω = −I_lock⁻¹h, by odex (adaptive extrapolation),
 * piece by piece at step boundaries (joint rates may jump there), with dense output at requested times.
 */
import type { BodyModel } from '../../shared/kinematics/body-model.ts';
import { bodyRate, createMomentumWork, type MomentumWork, restrictToPiece } from './locked-momentum.ts';
import { evalMoving, evalPiece, type MotionPlan } from './joint-motion.ts';
import { odex } from './odex-solver.ts';
import { mergeRigidSegments } from './rigid-merge.ts';

/** Integrator settings. */
export interface IntegratorOptions {
  /** Relative tolerance (default 1e-10). */
  rtol: number;
  /** Absolute tolerance on quaternion components (default = rtol). */
  atol: number;
  /** Max steps per piece. */
  maxSteps?: number;
}

/** Integrator statistics. */
export interface IntegratorStats {
  rhsEvaluations: number;
  steps: number;
  rejectedSteps: number;
  pieces: number;
}

/** Result of integrating a plan. */
export interface AttitudeTrack {
  /** Final attitude [w,x,y,z], unit (not yet sign-canonical). */
  final: Float64Array;
  /** Attitude at each requested time, 4 per time ([w,x,y,z], renormalised), from dense output. */
  outputs: Float64Array;
  stats: IntegratorStats;
}

/** Builds the right-hand side for one piece; `counter.n` counts evaluations (odex undercounts dense calls). */
export function attitudeRhs(model: BodyModel, work: MomentumWork, piece: MotionPlan['pieces'][number], counter: { n: number }) {
  const q = new Float64Array(model.dofCount);
  const qd = new Float64Array(model.dofCount);
  // The dofs at rest keep the values the first evaluation writes.
  let first = true;
  return (t: number, y: number[]): number[] => {
    counter.n++;
    // Segments at rest over the piece are posed once (the work may be shared between pieces).
    if (work.piece !== piece) restrictToPiece(model, piece, work);
    if (first) { evalPiece(piece, t, q, qd); first = false; } else evalMoving(piece, t, q, qd);
    const w = bodyRate(model, q, qd, work);
    const wx = w[0], wy = w[1], wz = w[2];
    // q̇ = ½ q ⊗ (0, ω): ω is in the body (root) frame.
    return [
      0.5 * (-y[1] * wx - y[2] * wy - y[3] * wz),
      0.5 * (y[0] * wx + y[2] * wz - y[3] * wy),
      0.5 * (y[0] * wy - y[1] * wz + y[3] * wx),
      0.5 * (y[0] * wz + y[1] * wy - y[2] * wx),
    ];
  };
}

/**
 * Integrates the attitude over the plan from identity. `pieceTimes[p]` lists ascending times (s)
 * inside piece p at which the attitude is wanted; results fill `outputs` in the same overall order.
 */
export function integrateAttitude(
  model: BodyModel, plan: MotionPlan, opts: IntegratorOptions, pieceTimes: readonly ArrayLike<number>[],
): AttitudeTrack {
  // The right-hand side sees dof-less segments folded into their parents (the same I_lock and h).
  const rhsModel = mergeRigidSegments(model);
  const work = createMomentumWork(rhsModel);
  const total = pieceTimes.reduce((s, a) => s + a.length, 0);
  const outputs = new Float64Array(4 * total);
  const counter = { n: 0 };
  const stats: IntegratorStats = { rhsEvaluations: 0, steps: 0, rejectedSteps: 0, pieces: plan.pieces.length };
  let y = [1, 0, 0, 0];
  let o = 0;
  /** Appends one attitude, renormalised. */
  function record(w: number, x: number, yy: number, z: number): void {
    const n = Math.hypot(w, x, yy, z);
    outputs[o++] = w / n; outputs[o++] = x / n; outputs[o++] = yy / n; outputs[o++] = z / n;
  }
  plan.pieces.forEach((piece, p) => {
    const times = pieceTimes[p] ?? [];
    let next = 0;
    const solver = new odex.Solver(4);
    solver.relativeTolerance = opts.rtol;
    solver.absoluteTolerance = opts.atol;
    solver.denseOutput = true;
    solver.maxSteps = opts.maxSteps ?? 100_000;
    const f = attitudeRhs(rhsModel, work, piece, counter);
    const res = solver.solve(f, piece.t0, y, piece.t1, (nr, _xOld, x, yy, dense) => {
      // The first call is the initial point (no step yet, no interpolant).
      if (nr === 1) { while (next < times.length && times[next] <= x) { record(yy[0], yy[1], yy[2], yy[3]); next++; } return; }
      while (next < times.length && times[next] <= x) { const t = times[next++]; record(dense(0, t), dense(1, t), dense(2, t), dense(3, t)); }
    });
    if (res.outcome !== odex.Outcome.Converged) {
      throw new Error(`integrator did not converge in step ${piece.step} (outcome ${odex.Outcome[res.outcome]} after ${res.nStep} steps)`);
    }
    // Times past the last accepted step (rounding at the piece end) take the end value.
    while (next < times.length) { record(res.y[0], res.y[1], res.y[2], res.y[3]); next++; }
    stats.steps += res.nAccept;
    stats.rejectedSteps += res.nReject;
    // Carry the renormalised end state into the next piece.
    const n = Math.hypot(res.y[0], res.y[1], res.y[2], res.y[3]);
    y = [res.y[0] / n, res.y[1] / n, res.y[2] / n, res.y[3] / n];
  });
  stats.rhsEvaluations = counter.n;
  return { final: Float64Array.from(y), outputs, stats };
}
