/**
 * The PostgreSQL-backed job queue (pg-boss 12, in the app's own database): re-verification of
 * sequence versions after a profile change, and maneuver planning ("Suggest steps"). `startJobQueue` creates the queue and, unless told not
 * to, starts a worker in this process; more worker processes on more machines can call it too.
 */
import { eq } from 'drizzle-orm';
import { PgBoss } from 'pg-boss';

import { plans, reverifications } from '../../db/schema/index.ts';
import type { AppContext, JobQueue } from '../app-context.ts';
import { reverifyVersion, type ReverifyJob } from './reverify-version.ts';
import { runPlan, type PlanJob } from './run-plan.ts';

/** Queue name of re-verification jobs. */
export const REVERIFY_QUEUE = 'sequence-reverification';
/** Retries after a failed attempt (so up to 1 + this many attempts), with exponential backoff from 2 s. */
export const REVERIFY_RETRY_LIMIT = 3;

/** Queue name of planning jobs. */
export const PLAN_QUEUE = 'maneuver-planning';

/** A running queue: the JobQueue the routes use, plus shutdown. */
export interface RunningJobQueue extends JobQueue {
  boss: PgBoss;
  stop(): Promise<void>;
}

/** Options for startJobQueue. */
export interface JobQueueOptions {
  /** Start a worker in this process (default true). */
  worker?: boolean;
  /** Retry delay base, seconds (default 2; tests use 1). */
  retryDelayS?: number;
  /** How often the worker looks for due jobs (retries included), seconds (default 2). */
  pollingIntervalS?: number;
}

/** Starts pg-boss on the app database, creates the queue, optionally works it, and returns the handle. */
export async function startJobQueue(ctx: AppContext, opts: JobQueueOptions = {}): Promise<RunningJobQueue> {
  const boss = new PgBoss({ connectionString: ctx.config.DATABASE_URL, useListenNotify: true });
  boss.on('error', (err) => ctx.logger.error({ err }, 'job queue error'));
  await boss.start();
  await boss.createQueue(REVERIFY_QUEUE, {
    retryLimit: REVERIFY_RETRY_LIMIT,
    retryDelay: opts.retryDelayS ?? 2,
    retryBackoff: true,
    notify: true,
  });
  // Planning is deterministic: no retries (run-plan.ts stores a failure on the plan instead).
  await boss.createQueue(PLAN_QUEUE, { retryLimit: 0, notify: true });
  if (opts.worker !== false) {
    // NOTIFY wakes the worker for new jobs only; retries become due silently, so poll often in both modes.
    const poll = opts.pollingIntervalS ?? 2;
    await boss.work<ReverifyJob>(REVERIFY_QUEUE, { batchSize: 1, pollingIntervalSeconds: poll, notifyPollingIntervalSeconds: poll }, async (jobs) => {
      for (const job of jobs) await reverifyVersion(ctx, job.data, { attempt: job.retryCount, retryLimit: REVERIFY_RETRY_LIMIT });
    });
    // A plan runs in its own worker thread; one at a time per process keeps a core for the API.
    await boss.work<PlanJob>(PLAN_QUEUE, { batchSize: 1, pollingIntervalSeconds: poll, notifyPollingIntervalSeconds: poll }, async (jobs) => {
      for (const job of jobs) await runPlan(ctx, job.data);
    });
  }
  const enqueueReverification = async (sequenceVersionIds: string[], toProfileVersionId: string) => {
    for (const sequenceVersionId of sequenceVersionIds) {
      await boss.send(REVERIFY_QUEUE, { sequenceVersionId, toProfileVersionId } satisfies ReverifyJob);
    }
  };
  // Records flagged while no queue ran (or whose job was lost) get a job now; a duplicate job is harmless.
  const waiting = await ctx.db.select().from(reverifications).where(eq(reverifications.state, 'queued'));
  for (const r of waiting) await enqueueReverification([r.sequenceVersionId], r.toProfileVersionId);
  const enqueuePlan = async (planId: string) => {
    await boss.send(PLAN_QUEUE, { planId } satisfies PlanJob);
  };
  // Plans requested while no queue ran get a job now (run-plan.ts skips finished ones).
  const queuedPlans = await ctx.db.select({ id: plans.id }).from(plans).where(eq(plans.state, 'queued'));
  for (const p of queuedPlans) await enqueuePlan(p.id);
  return {
    boss,
    enqueueReverification,
    enqueuePlan,
    async stop() {
      await boss.stop({ graceful: true, timeout: 10_000 });
    },
  };
}
