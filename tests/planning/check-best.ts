/**
 * The check every planner test applies to a best candidate, outside the planner: its composer steps
 * compiled by the composer's compiler and run by the engine at full (verification) accuracy land
 * within the tolerance of the target quaternion, with no range violation and the peak joint rate
 * under the limit; its `sequence` is what the compiler makes; the final attitude re-integrated by a
 * general-purpose solver (odex, Gragg–Bulirsch–Stoer extrapolation: tests/engine/odex-reference.ts),
 * which shares only ω(t) with the engine, lands there too.
 */
import { expect } from 'vitest';

import { compileMotion } from '../../server/engine/joint-motion.ts';
import { simulate } from '../../server/engine/simulate.ts';
import { targetQuat } from '../../server/maneuvers/target-attitude.ts';
import { planManeuver } from '../../server/planning/plan-maneuver.ts';
import type { Body } from '../../shared/contracts/body.ts';
import { type SequenceTarget,sequenceTargetSchema } from '../../shared/contracts/maneuver.ts';
import { planRequestSchema } from '../../shared/contracts/plan.ts';
import { compileBody } from '../../shared/kinematics/body-model.ts';
import { quatAngleBetween } from '../../shared/math/quaternion.ts';
import { compilePrimitives, dofInfoFromBody } from '../../shared/primitives/compile-primitives.ts';
import { primitiveListSchema } from '../../shared/primitives/primitive-schemas.ts';
import { odexFinalAttitude } from '../engine/odex-reference.ts';

const settings = planRequestSchema.parse({ samples: 10, maxCandidates: 2 });
const DEG = 180 / Math.PI;
/** Floating-point slack of a sampled joint angle at a range end (a blend back to 0° can land at −3e-15°), degrees. */
const ROUNDOFF_DEG = 1e-9;

/** A yaw/pitch/roll target with a 2° tolerance (rate limit and budget default). */
export const ypr = (yaw: number, pitch: number, roll: number) => sequenceTargetSchema.parse({ mode: 'ypr', yprDeg: { yaw, pitch, roll }, toleranceDeg: 2 });

/** Plans `target` on `body` and checks the best candidate as above; returns it. */
export function checkBest(body: Body, target: SequenceTarget) {
  const { candidates } = planManeuver({ body, target, settings });
  expect(candidates.length).toBeGreaterThan(0);
  expect(candidates.map((c) => c.rank)).toEqual(candidates.map((_c, i) => i + 1));
  const best = candidates[0];
  expect(best.withinTolerance).toBe(true);
  expect(best.withinRateLimit).toBe(true);
  expect(best.rangeViolations).toEqual([]);
  expect(best.detour).toBe(false);
  expect(primitiveListSchema.safeParse(best.primitives).success).toBe(true);
  // Compiled and simulated independently of the planner's composition of cycles.
  const compiled = compilePrimitives(best.primitives, dofInfoFromBody(body));
  expect(compiled.errors).toEqual([]);
  expect(compiled.sequence).toEqual(best.sequence);
  const r = simulate(body, compiled.sequence, { rateHz: 5 });
  const a = r.final.attitude;
  const error = quatAngleBetween([a.w, a.x, a.y, a.z], targetQuat(target)) * DEG;
  expect(error).toBeLessThan(target.toleranceDeg);
  expect(error).toBeCloseTo(best.errorDeg, 4);
  expect(r.peakJointRateDegS.max).toBeLessThanOrEqual(target.rateLimitDegS);
  expect(r.rangeViolations).toEqual([]);
  const model = compileBody(body);
  const independent = odexFinalAttitude(model, compileMotion(model, compiled.sequence), 1e-10).q;
  expect(quatAngleBetween(independent, targetQuat(target)) * DEG).toBeLessThan(target.toleranceDeg);
  expect(quatAngleBetween(independent, [a.w, a.x, a.y, a.z])).toBeLessThan(1e-6);
  // Every moving dof keeps the planner's margin inside its range.
  const ranges = new Map(dofInfoFromBody(body).map((d) => [d.name, d]));
  r.samples.frames.forEach((f) => f.jointsDeg.forEach((v, k) => {
    const d = ranges.get(r.samples.dofs[k])!;
    expect(v).toBeGreaterThanOrEqual(d.min - ROUNDOFF_DEG);
    expect(v).toBeLessThanOrEqual(d.max + ROUNDOFF_DEG);
  }));
  return best;
}

