/**
 * The dispersion run: reproducible with a fixed seed, and its spread follows the input spreads.
 * With every spread at zero each sample is the nominal run, so every error equals the nominal
 * error; the 95th percentile uses the interpolated quantile of Hyndman & Fan 1996 ("Sample
 * quantiles in statistical packages", definition 7, R's and NumPy's default).
 */
import { describe, expect, it } from 'vitest';

import { targetQuat } from '../../server/maneuvers/target-attitude.ts';
import { deriveBody } from '../../server/model/derive-body.ts';
import { candidatePrimitives } from '../../server/planning/candidate-steps.ts';
import { dispersionErrors, quantile, runDispersion } from '../../server/planning/dispersion.ts';
import { compileForBody, evaluateSequence } from '../../server/planning/evaluate-steps.ts';
import { planFamily } from '../../server/planning/plan-families.ts';
import { sequenceTargetSchema } from '../../shared/contracts/maneuver.ts';
import { dispersionSpreadsSchema } from '../../shared/contracts/plan.ts';

const body = deriveBody({ sex: 'female', stature: 1.65, mass: 60 }).body;
const target = targetQuat(sequenceTargetSchema.parse({ mode: 'ypr', yprDeg: { yaw: 60, pitch: 0, roll: 0 } }));
const sequence = compileForBody(body, candidatePrimitives([
  { family: planFamily('hip_swirl_right'), amplitudes: [18], cycles: 3 },
  { family: planFamily('arm_orbit_outward'), amplitudes: [20], cycles: 2 },
], 180));
const spreads = dispersionSpreadsSchema.parse({});
const inputs = { body, sequence, target, toleranceDeg: 2, samples: 40, seed: 7, spreads };

describe('dispersion', () => {
  it('is reproducible with a fixed seed and changes with the seed', () => {
    const a = runDispersion(inputs);
    const b = runDispersion(inputs);
    expect(b).toEqual(a);
    const c = runDispersion({ ...inputs, seed: 8 });
    expect(c.p95ErrorDeg).not.toBe(a.p95ErrorDeg);
    expect(a.p95ErrorDeg).toBeGreaterThanOrEqual(a.medianErrorDeg);
    expect(a.maxErrorDeg).toBeGreaterThanOrEqual(a.p95ErrorDeg);
  });

  it('with zero spreads every sample is the nominal run', () => {
    const zero = dispersionSpreadsSchema.parse({ massPct: 0, lengthPct: 0, amplitudePct: 0, periodPct: 0, phaseDeg: 0 });
    const nominal = evaluateSequence(body, sequence, target).errorDeg;
    for (const e of dispersionErrors({ ...inputs, samples: 5, spreads: zero })) expect(e).toBeCloseTo(nominal, 6);
  });

  it('the 95th percentile grows when the spreads grow', () => {
    const p95 = (k: number) => runDispersion({ ...inputs, spreads: {
      massPct: spreads.massPct * k, lengthPct: spreads.lengthPct * k, amplitudePct: spreads.amplitudePct * k, periodPct: spreads.periodPct * k, phaseDeg: spreads.phaseDeg * k,
    } }).p95ErrorDeg;
    const small = p95(0.25), base = p95(1), wide = p95(2);
    expect(base).toBeGreaterThan(small);
    expect(wide).toBeGreaterThan(base);
  });

  it('quantile interpolates between order statistics (Hyndman & Fan 1996, definition 7)', () => {
    // numpy.percentile([1, 2, 3, 4], 95) = 3.85 (worked by hand: h = 3·0.95 = 2.85 → 3 + 0.85·1).
    expect(quantile([1, 2, 3, 4], 0.95)).toBeCloseTo(3.85, 12);
    expect(quantile([5], 0.5)).toBe(5);
  });
});
