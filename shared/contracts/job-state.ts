/**
 * The one list of states a background job's record goes through (plans, robustness runs and their
 * chunks, re-verifications): `cancelled` when a person or an admin stopped it.
 */
import { z } from 'zod';

export const JOB_STATES = ['queued', 'running', 'done', 'failed', 'cancelled'] as const;
export type JobState = (typeof JOB_STATES)[number];

export const jobStateSchema = z.enum(JOB_STATES);

/**
 * The fields a background job's record shows alike wherever it is listed (plans, robustness runs,
 * re-verifications, the admin's work list); each record picks the ones it keeps. Times ISO-8601.
 */
export const jobRecordSchema = z.object({
  state: jobStateSchema,
  /** Share done, 0–1. */
  progress: z.number(),
  /** Why it failed or was cancelled (null otherwise). */
  error: z.string().nullable(),
  /** Attempts made by workers (retries after a worker died count). */
  attempts: z.number().int(),
  createdAt: z.string(),
  startedAt: z.string().nullable(),
  finishedAt: z.string().nullable(),
});
