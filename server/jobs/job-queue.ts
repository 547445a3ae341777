/**
 * The PostgreSQL-backed job queue (pg-boss 12, in the app's own database): re-verification of
 * sequence versions after a profile change, maneuver planning ("Suggest steps") and robustness-run
 * chunks. The API process starts it without a worker (it only sends); worker processes
 * (`npm run worker`, server/scripts/worker.ts) start it with one, on this machine or on others
 * against the same PostgreSQL.
 *
 * No stuck work: every queue has heartbeats, so a job held by a process that died is retried once
 * its heartbeat stops (heartbeat + supervisor interval, under a minute by default); the records a
 * job fills (plans, re-verifications, robustness runs) are reconciled with their jobs on start and
 * then periodically (reconcile-work.ts), so none stays `queued` or `running` without a job behind it.
 */
import { type Job, PgBoss } from 'pg-boss';

import type { AppContext, JobQueue } from '../app-context.ts';
import { deliverInvitation, type InvitationMailJob } from '../team/deliver-invitation.ts';
import {
  ALL_QUEUES, CHUNK_RETRY_LIMIT, INVITATION_MAIL_QUEUE, INVITATION_MAIL_RETRY_LIMIT, PLAN_QUEUE, PLAN_RETRY_LIMIT, type QueueName, REVERIFY_QUEUE,
  REVERIFY_RETRY_LIMIT, ROBUSTNESS_CHUNK_QUEUE,
} from './queue-names.ts';
import { reconcileWork } from './reconcile-work.ts';
import { type ReverifyJob, reverifyVersion } from './reverify-version.ts';
import { ChunkPool } from './robustness/chunk-pool.ts';
import { cancelRobustnessRun, enqueueRobustnessChunks, type RobustnessChunkJob, runRobustnessChunk } from './robustness/robustness-runs.ts';
import { type PlanJob, runPlan } from './run-plan.ts';
import { Semaphore } from './semaphore.ts';

export { ALL_QUEUES, CHUNK_RETRY_LIMIT, PLAN_QUEUE, PLAN_RETRY_LIMIT, type QueueName, REVERIFY_QUEUE, REVERIFY_RETRY_LIMIT, ROBUSTNESS_CHUNK_QUEUE } from './queue-names.ts';

/** A running queue: the JobQueue the routes use, plus shutdown. */
export interface RunningJobQueue extends JobQueue {
  boss: PgBoss;
  /** Jobs this process has run since it started, by queue. */
  jobsRun: Record<QueueName, number>;
  stop(): Promise<void>;
}

/** Options for startJobQueue; the timing ones default to the configuration (server/config.ts). */
export interface JobQueueOptions {
  /** Start a worker in this process (default true). */
  worker?: boolean;
  /** Jobs this process runs at once (default WORKER_CONCURRENCY). */
  concurrency?: number;
  /** Retry delay base, seconds (default 2; tests use 1). */
  retryDelayS?: number;
  /** How often the worker looks for due jobs (retries included), seconds (default JOB_POLL_SECONDS). */
  pollingIntervalS?: number;
  /** Heartbeat period of a running job, seconds, ≥ 10 (default JOB_HEARTBEAT_SECONDS). */
  heartbeatS?: number;
  /** Supervisor and reconciliation interval, seconds (default JOB_SUPERVISE_SECONDS). */
  superviseS?: number;
  /** Reconcile records with their jobs at start and periodically (default: when a worker runs). */
  reconcile?: boolean;
}

