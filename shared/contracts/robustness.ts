/**
 * Robustness of a sequence version or a planner candidate: a seeded Monte Carlo over the body
 * (segment mass and length) and over the person executing it (amplitude, period, joint timing),
 * in two execution models: open-loop, and with feedback (the crew member watches a cabin reference
 * and stops or trims the last cycles of a phase from the attitude they perceive).
 *
 * One record per version or candidate. Sample i draws from its own stream seeded by (seed, i), so
 * the figures are identical in one thread, in chunks or across worker processes.
 */
import { z } from 'zod';

import { jobRecordSchema } from './job-state.ts';

const finite = (what: string) => z.number({ error: `${what} must be a finite number` });

/**
 * Spreads of the dispersion run: each sample draws every factor uniformly within ±spread.
 * The defaults are illustrative (common practice for a first robustness look, not measured values).
 */
export const dispersionSpreadsSchema = z.object({
  /** Segment mass error, ± percent (default 5). */
  massPct: finite('massPct').min(0).max(50).default(5),
  /** Segment length error (CoM, inertia and joint origins scale with it), ± percent (default 3). */
  lengthPct: finite('lengthPct').min(0).max(50).default(3),
  /** Sweep amplitude error of the person executing it, ± percent per step (default 10). */
  amplitudePct: finite('amplitudePct').min(0).max(50).default(10),
  /** Sweep period (timing) error, ± percent per step (default 10). */
  periodPct: finite('periodPct').min(0).max(50).default(10),
  /** Timing error between the joints of a sweep: phase shift of each dof, ± degrees of a cycle (default 10). */
  phaseDeg: finite('phaseDeg').min(0).max(90).default(10),
  /**
   * Timing of paired limbs in one sweep (both arms or both legs): `together` (default) gives the left
   * and right dof of a joint one shared phase error, as a person moving both limbs together keeps
   * them in step; `independent` draws every dof's error on its own (limbs fall out of step). An
   * ASSUMPTION (no measured spread of left–right timing found).
   */
  pairedLimbs: z.enum(['together', 'independent'], { error: 'pairedLimbs must be together or independent' }).default('together'),
});
/** Dispersion spreads (defaults filled). */
export type DispersionSpreads = z.infer<typeof dispersionSpreadsSchema>;

/** The execution model's parameters, stored with every record so a figure can be reproduced. */
export const robustnessModelSchema = z.object({
  spreads: dispersionSpreadsSchema,
  /** Error of the attitude the crew member perceives, 1σ per axis, degrees (assumption: at least 2°). */
  perceptionErrorDeg: finite('perceptionErrorDeg').min(0).max(45).default(2),
  /** Delay between perceiving the attitude and acting on it, seconds (assumption: at least 0.3 s). */
  reactionDelayS: finite('reactionDelayS').min(0).max(5).default(0.3),
});
export type RobustnessModel = z.infer<typeof robustnessModelSchema>;

/** Default model: illustrative spreads and the minimum perception error and delay. */
export const DEFAULT_ROBUSTNESS_MODEL: RobustnessModel = robustnessModelSchema.parse({ spreads: {} });

/** The figures of a finished run: its samples' final errors, degrees. */
export const robustnessStatsSchema = z.object({
  /** 95th-percentile final error executing every step as planned. */
  openLoopP95Deg: z.number(),
  /** 95th-percentile final error when the crew member stops or adds cycles from what they see. */
  feedbackP95Deg: z.number(),
  /** Median final error with feedback. */
  p50Deg: z.number(),
  /** Share of samples (with feedback) within the tolerance, 0–1. */
  withinToleranceShare: z.number(),
  samples: z.number().int(),
});

const stats = robustnessStatsSchema.shape;

/** The one record of a run: its figures (null while not done), the model it drew from and its job state. */
export const robustnessSchema = z.object({
  openLoopP95Deg: stats.openLoopP95Deg.nullable(),
  feedbackP95Deg: stats.feedbackP95Deg.nullable(),
  p50Deg: stats.p50Deg.nullable(),
  withinToleranceShare: stats.withinToleranceShare.nullable(),
  samples: stats.samples,
  seed: z.number().int(),
  model: robustnessModelSchema,
  ...jobRecordSchema.pick({ state: true, progress: true }).shape,
});
export type Robustness = z.infer<typeof robustnessSchema>;

/** Levels shown wherever robustness is shown. */
export const ROBUSTNESS_LEVELS = ['robust', 'marginal', 'not_robust'] as const;
export type RobustnessLevel = (typeof ROBUSTNESS_LEVELS)[number];

/** robust: feedback p95 ≤ tolerance; marginal: ≤ 3× tolerance; not robust: beyond. */
export function robustnessLevel(feedbackP95Deg: number, toleranceDeg: number): RobustnessLevel {
  if (feedbackP95Deg <= toleranceDeg) return 'robust';
  if (feedbackP95Deg <= 3 * toleranceDeg) return 'marginal';
  return 'not_robust';
}

/** Level of a finished run's figures, null while it has none. */
export function levelOf(feedbackP95Deg: number | null, toleranceDeg: number): RobustnessLevel | null {
  return feedbackP95Deg === null ? null : robustnessLevel(feedbackP95Deg, toleranceDeg);
}

/**
 * A version's robustness as `report.robustness` of GET /sequences/versions/:id shows it: the one
 * record (its newest run) plus the tolerance it was judged against and its level.
 */
export const versionRobustnessSchema = robustnessSchema.extend({
  runId: z.uuid(),
  /** The version's tolerance, degrees (the histogram marks it). */
  toleranceDeg: z.number(),
  /** robust / marginal / not_robust once done; null before. */
  level: z.enum(ROBUSTNESS_LEVELS).nullable(),
  error: jobRecordSchema.shape.error,
});
export type VersionRobustness = z.infer<typeof versionRobustnessSchema>;

/** The robustness lists show beside a version (its newest run): enough for the level and a caution. */
export const robustnessBriefSchema = versionRobustnessSchema.pick({ state: true, progress: true, feedbackP95Deg: true, toleranceDeg: true, level: true });
export type RobustnessBrief = z.infer<typeof robustnessBriefSchema>;
