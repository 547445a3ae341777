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

import { jobStateSchema } from './job-state.ts';
import { dispersionSpreadsSchema } from './plan.ts';

const finite = (what: string) => z.number({ error: `${what} must be a finite number` });

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
export const DEFAULT_ROBUSTNESS_MODEL: RobustnessModel = robustnessModelSchema.parse({
  spreads: { massPct: 5, lengthPct: 3, amplitudePct: 10, periodPct: 10, phaseDeg: 10 },
});

/** The figures of a finished run (null while not done). */
export const robustnessSchema = z.object({
  openLoopP95Deg: z.number().nullable(),
  feedbackP95Deg: z.number().nullable(),
  /** Median final error with feedback, degrees. */
  p50Deg: z.number().nullable(),
  /** Share of samples (with feedback) within the tolerance, 0–1. */
  withinToleranceShare: z.number().nullable(),
  samples: z.number().int(),
  seed: z.number().int(),
  model: robustnessModelSchema,
  state: jobStateSchema,
  /** 0–1. */
  progress: z.number(),
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
  /** Why the run failed or was cancelled; null otherwise. */
  error: z.string().nullable(),
});
export type VersionRobustness = z.infer<typeof versionRobustnessSchema>;

/** The robustness lists show beside a version (its newest run): enough for the level and a caution. */
export const robustnessBriefSchema = z.object({
  state: jobStateSchema,
  /** 0–1. */
  progress: z.number(),
  feedbackP95Deg: z.number().nullable(),
  toleranceDeg: z.number(),
  level: z.enum(ROBUSTNESS_LEVELS).nullable(),
});
export type RobustnessBrief = z.infer<typeof robustnessBriefSchema>;