/** Starts pg-boss on the app database, creates the queues, optionally works them, and returns the handle. */
export async function startJobQueue(ctx: AppContext, opts: JobQueueOptions = {}): Promise<RunningJobQueue> {
  const { config } = ctx;
  const heartbeatSeconds = opts.heartbeatS ?? config.JOB_HEARTBEAT_SECONDS;
  const superviseS = opts.superviseS ?? config.JOB_SUPERVISE_SECONDS;
  const poll = opts.pollingIntervalS ?? config.JOB_POLL_SECONDS;
  const concurrency = opts.concurrency ?? config.WORKER_CONCURRENCY;
  const worker = opts.worker !== false;
  const boss = new PgBoss({
    connectionString: config.DATABASE_URL,
    useListenNotify: true,
    // The supervisor fails (and so retries) jobs whose heartbeat stopped; it runs when both timers are due.
    superviseIntervalSeconds: superviseS,
    monitorIntervalSeconds: superviseS,
  });
  boss.on('error', (err) => ctx.logger.error({ err }, 'job queue error'));
  await boss.start();
  const retryDelay = opts.retryDelayS ?? 2;
  const queueOptions = {
    [REVERIFY_QUEUE]: { retryLimit: REVERIFY_RETRY_LIMIT, retryDelay, retryBackoff: true },
    [PLAN_QUEUE]: { retryLimit: PLAN_RETRY_LIMIT, retryDelay: 1 },
    [ROBUSTNESS_CHUNK_QUEUE]: { retryLimit: CHUNK_RETRY_LIMIT, retryDelay: 1 },
    [INVITATION_MAIL_QUEUE]: { retryLimit: INVITATION_MAIL_RETRY_LIMIT, retryDelay, retryBackoff: true },
  } satisfies Record<QueueName, object>;
  for (const name of ALL_QUEUES) {
    await boss.createQueue(name, { ...queueOptions[name], heartbeatSeconds, notify: true });
    // A queue made by an older release keeps its old options unless updated (heartbeats included).
    await boss.updateQueue(name, { ...queueOptions[name], heartbeatSeconds });
  }

  const pool = worker ? new ChunkPool(concurrency) : null;
  const slots = new Semaphore(concurrency);
  let reconcileTimer: NodeJS.Timeout | null = null;
  let stopping = false;

  const jobsRun = Object.fromEntries(ALL_QUEUES.map((q) => [q, 0])) as Record<QueueName, number>;
  const handle: RunningJobQueue = {
    boss,
    jobsRun,
    async enqueueReverification(sequenceVersionIds, toProfileVersionId) {
      for (const sequenceVersionId of sequenceVersionIds) {
        await boss.send(REVERIFY_QUEUE, { sequenceVersionId, toProfileVersionId } satisfies ReverifyJob);
      }
    },
    async enqueuePlan(planId) {
      await boss.send(PLAN_QUEUE, { planId } satisfies PlanJob);
    },
    async enqueueInvitationMail(invitationId) {
      await boss.send(INVITATION_MAIL_QUEUE, { invitationId } satisfies InvitationMailJob);
    },
    async enqueueRobustness(runId) {
      await enqueueRobustnessChunks(ctx, boss, runId);
    },
    async cancelRobustness(runId, reason) {
      return cancelRobustnessRun(ctx, boss, runId, reason);
    },
    async stop() {
      stopping = true;
      if (reconcileTimer) clearInterval(reconcileTimer);
      await boss.stop({ graceful: true, timeout: 10_000 });
      await pool?.close();
    },
  };

  if (worker) {
    await pool!.warm();
    // NOTIFY wakes the worker for new jobs only; retries become due silently, so poll often in both modes.
    // Each queue gets `concurrency` pollers; one semaphore keeps this process at `concurrency` jobs in all.
    const workOptions = { batchSize: 1, localConcurrency: concurrency, pollingIntervalSeconds: poll, notifyPollingIntervalSeconds: poll };
    // After a job, this queue's pollers fetch again at once instead of waiting out the poll interval,
    // so a backlog (a run's chunks) drains back to back.
    const wake = (queue: QueueName) => {
      for (const w of boss.getWipData()) if (w.name === queue) boss.notifyWorker(w.id);
    };
    const handler = <T>(queue: QueueName, run: (job: Job<T>) => Promise<void>) => (jobs: Job<T>[]) => slots.run(async () => {
      try {
        for (const job of jobs) {
          jobsRun[queue]++;
          await run(job);
        }
      } finally {
        wake(queue);
      }
    });
    await boss.work<ReverifyJob>(REVERIFY_QUEUE, workOptions, handler(REVERIFY_QUEUE, (job: Job<ReverifyJob>) =>
      reverifyVersion(ctx, job.data, { attempt: job.retryCount, retryLimit: REVERIFY_RETRY_LIMIT })));
    // A plan runs in its own worker thread.
    await boss.work<PlanJob>(PLAN_QUEUE, workOptions, handler(PLAN_QUEUE, (job: Job<PlanJob>) => runPlan(ctx, job.data, { signal: job.signal })));
    await boss.work<InvitationMailJob>(INVITATION_MAIL_QUEUE, workOptions, handler(INVITATION_MAIL_QUEUE, (job: Job<InvitationMailJob>) =>
      deliverInvitation(ctx, job.data, { attempt: job.retryCount, retryLimit: INVITATION_MAIL_RETRY_LIMIT })));
    // Chunks are short (tens of milliseconds on an idle machine), so the database work around each
    // (fetch, claim, merge, complete) would leave the threads idle between chunks: this queue takes
    // one chunk more than it computes at once, and only the computing holds one of the process's
    // slots, so the next chunk is claimed while the current one computes.
    const computeChunk = { run: (...args: Parameters<ChunkPool['run']>) => slots.run(() => pool!.run(...args)) };
    await boss.work<RobustnessChunkJob>(ROBUSTNESS_CHUNK_QUEUE, { ...workOptions, localConcurrency: concurrency + 1 }, async (jobs: Job<RobustnessChunkJob>[]) => {
      try {
        for (const job of jobs) {
          jobsRun[ROBUSTNESS_CHUNK_QUEUE]++;
          await runRobustnessChunk(ctx, computeChunk, job.data, { signal: job.signal, attempt: job.retryCount, retryLimit: CHUNK_RETRY_LIMIT, receivedAt: Date.now() });
        }
      } finally {
        wake(ROBUSTNESS_CHUNK_QUEUE);
      }
    });
  }

  if (opts.reconcile ?? worker) {
    const sweep = async () => {
      if (stopping) return;
      try {
        await reconcileWork(ctx, handle);
      } catch (err) {
        ctx.logger.error({ err }, 'reconciling background work failed');
      }
    };
    await sweep();
    reconcileTimer = setInterval(() => void sweep(), Math.max(1, superviseS) * 1000);
    reconcileTimer.unref();
  }
  return handle;
}
