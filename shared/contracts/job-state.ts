/**
 * The one list of states a background job's record goes through (plans, robustness runs and their
 * chunks, re-verifications): `cancelled` when a person or an admin stopped it.
 */
import { z } from 'zod';

export const JOB_STATES = ['queued', 'running', 'done', 'failed', 'cancelled'] as const;
export type JobState = (typeof JOB_STATES)[number];

export const jobStateSchema = z.enum(JOB_STATES);
