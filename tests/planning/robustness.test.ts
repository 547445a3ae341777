/**
 * The robustness run: reproducible by seed however it is split (DECISIONS.md), its composition of
 * per-step pieces agrees with simulating each perturbed sample whole, the feedback model lowers the
 * 95th percentile of a many-cycle plan, and the 95th percentile uses the interpolated quantile of
 * Hyndman & Fan 1996 ("Sample quantiles in statistical packages", definition 7, R's and NumPy's
 * default).
 */
import { describe, expect, it } from 'vitest';

import { candidatePrimitives } from '../../server/planning/candidate-steps.ts';
import { compileForBody, evaluateSequence } from '../../server/planning/evaluate-steps.ts';
import { fitFamilies } from '../../server/planning/plan-families.ts';
import { quantile } from '../../server/planning/quantile.ts';
import { perturbedCase, phaseErrors, robustnessSamples, summariseRobustness } from '../../server/planning/robustness.ts';
import { DEFAULT_ROBUSTNESS_MODEL } from '../../shared/contracts/robustness.ts';
import { seededRandom } from '../../shared/math/seeded-random.ts';
import { demoBody } from './planner-bodies.ts';

const body = demoBody('reed', 1);
const { families } = fitFamilies(body, 180);
const family = (id: string) => families.find((f) => f.id === id)!;
// About a half turn in many cycles of about 5°, then a few trim cycles of about 2°.
const sequence = compileForBody(body, candidatePrimitives([
  { family: family('hanging_arm_circles_in'), size: 10, cycles: 30 },
  { family: family('hanging_arm_circles_in'), size: 6, cycles: 4 },
], 180));
const nominal = evaluateSequence(body, sequence, [1, 0, 0, 0]).result.final.attitude;
const target = [nominal.w, nominal.x, nominal.y, nominal.z];
const inputs = { body, sequence, target, toleranceDeg: 2, seed: 11, model: DEFAULT_ROBUSTNESS_MODEL };

describe('robustness run', () => {
  const all = robustnessSamples(inputs, 0, 40);

  it('is reproducible by seed, and identical when run in chunks in any order', () => {
    expect(robustnessSamples(inputs, 0, 40)).toEqual(all);
    const chunks = [...robustnessSamples(inputs, 25, 40), ...robustnessSamples(inputs, 0, 10), ...robustnessSamples(inputs, 10, 25)];
    expect(summariseRobustness(chunks, 2)).toEqual(summariseRobustness(all, 2));
    const other = robustnessSamples({ ...inputs, seed: 12 }, 0, 40);
    expect(summariseRobustness(other, 2).openLoopP95Deg).not.toBe(summariseRobustness(all, 2).openLoopP95Deg);
  }, 120_000);

  it('composes each open-loop sample from pieces as simulating the perturbed sample whole does (within 1e-5°)', () => {
    for (const i of [0, 7]) {
      const c = perturbedCase(inputs, i);
      const whole = evaluateSequence(c.body, c.sequence, target, { rtol: 1e-10, rateHz: 1, skipAudit: true }).errorDeg;
      expect(all[i].openLoopErrorDeg).toBeCloseTo(whole, 5);
    }
  }, 120_000);

  it('feedback (stopping or adding cycles from the perceived attitude) lowers the 95th percentile', () => {
    const s = summariseRobustness(all, 2);
    expect(s.openLoopP95Deg).toBeGreaterThan(6);
    expect(s.feedbackP95Deg).toBeLessThan(s.openLoopP95Deg / 2);
  });

  it('with zero spreads, no perception error and no delay the feedback run lands where the plan does', () => {
    const zero = { ...DEFAULT_ROBUSTNESS_MODEL, perceptionErrorDeg: 0, reactionDelayS: 0, spreads: { massPct: 0, lengthPct: 0, amplitudePct: 0, periodPct: 0, phaseDeg: 0, pairedLimbs: 'together' as const } };
    for (const s of robustnessSamples({ ...inputs, model: zero }, 0, 3)) {
      expect(s.openLoopErrorDeg).toBeLessThan(1e-4);
      expect(s.feedbackErrorDeg).toBeLessThan(1e-4);
    }
  }, 60_000);

  it('paired limbs moving together share one phase error per joint; independent limbs each draw their own', () => {
    const dofs = ['l_sh_flex', 'l_sh_abd', 'r_sh_flex', 'r_sh_abd', 'waist_rot'];
    const spreads = DEFAULT_ROBUSTNESS_MODEL.spreads;
    const together = phaseErrors(dofs, { ...spreads, pairedLimbs: 'together' }, seededRandom(5));
    const apart = phaseErrors(dofs, { ...spreads, pairedLimbs: 'independent' }, seededRandom(5));
    expect(together.r_sh_flex).toBe(together.l_sh_flex);
    expect(together.r_sh_abd).toBe(together.l_sh_abd);
    expect(together.l_sh_abd).not.toBe(together.l_sh_flex);
    // Same draws in the same order: the first side and unpaired dofs are identical in both models.
    for (const d of ['l_sh_flex', 'l_sh_abd', 'waist_rot']) expect(apart[d]).toBe(together[d]);
    expect(apart.r_sh_flex).not.toBe(apart.l_sh_flex);
    for (const v of Object.values(apart)) expect(Math.abs(v)).toBeLessThanOrEqual(spreads.phaseDeg);
  });

  it('mirrored forward arm circles (a pitch plan) drift about other axes when the arms fall out of step, not when they move together', () => {
    const pitch = compileForBody(body, candidatePrimitives([
      { family: family('forward_arm_circles_out'), size: 25, cycles: 12 },
      { family: family('forward_arm_circles_out'), size: 10, cycles: 4 },
    ], 180));
    const end = evaluateSequence(body, pitch, [1, 0, 0, 0]).result.final.attitude;
    const base = { ...inputs, sequence: pitch, target: [end.w, end.x, end.y, end.z] };
    const run = (pairedLimbs: 'together' | 'independent') => summariseRobustness(robustnessSamples({ ...base, model: { ...DEFAULT_ROBUSTNESS_MODEL, spreads: { ...DEFAULT_ROBUSTNESS_MODEL.spreads, pairedLimbs } } }, 0, 40), 2);
    const together = run('together'), apart = run('independent');
    expect(DEFAULT_ROBUSTNESS_MODEL.spreads.pairedLimbs).toBe('together');
    expect(apart.feedbackP95Deg).toBeGreaterThan(1.5 * together.feedbackP95Deg);
  }, 120_000);

  it('quantile interpolates between order statistics (Hyndman & Fan 1996, definition 7)', () => {
    expect(quantile([1, 2, 3, 4], 0.5)).toBeCloseTo(2.5, 12);
    expect(quantile([1, 2, 3, 4], 0.95)).toBeCloseTo(3.85, 12);
    expect(quantile([5], 0.5)).toBe(5);
  });
});
