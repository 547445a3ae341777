/**
 * The independent cross-check: the same right-hand side q̇ = ½ q ⊗ (0, ω) integrated by a
 * general-purpose adaptive ODE solver (odex: Gragg–Bulirsch–Stoer extrapolation, E. Hairer's
 * ODEX ported to JavaScript), piece by piece, renormalised between pieces. It shares only ω(t)
 * with the engine, not the Magnus stepping, error control or interpolation.
 */
import { attitudeRhs } from '../../server/engine/integrate-attitude.ts';
import type { MotionPlan } from '../../server/engine/joint-motion.ts';
import { createMomentumWork } from '../../server/engine/locked-momentum.ts';
import { mergeRigidSegments } from '../../server/engine/rigid-merge.ts';
import type { BodyModel } from '../../shared/kinematics/body-model.ts';
import { odex } from './odex-solver.ts';

/** Final attitude [w,x,y,z] (unit) and odex's evaluation count, at relative and absolute tolerance `tol`. */
export function odexFinalAttitude(model: BodyModel, plan: MotionPlan, tol: number): { q: number[]; evaluations: number } {
  const rhsModel = mergeRigidSegments(model);
  const work = createMomentumWork(rhsModel);
  const counter = { n: 0 };
  let y = [1, 0, 0, 0];
  for (const piece of plan.pieces) {
    const solver = new odex.Solver(4);
    solver.relativeTolerance = tol;
    solver.absoluteTolerance = tol;
    solver.maxSteps = 1_000_000;
    const res = solver.solve(attitudeRhs(rhsModel, work, piece, counter), piece.t0, y, piece.t1);
    if (res.outcome !== odex.Outcome.Converged) throw new Error(`odex did not converge in step ${piece.step}`);
    const n = Math.hypot(res.y[0], res.y[1], res.y[2], res.y[3]);
    y = res.y.map((v) => v / n);
  }
  return { q: y, evaluations: counter.n };
}

/** Attitudes [w,x,y,z] (unit) at ascending times (each inside the plan), from odex's dense output at tolerance `tol`. */
export function odexAttitudesAt(model: BodyModel, plan: MotionPlan, tol: number, times: readonly number[]): number[][] {
  const rhsModel = mergeRigidSegments(model);
  const work = createMomentumWork(rhsModel);
  const counter = { n: 0 };
  const out: number[][] = [];
  let y = [1, 0, 0, 0];
  let next = 0;
  for (const piece of plan.pieces) {
    const solver = new odex.Solver(4);
    solver.relativeTolerance = tol;
    solver.absoluteTolerance = tol;
    solver.maxSteps = 1_000_000;
    solver.denseOutput = true;
    const res = solver.solve(attitudeRhs(rhsModel, work, piece, counter), piece.t0, y, piece.t1, (nr, _x0, x, _y, dense) => {
      if (nr === 1) return;
      while (next < times.length && times[next] <= x) {
        const t = times[next++];
        const q = [0, 1, 2, 3].map((c) => dense(c, t));
        const n = Math.hypot(q[0], q[1], q[2], q[3]);
        out.push(q.map((v) => v / n));
      }
    });
    if (res.outcome !== odex.Outcome.Converged) throw new Error(`odex did not converge in step ${piece.step}`);
    const n = Math.hypot(res.y[0], res.y[1], res.y[2], res.y[3]);
    y = res.y.map((v) => v / n);
  }
  return out;
}
