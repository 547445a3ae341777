/**
 * The planner reaches standard targets on the demo crew's cabin-clothed and suited bodies within
 * the tolerance, every joint range and the rate limit. Each best candidate is checked again outside
 * the planner: its composer steps compiled by the composer's compiler and run by the engine at its
 * full (verification) accuracy must land within the tolerance of the target quaternion, with no
 * range violation and the peak joint rate under the limit; its `sequence` is what the compiler makes.
 * The final attitude is also re-integrated by a general-purpose solver (odex, Gragg–Bulirsch–Stoer
 * extrapolation: tests/engine/odex-reference.ts), which shares only ω(t) with the engine.
 */
import { describe, expect, it } from 'vitest';

import { compileMotion } from '../../server/engine/joint-motion.ts';
import { simulate } from '../../server/engine/simulate.ts';
import { targetQuat } from '../../server/maneuvers/target-attitude.ts';
import { planManeuver } from '../../server/planning/plan-maneuver.ts';
import { sequenceTargetSchema, type SequenceTarget } from '../../shared/contracts/maneuver.ts';
import type { Body } from '../../shared/contracts/body.ts';
import { planRequestSchema } from '../../shared/contracts/plan.ts';
import { quatAngleBetween } from '../../shared/math/quaternion.ts';
import { compilePrimitives, dofInfoFromBody } from '../../shared/primitives/compile-primitives.ts';
import { compileBody } from '../../shared/kinematics/body-model.ts';
import { primitiveListSchema } from '../../shared/primitives/primitive-schemas.ts';
import { odexFinalAttitude } from '../engine/odex-reference.ts';
import { demoBody } from './planner-bodies.ts';

const settings = planRequestSchema.parse({ samples: 10, maxCandidates: 2 });
const DEG = 180 / Math.PI;
const ypr = (yaw: number, pitch: number, roll: number) => sequenceTargetSchema.parse({ mode: 'ypr', yprDeg: { yaw, pitch, roll }, toleranceDeg: 2 });

function checkBest(body: Body, target: SequenceTarget) {
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
    expect(v).toBeGreaterThanOrEqual(d.min);
    expect(v).toBeLessThanOrEqual(d.max);
  }));
  return best;
}

describe('planner on the suited demo crew member (pressurised suit)', () => {
  const suited = demoBody('kettle');
  it('reaches a 180° yaw (half turn)', () => { checkBest(suited, ypr(180, 0, 0)); }, 120_000);
  it('reaches a 3-axis target (yaw 60, pitch 30, roll 20)', () => { checkBest(suited, ypr(60, 30, 20)); }, 120_000);
  it('reaches a 90° pitch', () => { checkBest(suited, ypr(0, 90, 0)); }, 120_000);
});

describe('planner on a cabin-clothed demo crew member', () => {
  const cabin = demoBody('reed', 1);
  it('reaches a 90° yaw (quarter turn)', () => { checkBest(cabin, ypr(90, 0, 0)); }, 120_000);
  it('reaches a 3-axis target (yaw −45, pitch 20, roll −30)', () => { checkBest(cabin, ypr(-45, 20, -30)); }, 120_000);
  it('reaches a 45° roll given as axis and angle', () => {
    checkBest(cabin, sequenceTargetSchema.parse({ mode: 'axis_angle', axisAngle: { axis: [1, 0, 0], angleDeg: 45 }, toleranceDeg: 2 }));
  }, 120_000);
});

describe('targets the planner cannot reach', () => {
  it('says which sweep breaks which joint range when none fits the body', () => {
    // Hips and knees held within ±4°, shoulder abduction within 0…4°: no leg sweep and no arm circle fits.
    const body = demoBody('reed', 1);
    const narrowed = {
      ...body,
      segments: body.segments.map((s) => (s.joint ? { ...s, joint: { ...s.joint, dofs: s.joint.dofs.map((d) => (
        /hip_|knee/.test(d.name) ? { ...d, min: -4, max: 4 } : /sh_abd/.test(d.name) ? { ...d, min: 0, max: 4 } : d)) } } : s)),
    };
    const { candidates, notes } = planManeuver({ body: narrowed, target: ypr(0, 60, 0), settings, skipRobustness: true });
    expect(candidates).toEqual([]);
    const text = notes.join(' ');
    expect(text).toMatch(/leg pedal not used: .*hip_flex would go/);
    expect(text).toMatch(/forward arm circles not used: .*sh_abd would go above 1°/);
    expect(text).toMatch(/No sweep fits this body's joint ranges/);
  }, 60_000);
});
