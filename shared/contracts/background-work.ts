/**
 * The admin view of background work (GET /api/jobs): plans, robustness runs and re-verifications
 * with their state, progress and the reason of a failure, plus the queue's raw job counts.
 */
import { z } from 'zod';

import { jobRecordSchema } from './job-state.ts';

export const WORK_KINDS = ['plan', 'robustness', 'reverification'] as const;
export type WorkKind = (typeof WORK_KINDS)[number];

/** Which items to list. */
export const WORK_FILTERS = ['open', 'failed', 'done'] as const;
export type WorkFilter = (typeof WORK_FILTERS)[number];

export const workItemSchema = jobRecordSchema.omit({ startedAt: true }).extend({
  kind: z.enum(WORK_KINDS),
  id: z.uuid(),
  /** What it is about, e.g. "Robustness of Quarter turn v3 (1,000 samples)". */
  label: z.string(),
  /** 0–1, null when the kind reports none. */
  progress: jobRecordSchema.shape.progress.nullable(),
  canRetry: z.boolean(),
  canCancel: z.boolean(),
});
export type WorkItem = z.infer<typeof workItemSchema>;

export const queueCountsSchema = z.object({
  queue: z.string(),
  queued: z.number().int(),
  active: z.number().int(),
  failed: z.number().int(),
  completed: z.number().int(),
  cancelled: z.number().int(),
});
export type QueueCounts = z.infer<typeof queueCountsSchema>;

export const backgroundWorkSchema = z.object({
  items: z.array(workItemSchema),
  queues: z.array(queueCountsSchema),
});
export type BackgroundWork = z.infer<typeof backgroundWorkSchema>;

export const workListQuerySchema = z.object({ filter: z.enum(WORK_FILTERS, { error: 'filter must be open, failed or done' }).default('open') });
