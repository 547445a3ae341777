/**
 * pathDeg, the rotation travelled (∫|ω| dt): a direct plan travels less than a detour to the same
 * attitude, the planner's best candidate takes the short way round (DECISIONS.md: no detour means
 * travelled ≤ target angle + 90°), and the chord sum converges as the sample rate grows (it is a
 * lower bound of the integral; by the triangle inequality it is never below the net rotation).
 */
import { describe, expect, it } from 'vitest';

import { simulate } from '../../server/engine/simulate.ts';
import { candidatePrimitives } from '../../server/planning/candidate-steps.ts';
import { compileForBody } from '../../server/planning/evaluate-steps.ts';
import { perCycleRotation } from '../../server/planning/per-cycle-rotation.ts';
import { fitFamilies } from '../../server/planning/plan-families.ts';
import { planManeuver } from '../../server/planning/plan-maneuver.ts';
import { quatAngle } from '../../server/planning/rotation-vector.ts';
import { sequenceTargetSchema } from '../../shared/contracts/maneuver.ts';
import { planRequestSchema } from '../../shared/contracts/plan.ts';
import { quatAngleBetween } from '../../shared/math/quaternion.ts';
import { demoBody } from './planner-bodies.ts';

const body = demoBody('reed', 1);
const { families } = fitFamilies(body, 180);
const left = families.find((f) => f.id === 'hanging_arm_circles_in')!;
const right = families.find((f) => f.id === 'hanging_arm_circles_out')!;
const DEG = 180 / Math.PI;

describe('rotation travelled', () => {
  it('a direct quarter turn travels less than the three-quarter turn the other way to the same attitude', () => {
    // Per-cycle yaw of about 5° each way; sizes matched so both end near the same attitude.
    const size = 12;
    const perLeft = quatAngle(perCycleRotation(body, left, size, 180)) * DEG;
    const n = Math.round(90 / perLeft);
    const direct = simulate(body, compileForBody(body, candidatePrimitives([{ family: left, size, cycles: n }], 180)), { rateHz: 30 });
    const perRight = quatAngle(perCycleRotation(body, right, size, 180)) * DEG;
    const m = Math.round((360 - n * perLeft) / perRight);
    const detour = simulate(body, compileForBody(body, candidatePrimitives([{ family: right, size, cycles: m }], 180)), { rateHz: 30 });
    const q = (r: typeof direct) => [r.final.attitude.w, r.final.attitude.x, r.final.attitude.y, r.final.attitude.z];
    expect(quatAngleBetween(q(direct), q(detour)) * DEG).toBeLessThan(perRight);
    expect(direct.pathDeg).toBeGreaterThanOrEqual(direct.final.rotation.angleDeg);
    expect(detour.pathDeg).toBeGreaterThan(2 * direct.pathDeg);
  }, 60_000);

  it('the chord sum converges as the sample rate grows', () => {
    const seq = compileForBody(body, candidatePrimitives([{ family: left, size: 12, cycles: 3 }], 180));
    const a = simulate(body, seq, { rateHz: 60 }).pathDeg, b = simulate(body, seq, { rateHz: 240 }).pathDeg;
    expect(b).toBeGreaterThanOrEqual(a);
    expect((b - a) / b).toBeLessThan(1e-3);
  }, 60_000);

  it('the planner reports a 180° yaw without a detour, its path at least the target angle', () => {
    const target = sequenceTargetSchema.parse({ mode: 'ypr', yprDeg: { yaw: 180, pitch: 0, roll: 0 } });
    const best = planManeuver({ body, target, settings: planRequestSchema.parse({ samples: 10, maxCandidates: 2 }), skipRobustness: true }).candidates[0];
    expect(best.detour).toBe(false);
    expect(best.netPathDeg).toBeLessThanOrEqual(180 + 90);
    expect(best.netPathDeg).toBeGreaterThanOrEqual(179);
    expect(best.pathDeg).toBeGreaterThanOrEqual(best.netPathDeg - 1);
  }, 120_000);
});
