/**
 * The admin's view of background work: every plan, robustness run and re-verification as one list
 * (state, progress, attempts, the reason of a failure), the queues' raw job counts, and the two
 * actions: retry what failed or was cancelled, cancel what is queued or running. Cancelled work ends
 * `cancelled` with "Cancelled by …" as its reason, and stops: a plan's thread is terminated, a
 * robustness run's chunks stop, a queued re-verification's job is cancelled.
 */
import { and, desc, eq, inArray, type SQL, sql } from 'drizzle-orm';

import { plans, reverifications, robustnessChunks, robustnessRuns, sequences, sequenceVersions } from '../../db/schema/index.ts';
import type { SessionUser } from '../../shared/contracts/auth.ts';
import type { BackgroundWork, QueueCounts, WorkFilter, WorkItem, WorkKind } from '../../shared/contracts/background-work.ts';
import type { JobState } from '../../shared/contracts/job-state.ts';
import type { AppContext } from '../app-context.ts';
import { recordAudit } from '../audit/record-audit.ts';
import { conflict, HttpError, notFound } from '../http/http-error.ts';
import { ALL_QUEUES, PLAN_QUEUE, REVERIFY_QUEUE } from './queue-names.ts';
import { cancelRobustnessRun, OPEN_STATES } from './robustness/robustness-runs.ts';
import { cancelPlan } from './run-plan.ts';

const LIMIT = 100;
const STATES_OF: Record<WorkFilter, JobState[]> = { open: ['queued', 'running'], failed: ['failed', 'cancelled'], done: ['done'] };

/** The list for one filter, newest first. */
export async function listBackgroundWork(ctx: AppContext, filter: WorkFilter): Promise<BackgroundWork> {
  const { db } = ctx;
  const states = STATES_OF[filter];
  const items: WorkItem[] = [];

  const planRows = await db.select({ p: plans, name: sequences.name }).from(plans)
    .innerJoin(sequences, eq(sequences.id, plans.sequenceId))
    .where(inArray(plans.state, states)).orderBy(desc(plans.createdAt)).limit(LIMIT);
  const planAttempts = await jobAttempts(ctx, PLAN_QUEUE, 'planId', planRows.map((r) => r.p.id));
  for (const { p, name } of planRows) {
    items.push(item('plan', p.id, `Planning for ${name}`, p.state, p.progress, p.error, planAttempts.get(p.id) ?? 0, p.createdAt, p.finishedAt));
  }

  const runRows = await db.select({ r: robustnessRuns, name: sequences.name, version: sequenceVersions.version }).from(robustnessRuns)
    .leftJoin(sequenceVersions, eq(sequenceVersions.id, robustnessRuns.sequenceVersionId))
    .leftJoin(sequences, eq(sequences.id, sequenceVersions.sequenceId))
    .where(inArray(robustnessRuns.state, states)).orderBy(desc(robustnessRuns.createdAt)).limit(LIMIT);
  const chunkAttempts = runRows.length
    ? await db.select({ runId: robustnessChunks.runId, n: sql<number>`sum(${robustnessChunks.attempts})::int` }).from(robustnessChunks)
      .where(inArray(robustnessChunks.runId, runRows.map((r) => r.r.id))).groupBy(robustnessChunks.runId)
    : [];
  for (const { r, name, version } of runRows) {
    const what = name ? `${name} v${version}` : r.planId ? `plan candidate ${(r.candidateIndex ?? 0) + 1}` : 'a maneuver';
    items.push(item('robustness', r.id, `Robustness of ${what} (${r.samples.toLocaleString('en-US')} samples, seed ${r.seed})`, r.state,
      r.state === 'done' ? 1 : r.doneSamples / Math.max(1, r.samples), r.error, chunkAttempts.find((c) => c.runId === r.id)?.n ?? 0, r.createdAt, r.finishedAt));
  }

  const reRows = await db.select({ r: reverifications, name: sequences.name, version: sequenceVersions.version }).from(reverifications)
    .innerJoin(sequenceVersions, eq(sequenceVersions.id, reverifications.sequenceVersionId))
    .innerJoin(sequences, eq(sequences.id, sequenceVersions.sequenceId))
    .where(inArray(reverifications.state, states)).orderBy(desc(reverifications.createdAt)).limit(LIMIT);
  for (const { r, name, version } of reRows) {
    items.push(item('reverification', r.id, `Re-verification of ${name} v${version} on a new profile`, r.state, null, r.error, r.attempts, r.createdAt, r.finishedAt));
  }

  items.sort((a, b) => b.createdAt.localeCompare(a.createdAt));
  return { items: items.slice(0, LIMIT), queues: await queueCounts(ctx) };
}

function item(kind: WorkKind, id: string, label: string, s: JobState, progress: number | null, error: string | null, attempts: number, createdAt: Date, finishedAt: Date | null): WorkItem {
  return {
    kind, id, label, state: s, progress, error, attempts,
    createdAt: createdAt.toISOString(), finishedAt: finishedAt?.toISOString() ?? null,
    canRetry: s === 'failed' || s === 'cancelled',
    canCancel: s === 'queued' || s === 'running',
  };
}

/** Attempts per record id: the sum over its jobs of (retries + 1) for jobs that started. */
async function jobAttempts(ctx: AppContext, queue: string, key: string, ids: string[]): Promise<Map<string, number>> {
  if (!ids.length) return new Map();
  const r = await ctx.db.execute<{ id: string; n: number }>(sql`
    select data->>${key} as id, sum(case when started_on is null then 0 else retry_count + 1 end)::int as n
    from pgboss.job where name = ${queue} and data->>${key} in ${ids} group by 1`);
  return new Map(r.rows.map((row) => [row.id, row.n]));
}

