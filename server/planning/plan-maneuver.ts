/**
 * The maneuver planner: seeds candidate step lists from per-cycle rotations, refines each with the
 * full simulation in the loop (Nelder–Mead), verifies the result at the engine's full accuracy,
 * runs a dispersion on it, and ranks the candidates. Synchronous and CPU-bound: the job runs it in
 * a worker thread.
 */
import type { Body } from '../../shared/contracts/body.ts';
import type { SequenceTarget } from '../../shared/contracts/maneuver.ts';
import type { PlanCandidate, PlanSettings } from '../../shared/contracts/plan.ts';
import { cueFor } from '../../shared/primitives/primitive-cues.ts';
import { targetQuat } from '../maneuvers/target-attitude.ts';
import { candidatePrimitives } from './candidate-steps.ts';
import { runDispersion } from './dispersion.ts';
import { compileForBody, evaluateSequence } from './evaluate-steps.ts';
import { PLAN_FAMILIES, type PlanFamily } from './plan-families.ts';
import { meetsLimits, refineCandidate } from './refine-candidate.ts';
import { familyLevels, seedCandidates } from './seed-candidates.ts';

/** Full simulations allowed per refinement start (the whole plan stays within a few thousand). */
export const EVALUATIONS_PER_START = 60;
/** Seeds refined beyond the number of candidates asked for (some may fail the limits). */
const EXTRA_SEEDS = 2;

/** Progress report: fraction 0–1 and a short note. */
export type PlanProgress = (fraction: number, note: string) => void;

/** Planner inputs. */
export interface PlanInputs {
  body: Body;
  target: SequenceTarget;
  settings: PlanSettings;
  /** Families to use (default: all). */
  families?: readonly PlanFamily[];
  onProgress?: PlanProgress;
}

/**
 * Ranks: candidates meeting tolerance, ranges and rate limit first, ordered by duration plus
 * 10 s per degree their 95th-percentile error exceeds the tolerance; then the rest by error.
 */
export function rankCandidates(list: Omit<PlanCandidate, 'rank'>[], toleranceDeg: number): PlanCandidate[] {
  const ok = (c: Omit<PlanCandidate, 'rank'>) => c.withinTolerance && c.withinRateLimit && c.rangeViolationCount === 0;
  const robustScore = (c: Omit<PlanCandidate, 'rank'>) => c.durationS + 10 * Math.max(0, c.dispersion.p95ErrorDeg - toleranceDeg);
  const good = list.filter(ok).sort((a, b) => robustScore(a) - robustScore(b));
  const rest = list.filter((c) => !ok(c)).sort((a, b) => a.errorDeg - b.errorDeg);
  return [...good, ...rest].map((c, i) => ({ ...c, rank: i + 1 }));
}

/** Runs the planner; returns ranked candidates (at most settings.maxCandidates). */
export function planManeuver({ body, target, settings, families = PLAN_FAMILIES, onProgress }: PlanInputs): PlanCandidate[] {
  const progress = onProgress ?? (() => {});
  const goal = targetQuat(target);
  const limits = { toleranceDeg: target.toleranceDeg, rateLimitDegS: target.rateLimitDegS, timeBudgetS: target.timeBudgetS, evaluationsPerStart: EVALUATIONS_PER_START };

  progress(0.02, 'measuring per-cycle rotations');
  const levels = familyLevels(body, families, target.rateLimitDegS);
  const seeds = seedCandidates(levels, goal, limits).slice(0, settings.maxCandidates + EXTRA_SEEDS);

  const refineShare = 0.6;
  const refined = seeds.map((seed, i) => {
    progress(0.1 + (refineShare * i) / seeds.length, `refining candidate ${i + 1} of ${seeds.length}`);
    return refineCandidate(body, goal, seed.parts, limits);
  });

  // Keep the best distinct step lists, verified at full accuracy, then their dispersion.
  const unique = new Map<string, (typeof refined)[number]>();
  for (const r of refined.sort((a, b) => a.cost - b.cost)) {
    const key = JSON.stringify(candidatePrimitives(r.parts, limits.rateLimitDegS));
    if (!unique.has(key)) unique.set(key, r);
  }
  const chosen = [...unique.values()].slice(0, settings.maxCandidates);
  const out = chosen.map((r, i) => {
    progress(0.1 + refineShare + ((1 - refineShare - 0.1) * i) / chosen.length, `dispersion of candidate ${i + 1} of ${chosen.length}`);
    const primitives = candidatePrimitives(r.parts, limits.rateLimitDegS);
    const sequence = compileForBody(body, primitives);
    const full = evaluateSequence(body, sequence, goal, { rateHz: 1 });
    const dispersion = runDispersion({ body, sequence, target: goal, toleranceDeg: target.toleranceDeg, samples: settings.samples, seed: settings.seed, spreads: settings.spreads });
    const y = full.result.final.yprDeg;
    return {
      primitives,
      cues: primitives.map(cueFor),
      families: r.parts.map((p) => p.family.id),
      durationS: full.durationS,
      errorDeg: full.errorDeg,
      withinTolerance: full.errorDeg <= target.toleranceDeg,
      yprDeg: { yaw: y.yaw, pitch: y.pitch, roll: y.roll },
      peakJointRateDegS: full.peakRateDegS,
      withinRateLimit: meetsLimits({ ...full, errorDeg: 0, rangeViolationCount: 0 }, limits),
      rangeViolationCount: full.rangeViolationCount,
      evaluations: r.evaluations,
      dispersion,
    };
  });
  progress(1, 'done');
  return rankCandidates(out, target.toleranceDeg);
}
