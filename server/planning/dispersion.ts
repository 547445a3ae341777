/**
 * Dispersion run: Monte Carlo over the uncertainty of the body (segment masses and lengths) and of
 * the person executing the steps (amplitude, period and joint-timing errors). Every factor is drawn
 * uniformly within ±its spread from a seeded generator, so a fixed seed reproduces the figures; the
 * draws are unit numbers scaled by the spreads, so wider spreads move the same samples further.
 */
import type { Body } from '../../shared/contracts/body.ts';
import type { DispersionResult, DispersionSpreads } from '../../shared/contracts/plan.ts';
import type { Sequence } from '../../shared/contracts/sequence.ts';
import type { Quat } from '../../shared/math/quaternion.ts';
import { evaluateSequence } from './evaluate-steps.ts';
import { perturbBody } from './perturb-body.ts';
import { perturbSequence } from './perturb-sequence.ts';
import { seededRandom, symmetricUnit } from '../../shared/math/seeded-random.ts';

/** Inputs of one dispersion run. */
export interface DispersionInputs {
  body: Body;
  /** The nominal engine sequence (compiled steps). */
  sequence: Sequence;
  /** Target attitude [w,x,y,z]. */
  target: Quat;
  toleranceDeg: number;
  samples: number;
  seed: number;
  spreads: DispersionSpreads;
}

/** Quantile by linear interpolation between order statistics (R's and NumPy's default, "type 7"). */
export function quantile(sorted: readonly number[], p: number): number {
  if (!sorted.length) return NaN;
  const h = (sorted.length - 1) * p;
  const lo = Math.floor(h), hi = Math.ceil(h);
  return sorted[lo] + (h - lo) * (sorted[hi] - sorted[lo]);
}

/** The final attitude errors of every sample, degrees, in sample order. */
export function dispersionErrors(inputs: DispersionInputs): number[] {
  const { body, sequence, target, spreads } = inputs;
  const random = seededRandom(inputs.seed);
  const errors: number[] = [];
  for (let s = 0; s < inputs.samples; s++) {
    // Draw in a fixed order (segments, then sweeps by dof) so the stream does not depend on the spreads.
    const scales = body.segments.map(() => ({ mass: symmetricUnit(random) * spreads.massPct / 100, length: symmetricUnit(random) * spreads.lengthPct / 100 }));
    const varied = perturbSequence(sequence, (_k, dofs) => ({
      amplitude: symmetricUnit(random) * spreads.amplitudePct / 100,
      period: symmetricUnit(random) * spreads.periodPct / 100,
      phaseDeg: Object.fromEntries(dofs.map((d) => [d, symmetricUnit(random) * spreads.phaseDeg])),
    }));
    errors.push(evaluateSequence(perturbBody(body, scales), varied, target).errorDeg);
  }
  return errors;
}

/** Runs the samples and summarises them. */
export function runDispersion(inputs: DispersionInputs): DispersionResult {
  const errors = dispersionErrors(inputs);
  const sorted = [...errors].sort((a, b) => a - b);
  return {
    samples: inputs.samples,
    seed: inputs.seed,
    spreads: inputs.spreads,
    medianErrorDeg: quantile(sorted, 0.5),
    p95ErrorDeg: quantile(sorted, 0.95),
    maxErrorDeg: sorted[sorted.length - 1],
    withinToleranceFraction: errors.filter((e) => e <= inputs.toleranceDeg).length / errors.length,
  };
}