/** Raw job counts per queue (pg-boss's own table). */
async function queueCounts(ctx: AppContext): Promise<QueueCounts[]> {
  const r = await ctx.db.execute<{ name: string; state: string; n: number }>(sql`
    select name, state::text as state, count(*)::int as n from pgboss.job where name in ${[...ALL_QUEUES]} group by 1, 2`);
  return ALL_QUEUES.map((queue) => {
    const n = (...states: string[]) => r.rows.filter((row) => row.name === queue && states.includes(row.state)).reduce((s, row) => s + row.n, 0);
    return { queue, queued: n('created', 'retry'), active: n('active'), failed: n('failed'), completed: n('completed'), cancelled: n('cancelled') };
  });
}

/** Cancels a queued or running item; 409 when it has already ended. */
export async function cancelBackgroundWork(ctx: AppContext, kind: WorkKind, id: string, user: SessionUser): Promise<void> {
  const reason = `Cancelled by ${user.name}.`;
  const boss = ctx.jobs?.boss;
  let cancelled = false;
  if (kind === 'robustness') {
    await requireExists(ctx, kind, id);
    cancelled = ctx.jobs?.cancelRobustness ? await ctx.jobs.cancelRobustness(id, reason) : await cancelRobustnessRun(ctx, null, id, reason);
  } else if (kind === 'plan') {
    await requireExists(ctx, kind, id);
    cancelled = await cancelPlan(ctx, id, reason);
  } else {
    await requireExists(ctx, kind, id);
    const rows = await ctx.db.update(reverifications).set({ state: 'cancelled', error: reason, finishedAt: new Date() })
      .where(and(eq(reverifications.id, id), inArray(reverifications.state, [...OPEN_STATES]))).returning();
    cancelled = rows.length > 0;
    if (cancelled && boss) await cancelJobs(boss, REVERIFY_QUEUE, { sequenceVersionId: rows[0].sequenceVersionId, toProfileVersionId: rows[0].toProfileVersionId });
  }
  if (!cancelled) throw conflict('It has already finished; there is nothing to cancel.', 'not_open');
  await recordAudit(ctx.db, { actorId: user.id, action: `${kind}.cancel`, objectType: kind === 'plan' ? 'plan' : `${kind}`, objectId: id, detail: { reason } });
}

/** Puts a failed or cancelled item back in the queue; 409 when it is not failed or cancelled. */
export async function retryBackgroundWork(ctx: AppContext, kind: WorkKind, id: string, user: SessionUser): Promise<void> {
  const jobs = ctx.jobs;
  if (!jobs) throw new HttpError(503, 'queue_unavailable', 'The job queue is not running in this process.');
  await requireExists(ctx, kind, id);
  const failedStates: ('failed' | 'cancelled')[] = ['failed', 'cancelled'];
  let reopened = false;
  if (kind === 'plan') {
    const rows = await ctx.db.update(plans).set({ state: 'queued', error: null, progress: 0, progressNote: '', finishedAt: null })
      .where(and(eq(plans.id, id), inArray(plans.state, failedStates))).returning({ id: plans.id });
    reopened = rows.length > 0;
    if (reopened) await jobs.enqueuePlan?.(id);
  } else if (kind === 'reverification') {
    const rows = await ctx.db.update(reverifications).set({ state: 'queued', error: null, finishedAt: null })
      .where(and(eq(reverifications.id, id), inArray(reverifications.state, failedStates))).returning();
    reopened = rows.length > 0;
    if (reopened) await jobs.enqueueReverification([rows[0].sequenceVersionId], rows[0].toProfileVersionId);
  } else {
    // Resume the run: the chunks already done stay; the others run again.
    reopened = await ctx.db.transaction(async (tx) => {
      const rows = await tx.update(robustnessRuns).set({ state: 'queued', error: null, finishedAt: null })
        .where(and(eq(robustnessRuns.id, id), inArray(robustnessRuns.state, failedStates))).returning({ id: robustnessRuns.id });
      if (!rows.length) return false;
      await tx.update(robustnessChunks).set({ state: 'queued', error: null, finishedAt: null })
        .where(and(eq(robustnessChunks.runId, id), inArray(robustnessChunks.state, failedStates)));
      return true;
    });
    if (reopened) await jobs.enqueueRobustness?.(id);
  }
  if (!reopened) throw conflict('Only failed or cancelled work can be retried.', 'not_failed');
  await recordAudit(ctx.db, { actorId: user.id, action: `${kind}.retry`, objectType: kind, objectId: id, detail: {} });
}

async function requireExists(ctx: AppContext, kind: WorkKind, id: string): Promise<void> {
  const table = kind === 'plan' ? plans : kind === 'robustness' ? robustnessRuns : reverifications;
  const cond: SQL = eq(table.id, id);
  const [row] = await ctx.db.select({ id: table.id }).from(table).where(cond);
  if (!row) throw notFound(kind === 'plan' ? 'Plan' : kind === 'robustness' ? 'Robustness run' : 'Re-verification');
}

/** Cancels the live jobs (queued, waiting for a retry, or running) of one queue whose data match. */
export async function cancelJobs(boss: NonNullable<AppContext['jobs']>['boss'] & object, queue: string, data: object): Promise<void> {
  const live = (await boss.findJobs(queue, { data })).filter((j) => j.state === 'created' || j.state === 'retry' || j.state === 'active');
  if (live.length) await boss.cancel(queue, live.map((j) => j.id));
}
