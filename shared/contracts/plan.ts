/**
 * The maneuver planner's API contract ("Suggest steps"): a planner asks for ranked candidate step
 * lists that reach a sequence's target reorientation on its crew member's current profile body.
 * Planning is a background job; the request returns a plan id to poll.
 *
 * Endpoints (under /api, bearer token):
 * - POST /sequences/:sequenceId/plans          PlanRequest → 202 { planId }            (planner, admin)
 * - GET  /sequences/:sequenceId/plans?limit=N   → PlanList (newest first)      (planner, admin)
 * - GET  /sequences/:sequenceId/plans/:planId  → Plan
 * Errors: `{ error: { code, message, field } }`.
 * Angles in degrees, times in seconds, rates in deg/s, timestamps ISO-8601 strings.
 */
import { z } from 'zod';

import { primitiveListSchema } from '../primitives/primitive-schemas.ts';
import { jobRecordSchema } from './job-state.ts';
import { reportSummarySchema } from './maneuver.ts';
import { finalStateSchema, rangeViolationSchema } from './result.ts';
import { dispersionSpreadsSchema, ROBUSTNESS_LEVELS, robustnessStatsSchema } from './robustness.ts';
import { sequenceSchema } from './sequence.ts';

const finite = (what: string) => z.number({ error: `${what} must be a finite number` });

/** POST /sequences/:sequenceId/plans */
export const planRequestSchema = z.object({
  /** Monte Carlo samples per candidate (default 100). */
  samples: finite('samples').int('samples must be a whole number').min(10).max(1000).default(100),
  /** Seed of the dispersion run's random numbers (same seed, same figures). */
  seed: finite('seed').int('seed must be a whole number').min(0).max(2 ** 31 - 1).default(1),
  /** Omitted (or any spread omitted): the spreads' defaults. */
  spreads: dispersionSpreadsSchema.prefault({}),
  /** How many ranked candidates to return (default 4). */
  maxCandidates: finite('maxCandidates').int().min(1).max(8).default(4),
  /**
   * Feedback execution: error of the attitude the crew member perceives, 1σ per axis, degrees.
   * An assumption (no source found); DECISIONS.md sets the floor, 2°.
   */
  perceptionErrorDeg: finite('perceptionErrorDeg').min(2, 'perceptionErrorDeg must be at least 2°').max(45).default(2),
  /** Feedback execution: reaction delay, seconds. An assumption (no source found); floor 0.3 s. */
  reactionDelayS: finite('reactionDelayS').min(0.3, 'reactionDelayS must be at least 0.3 s').max(5).default(0.3),
});
/** Planner request (input shape). */
export type PlanRequest = z.input<typeof planRequestSchema>;
/** Planner settings (defaults filled), stored with the plan. */
export type PlanSettings = z.infer<typeof planRequestSchema>;

/**
 * Robustness of one candidate: the seeded Monte Carlo in both execution models (ranking uses the
 * feedback p95), with its seed and level.
 */
export const candidateRobustnessSchema = robustnessStatsSchema.extend({
  seed: z.number().int(),
  level: z.enum(ROBUSTNESS_LEVELS),
});
export type CandidateRobustness = z.infer<typeof candidateRobustnessSchema>;

/**
 * A compact attitude track of a candidate for the side-by-side plots: yaw/pitch/roll (z-y′-x″, yaw
 * and roll unwrapped so a detour shows) against time, thinned from the verification samples to at
 * most CANDIDATE_TRACK_POINTS points (the last sample always kept). Arrays share `t`'s length.
 */
export const candidateTrackSchema = z.object({
  /** Seconds from the start, ascending; the last is the candidate's duration. */
  t: z.array(z.number()),
  yawDeg: z.array(z.number()),
  pitchDeg: z.array(z.number()),
  rollDeg: z.array(z.number()),
});
export type CandidateTrack = z.infer<typeof candidateTrackSchema>;

/** Most points of a candidate's stored attitude track (keeps a plan of four candidates small to poll). */
export const CANDIDATE_TRACK_POINTS = 400;

/**
 * One ranked candidate step list, with the headline figures a version's report gives (duration,
 * reached yaw/pitch/roll, tolerance, peak joint rate, rate limit, time budget, range violations:
 * reportSummarySchema) on the nominal body.
 */
