/**
 * The robustness run's per-sample model, split-safe: `robustnessSamples(inputs, from, to)` computes
 * samples [from, to) and `summariseRobustness` merges any set of them. Sample i draws from its own
 * stream seeded by (seed, i), so one thread, chunks and worker processes give identical figures.
 *
 * The feedback execution model belongs to the planner (issue 10); until it lands, the feedback
 * figure equals the open-loop one.
 */
import type { Body } from '../../shared/contracts/body.ts';
import type { RobustnessModel } from '../../shared/contracts/robustness.ts';
import type { Sequence } from '../../shared/contracts/sequence.ts';
import type { Quat } from '../../shared/math/quaternion.ts';
import { seededRandom, symmetricUnit } from '../../shared/math/seeded-random.ts';
import { quantile } from './dispersion.ts';
import { evaluateSequence } from './evaluate-steps.ts';
import { perturbBody } from './perturb-body.ts';
import { perturbSequence } from './perturb-sequence.ts';

/** What one robustness run needs. */
export interface RobustnessInputs {
  body: Body;
  /** The nominal compiled sequence. */
  sequence: Sequence;
  /** Target attitude [w,x,y,z]. */
  target: Quat;
  toleranceDeg: number;
  seed: number;
  model: RobustnessModel;
}

/** Final attitude error of one sample in each execution model, degrees. */
export interface RobustnessSample {
  index: number;
  openLoopErrorDeg: number;
  feedbackErrorDeg: number;
}

/** A 32-bit seed for sample i of a run seeded `seed` (splitmix-style mixing, so neighbours differ). */
export function sampleSeed(seed: number, index: number): number {
  let z = (Math.imul(seed >>> 0, 0x9e3779b1) ^ Math.imul(index + 1, 0x85ebca6b)) >>> 0;
  z = Math.imul(z ^ (z >>> 16), 0x7feb352d) >>> 0;
  z = Math.imul(z ^ (z >>> 15), 0x846ca68b) >>> 0;
  return (z ^ (z >>> 16)) >>> 0;
}

/** One sample's perturbed body and sequence (open-loop execution). */
export function perturbedCase(inputs: RobustnessInputs, index: number): { body: Body; sequence: Sequence; random: () => number } {
  const { body, sequence, model } = inputs;
  const spreads = model.spreads;
  const random = seededRandom(sampleSeed(inputs.seed, index));
  const scales = body.segments.map(() => ({ mass: symmetricUnit(random) * spreads.massPct / 100, length: symmetricUnit(random) * spreads.lengthPct / 100 }));
  const varied = perturbSequence(sequence, (_k, dofs) => ({
    amplitude: symmetricUnit(random) * spreads.amplitudePct / 100,
    period: symmetricUnit(random) * spreads.periodPct / 100,
    phaseDeg: Object.fromEntries(dofs.map((d) => [d, symmetricUnit(random) * spreads.phaseDeg])),
  }));
  return { body: perturbBody(body, scales), sequence: varied, random };
}

/** Samples [from, to) in order. */
export function robustnessSamples(inputs: RobustnessInputs, from: number, to: number): RobustnessSample[] {
  const out: RobustnessSample[] = [];
  for (let i = from; i < to; i++) {
    const c = perturbedCase(inputs, i);
    const openLoop = evaluateSequence(c.body, c.sequence, inputs.target).errorDeg;
    out.push({ index: i, openLoopErrorDeg: openLoop, feedbackErrorDeg: openLoop });
  }
  return out;
}

/** The figures of a complete set of samples (any order, any split). */
export interface RobustnessFigures {
  openLoopP95Deg: number;
  feedbackP95Deg: number;
  p50Deg: number;
  withinToleranceShare: number;
  samples: number;
  /** Final error with feedback of every sample, degrees, in sample order (for the histogram). */
  feedbackErrorsDeg: number[];
}

export function summariseRobustness(samples: readonly RobustnessSample[], toleranceDeg: number): RobustnessFigures {
  const ordered = [...samples].sort((a, b) => a.index - b.index);
  const open = ordered.map((s) => s.openLoopErrorDeg).sort((a, b) => a - b);
  const fb = ordered.map((s) => s.feedbackErrorDeg);
  const fbSorted = [...fb].sort((a, b) => a - b);
  return {
    openLoopP95Deg: quantile(open, 0.95),
    feedbackP95Deg: quantile(fbSorted, 0.95),
    p50Deg: quantile(fbSorted, 0.5),
    withinToleranceShare: fb.filter((e) => e <= toleranceDeg).length / Math.max(1, fb.length),
    samples: ordered.length,
    feedbackErrorsDeg: fb,
  };
}
