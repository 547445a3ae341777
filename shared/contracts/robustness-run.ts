/**
 * A robustness run as the API shows it: the one-record contract (robustness.ts) plus what the job
 * machinery adds (id, subject, reason of a failure, timing) and the per-sample errors for a histogram.
 */
import { z } from 'zod';

import { jobRecordSchema } from './job-state.ts';
import { robustnessSchema } from './robustness.ts';

export const robustnessRunSchema = robustnessSchema.extend({
  id: z.uuid(),
  sequenceVersionId: z.uuid().nullable(),
  planId: z.uuid().nullable(),
  candidateIndex: z.number().int().nullable(),
  toleranceDeg: z.number(),
  /** Final error with feedback of every sample, degrees, once done (for the histogram). */
  feedbackErrorsDeg: z.array(z.number()).nullable(),
  chunks: z.number().int(),
  chunksDone: z.number().int(),
  /** `error`: why the run failed or was cancelled (shown in the UI). */
  ...jobRecordSchema.pick({ error: true, createdAt: true, startedAt: true, finishedAt: true }).shape,
});
export type RobustnessRun = z.infer<typeof robustnessRunSchema>;

/** Most samples one run may ask for. */
export const MAX_ROBUSTNESS_SAMPLES = 20_000;

/** `POST …/robustness`: start a (new) run; both fields optional. */
export const startRobustnessRequestSchema = z.object({
  samples: z.number({ error: 'samples must be a whole number' }).int('samples must be a whole number').min(10, 'samples must be at least 10').max(MAX_ROBUSTNESS_SAMPLES, `samples must be at most ${MAX_ROBUSTNESS_SAMPLES}`).optional(),
  seed: z.number({ error: 'seed must be a whole number' }).int('seed must be a whole number').min(0, 'seed must be 0 or more').max(2 ** 32 - 1, 'seed must fit in 32 bits').optional(),
}).strict();
export type StartRobustnessRequest = z.infer<typeof startRobustnessRequestSchema>;
