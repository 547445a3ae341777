/**
 * The planner reaches pure yaw and pure pitch targets on a standard male body (1.75 m, 75 kg) within
 * the sequence's tolerance, rate limit and joint ranges. Each best candidate is checked again
 * outside the planner: its steps compiled by the composer's compiler and run by the engine at its
 * default (verification) accuracy must land within the tolerance of the target quaternion.
 */
import { describe, expect, it } from 'vitest';

import { simulate } from '../../server/engine/simulate.ts';
import { targetQuat } from '../../server/maneuvers/target-attitude.ts';
import { deriveBody } from '../../server/model/derive-body.ts';
import { planManeuver } from '../../server/planning/plan-maneuver.ts';
import { sequenceTargetSchema, type SequenceTarget } from '../../shared/contracts/maneuver.ts';
import { planRequestSchema } from '../../shared/contracts/plan.ts';
import { quatAngleBetween } from '../../shared/math/quaternion.ts';
import { compilePrimitives, dofInfoFromBody } from '../../shared/primitives/compile-primitives.ts';
import { primitiveListSchema } from '../../shared/primitives/primitive-schemas.ts';

const body = deriveBody({ sex: 'male', stature: 1.75, mass: 75 }).body;
const settings = planRequestSchema.parse({ samples: 20, maxCandidates: 3 });
const DEG = 180 / Math.PI;

function checkBest(target: SequenceTarget) {
  const candidates = planManeuver({ body, target, settings });
  expect(candidates.length).toBeGreaterThan(0);
  expect(candidates.map((c) => c.rank)).toEqual(candidates.map((_c, i) => i + 1));
  const best = candidates[0];
  expect(best.withinTolerance).toBe(true);
  expect(best.withinRateLimit).toBe(true);
  expect(best.rangeViolationCount).toBe(0);
  expect(best.errorDeg).toBeLessThan(target.toleranceDeg);
  // The steps are valid composer primitives…
  expect(primitiveListSchema.safeParse(best.primitives).success).toBe(true);
  // …and, compiled and simulated independently of the planner, reach the target.
  const compiled = compilePrimitives(best.primitives, dofInfoFromBody(body));
  expect(compiled.errors).toEqual([]);
  const r = simulate(body, compiled.sequence, { rateHz: 5 });
  const a = r.final.attitude;
  const error = quatAngleBetween([a.w, a.x, a.y, a.z], targetQuat(target)) * DEG;
  expect(error).toBeLessThan(target.toleranceDeg);
  expect(error).toBeCloseTo(best.errorDeg, 4);
  expect(r.peakJointRateDegS.max).toBeLessThanOrEqual(target.rateLimitDegS);
  expect(r.rangeViolations).toEqual([]);
  return best;
}

describe('planner on a standard male body', () => {
  it('reaches a pure 90° yaw within tolerance', () => {
    const best = checkBest(sequenceTargetSchema.parse({ mode: 'ypr', yprDeg: { yaw: 90, pitch: 0, roll: 0 }, toleranceDeg: 2 }));
    // Only the hip swirl turns the body about its long axis among the planner's families.
    expect(best.families.some((f) => f.startsWith('hip_swirl'))).toBe(true);
  }, 120_000);

  it('reaches a pure 30° pitch within tolerance', () => {
    checkBest(sequenceTargetSchema.parse({ mode: 'ypr', yprDeg: { yaw: 0, pitch: 30, roll: 0 }, toleranceDeg: 2 }));
  }, 120_000);

  it('reaches an axis-angle target about the left–right axis with a tight tolerance', () => {
    checkBest(sequenceTargetSchema.parse({ mode: 'axis_angle', axisAngle: { axis: [0, 1, 0], angleDeg: 20 }, toleranceDeg: 0.5 }));
  }, 120_000);
});
