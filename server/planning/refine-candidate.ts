/**
 * Refinement: with the cycle counts fixed, fmin's Nelder–Mead adjusts the sweeps' amplitudes with
 * the full simulation in the loop, minimising the final attitude error plus penalties for range
 * violations, peak joint rate above the limit, amplitudes outside their schema bounds and time over
 * the budget. If the result misses the tolerance, neighbouring cycle counts (±1) are tried too.
 * Each start stops once the error is below STOP_FRACTION of the tolerance or its budget is spent.
 */
import type { Body } from '../../shared/contracts/body.ts';
import type { Quat } from '../../shared/math/quaternion.ts';
import { candidatePrimitives, type CandidatePart } from './candidate-steps.ts';
import { evaluateSteps, type StepsOutcome } from './evaluate-steps.ts';
import { nelderMead } from './nelder-mead.ts';

/** A start stops once the error is below this fraction of the tolerance (a margin for dispersion). */
export const STOP_FRACTION = 0.1;
/** Penalty weights: per degree of range violation, per deg/s over the rate limit, per degree outside bounds, per second over budget. */
const W_RANGE = 2, W_RATE = 0.1, W_BOUNDS = 10, W_BUDGET = 0.5;

/** Limits the refinement respects. */
export interface RefineLimits {
  toleranceDeg: number;
  rateLimitDegS: number;
  timeBudgetS: number | null;
  /** Full simulations allowed per start (the first start and each neighbour). */
  evaluationsPerStart: number;
}

/** A refined candidate. */
export interface Refined {
  parts: CandidatePart[];
  outcome: StepsOutcome;
  cost: number;
  evaluations: number;
}

/** Whether an outcome meets tolerance, ranges and rate limit. */
export function meetsLimits(o: StepsOutcome, limits: Pick<RefineLimits, 'toleranceDeg' | 'rateLimitDegS'>): boolean {
  return o.errorDeg <= limits.toleranceDeg && o.rangeViolationCount === 0 && o.peakRateDegS <= limits.rateLimitDegS + 1e-9;
}

function withAmplitudes(parts: readonly CandidatePart[], x: readonly number[]): { parts: CandidatePart[]; outside: number } {
  let k = 0, outside = 0;
  const out = parts.map((p) => {
    const amplitudes = p.family.params.map((spec) => {
      const v = x[k++];
      outside += Math.max(0, spec.min - v, v - spec.max);
      return Math.min(spec.max, Math.max(spec.min, v));
    });
    return { ...p, amplitudes };
  });
  return { parts: out, outside };
}

/** Refines one start (fixed cycle counts). */
function refineStart(body: Body, target: Quat, start: readonly CandidatePart[], limits: RefineLimits): Refined {
  let best: Refined | null = null;
  let evaluations = 0, done = false;
  const cost = (x: number[]): number => {
    if (done) return (best?.cost ?? 0) + 1; // budget spent or goal met: let the simplex wind down cheaply
    const { parts, outside } = withAmplitudes(start, x);
    const outcome = evaluateSteps(body, candidatePrimitives(parts, limits.rateLimitDegS), target);
    evaluations++;
    const over = limits.timeBudgetS === null ? 0 : Math.max(0, outcome.durationS - limits.timeBudgetS);
    const c = outcome.errorDeg + W_RANGE * outcome.violationDeg + W_RATE * Math.max(0, outcome.peakRateDegS - limits.rateLimitDegS)
      + W_BOUNDS * outside + W_BUDGET * over;
    if (!best || c < best.cost) best = { parts, outcome, cost: c, evaluations: 0 };
    if (evaluations >= limits.evaluationsPerStart
      || (best.outcome.errorDeg < STOP_FRACTION * limits.toleranceDeg && meetsLimits(best.outcome, limits) && over === 0)) done = true;
    return c;
  };
  const x0 = start.flatMap((p) => p.amplitudes);
  nelderMead(cost, x0, { nonZeroDelta: 1.15, maxIterations: 4 * limits.evaluationsPerStart });
  const b = best as Refined | null;
  if (!b) throw new Error('refinement evaluated nothing');
  return { ...b, evaluations };
}

/** Refines a seed, trying ±1 cycle on each part when the first start misses the limits. */
export function refineCandidate(body: Body, target: Quat, seed: readonly CandidatePart[], limits: RefineLimits): Refined {
  let best = refineStart(body, target, seed, limits);
  let evaluations = best.evaluations;
  if (!meetsLimits(best.outcome, limits)) {
    for (let i = 0; i < seed.length; i++) {
      for (const step of [-1, 1]) {
        const cycles = best.parts[i].cycles + step;
        if (cycles < 1 || cycles > 100) continue;
        const neighbour = best.parts.map((p, j) => (j === i ? { ...p, cycles } : p));
        const r = refineStart(body, target, neighbour, limits);
        evaluations += r.evaluations;
        if (r.cost < best.cost) best = r;
        if (meetsLimits(best.outcome, limits)) break;
      }
      if (meetsLimits(best.outcome, limits)) break;
    }
  }
  return { ...best, evaluations };
}
