/**
 * The planner reaches standard targets on the demo crew's cabin-clothed and suited bodies within
 * the tolerance, every joint range and the rate limit; each best candidate is checked again outside
 * the planner (tests/planning/check-best.ts: compiled, simulated at full accuracy and re-integrated
 * by odex).
 */
import { describe, expect, it } from 'vitest';

import { targetQuat } from '../../server/maneuvers/target-attitude.ts';
import { missedLimits, planManeuver } from '../../server/planning/plan-maneuver.ts';
import { PlanUnreachableError, runPlannerThread } from '../../server/planning/run-planner-thread.ts';
import { sequenceTargetSchema } from '../../shared/contracts/maneuver.ts';
import { type PlanCandidate,planRequestSchema } from '../../shared/contracts/plan.ts';
import { quatMultiply } from '../../shared/math/quaternion.ts';
import { checkBest, ypr } from './check-best.ts';
import { demoBody } from './planner-bodies.ts';

const settings = planRequestSchema.parse({ samples: 10, maxCandidates: 2 });

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

describe('time budget', () => {
  it('meets a budget that plans ending every phase in a trim cannot, with one that trims only its last phase', () => {
    const suited = demoBody('kettle');
    const open = planManeuver({ body: suited, target: ypr(180, 0, 0), settings, skipRobustness: true }).candidates[0];
    // The budget lies under the unbudgeted best plan, so only the shorter fallback can meet it.
    const budget = 44;
    expect(open.durationS).toBeGreaterThan(budget);
    const { candidates } = planManeuver({ body: suited, target: { ...ypr(180, 0, 0), timeBudgetS: budget }, settings, skipRobustness: true });
    const best = candidates[0];
    expect(best.withinTimeBudget && best.withinTolerance && best.withinRateLimit && best.rangeViolationCount === 0).toBe(true);
    expect(best.durationS).toBeLessThanOrEqual(budget);
  }, 120_000);
});

describe('targets the planner cannot reach', () => {
  // Hips and knees held within ±4°, shoulder abduction within 0…4°: no leg sweep and no arm circle fits.
  const body = demoBody('reed', 1);
  const narrowed = {
    ...body,
    segments: body.segments.map((s) => (s.joint ? { ...s, joint: { ...s.joint, dofs: s.joint.dofs.map((d) => (
      /hip_|knee/.test(d.name) ? { ...d, min: -4, max: 4 } : /sh_abd/.test(d.name) ? { ...d, min: 0, max: 4 } : d)) } } : s)),
  };

  it('the planning thread (what the job runs) rejects with the same notes, which the job stores for the screen', async () => {
    const err: unknown = await runPlannerThread({ body: narrowed, target: ypr(0, 60, 0), settings }, () => {}).catch((e: unknown) => e);
    expect(err).toBeInstanceOf(PlanUnreachableError);
    const notes = (err as PlanUnreachableError).notes;
    expect(notes.join(' ')).toMatch(/forward arm circles not used: .*sh_abd would go above 1°/);
  }, 60_000);

  it('names the limits the best candidate misses and the axis its error lies about', () => {
    const target = ypr(30, 0, 0);
    const goal = targetQuat(target);
    // 5° short about roll: final = goal · (5° about x).
    const h = (5 * Math.PI) / 360;
    const [w, x, y, z] = quatMultiply(goal, [Math.cos(h), Math.sin(h), 0, 0], [0, 0, 0, 0]);
    const c = {
      final: { attitude: { w, x, y, z } }, errorDeg: 5, withinTolerance: false, rangeViolationCount: 1,
      rangeViolations: [{ dof: 'r_sh_abd', step: 0, bound: 'max', limitDeg: 4 }], withinRateLimit: false, peakJointRateDegS: 200.4,
      withinTimeBudget: false, durationS: 95,
    } as unknown as PlanCandidate;
    const words = missedLimits(c, { ...target, timeBudgetS: 60 }, goal).join('; ');
    expect(words).toContain('misses the target by 5.0° (tolerance 2°), mostly about roll (x)');
    expect(words).toContain('r_sh_abd past its max 4°');
    expect(words).toContain('peak joint rate 200°/s over the 180°/s rate limit');
    expect(words).toContain('takes 95 s, over the 60 s time budget');
  });

  it('says which sweep breaks which joint range when none fits the body', () => {
    const { candidates, notes } = planManeuver({ body: narrowed, target: ypr(0, 60, 0), settings, skipRobustness: true });
    expect(candidates).toEqual([]);
    const text = notes.join(' ');
    expect(text).toMatch(/leg pedal not used: .*hip_flex would go/);
    expect(text).toMatch(/forward arm circles not used: .*sh_abd would go above 1°/);
    expect(text).toMatch(/No sweep fits this body's joint ranges/);
  }, 60_000);
});