export const planCandidateSchema = reportSummarySchema.omit({ targetErrorDeg: true }).extend({
  /** 1 = best. */
  rank: z.number().int(),
  /** The composer steps (replace the composer's list with these). */
  primitives: primitiveListSchema,
  /** The compiled sequence contract (move/harmonic/hold steps), as `npm run simulate` accepts it. */
  sequence: sequenceSchema,
  /** Trainee cue per step. */
  cues: z.array(z.string()),
  /** Planner families used, one per phase, e.g. ["hanging_arm_circles_out", "hip_swirl_left"]. */
  families: z.array(z.string()),
  /** Final attitude on the nominal body, verified at the engine's full accuracy (its yprDeg is the candidate's). */
  final: finalStateSchema.omit({ jointsDeg: true }),
  /** Final attitude error to the target on the nominal body, degrees (a report summary's targetErrorDeg). */
  errorDeg: z.number(),
  /** Rotation travelled, ∫|ω| dt, degrees (includes the to-and-fro within every cycle). */
  pathDeg: z.number(),
  /** Rotation travelled from cycle end to cycle end (the to-and-fro within cycles left out), degrees. */
  netPathDeg: z.number(),
  /** Turns the long way round: netPathDeg above the target angle + 90°. */
  detour: z.boolean(),
  /** Range violations on the nominal body (empty when none). */
  rangeViolations: z.array(rangeViolationSchema),
  /** Simulations the search ran for this candidate (single cycles and the verification). */
  evaluations: z.number().int(),
  robustness: candidateRobustnessSchema,
  /** Attitude against time on the nominal body (absent on plans made before it was stored: suggest again). */
  track: candidateTrackSchema.optional(),
});
export type PlanCandidate = z.infer<typeof planCandidateSchema>;

/** GET /sequences/:sequenceId/plans/:planId (`state` is `cancelled` when a planner or an admin stopped it: its thread is stopped too). */
export const planSchema = jobRecordSchema.omit({ attempts: true }).extend({
  id: z.uuid(),
  sequenceId: z.uuid(),
  /** The profile version whose body the plan used. */
  profileVersionId: z.uuid(),
  /** What the planner is doing now (e.g. "refining candidate 2 of 4"). */
  progressNote: z.string(),
  settings: planRequestSchema,
  /** Ranked candidates (empty until done). */
  candidates: z.array(planCandidateSchema),
  /**
   * The planner's notes: when it finds no candidate, why (which axis, which limit); otherwise sweeps
   * it could not use on this body, a time budget too short, or a best candidate that misses a limit.
   */
  notes: z.array(z.string()),
  /** Wall-clock time of the run, seconds (null until finished). */
  elapsedS: z.number().nullable(),
});
export type Plan = z.infer<typeof planSchema>;

/** POST response. */
export const planCreatedSchema = z.object({ planId: z.uuid() });
export type PlanCreated = z.infer<typeof planCreatedSchema>;

/** GET /sequences/:sequenceId/plans query. */
export const planListQuerySchema = z.object({
  /** Most plans to list, newest first (default 20); 1 asks for the latest only. */
  limit: z.coerce.number({ error: 'limit must be a whole number' }).int('limit must be a whole number').min(1).max(100).default(20),
});
/** Plan list query (input shape). */
export type PlanListQuery = z.input<typeof planListQuerySchema>;

/** One plan in a sequence's list (no candidates: fetch the plan for those). */
export const planSummarySchema = planSchema.pick({ id: true, state: true, progress: true, createdAt: true }).extend({
  /** Ranked candidates stored (0 until done). */
  candidateCount: z.number().int(),
  /** Error to target of the best (rank 1) candidate on the nominal body, degrees (null until done, or when there is none). */
  bestErrorDeg: z.number().nullable(),
});
export type PlanSummary = z.infer<typeof planSummarySchema>;

/** GET /sequences/:sequenceId/plans */
export const planListSchema = z.object({
  /** Newest first. */
  plans: z.array(planSummarySchema),
});
export type PlanList = z.infer<typeof planListSchema>;
