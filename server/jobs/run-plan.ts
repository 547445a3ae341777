/**
 * The planning job: runs the maneuver planner for one `plans` row on the body of the profile
 * version it was requested for, in a worker thread, storing progress (at most about once a second)
 * and finally the ranked candidates or the error. A planner failure is stored, not retried (the
 * planner is deterministic, so it would repeat); the queue retries a plan whose worker died, and the
 * final write happens only while the plan is still open, so a retried plan stores one result.
 * A cancelled plan (its row set to `cancelled` by a planner or an admin, from any process) is seen
 * within about a second and its planner thread is terminated.
 */
import { and, eq, inArray } from 'drizzle-orm';

import { plans, profileVersions } from '../../db/schema/index.ts';
import { readStored } from '../../db/stored-json.ts';
import type { JobState } from '../../shared/contracts/job-state.ts';
import { sequenceTargetSchema } from '../../shared/contracts/maneuver.ts';
import { planRequestSchema } from '../../shared/contracts/plan.ts';
import type { AppContext } from '../app-context.ts';
import { recordAudit } from '../audit/record-audit.ts';
import { profileBody } from '../crew/profile-row.ts';
import { ENGINE_VERSION } from '../engine/version.ts';
import { PlanStoppedError, PlanUnreachableError, runPlannerThread } from '../planning/run-planner-thread.ts';
import { PLAN_QUEUE } from './queue-names.ts';

/** Job payload. */
export interface PlanJob {
  planId: string;
}

const OPEN: JobState[] = ['queued', 'running'];
const isOpen = (id: string) => and(eq(plans.id, id), inArray(plans.state, OPEN));

/** Least time between progress writes, ms. */
const PROGRESS_EVERY_MS = 1000;

/** How often a running plan checks whether it was cancelled, ms. */
const CANCEL_CHECK_MS = 1000;

/** Runs one plan; never throws for planner failures (they are stored on the row). */
export async function runPlan(ctx: AppContext, job: PlanJob, opts: { signal?: AbortSignal; checkEveryMs?: number } = {}): Promise<void> {
  const { db } = ctx;
  const [plan] = await db.select().from(plans).where(eq(plans.id, job.planId));
  if (!plan || !OPEN.includes(plan.state)) return; // unknown, or a duplicate job of a finished plan
  const started = Date.now();
  await db.update(plans).set({ state: 'running', startedAt: new Date(started), progress: 0, progressNote: 'starting', engineVersion: ENGINE_VERSION }).where(isOpen(plan.id));

  let lastWrite = 0;
  let pending: Promise<unknown> = Promise.resolve();
  const onProgress = (fraction: number, note: string) => {
    const now = Date.now();
    if (now - lastWrite < PROGRESS_EVERY_MS) return;
    lastWrite = now;
    pending = pending.then(() => db.update(plans).set({ progress: fraction, progressNote: note }).where(isOpen(plan.id)));
  };
  // Stop the thread when the plan is closed by someone else (cancelled) or the queue takes the job back.
  const stop = new AbortController();
  const onJobAbort = () => stop.abort();
  opts.signal?.addEventListener('abort', onJobAbort, { once: true });
  const watch = setInterval(() => {
    void db.select({ state: plans.state }).from(plans).where(eq(plans.id, plan.id))
      .then(([r]) => { if (!r || !OPEN.includes(r.state)) stop.abort(); })
      .catch(() => undefined);
  }, opts.checkEveryMs ?? CANCEL_CHECK_MS);
  watch.unref();
  try {
    const [profile] = await db.select().from(profileVersions).where(eq(profileVersions.id, plan.profileVersionId));
    if (!profile) throw new Error(`profile version ${plan.profileVersionId} not found`);
    const { candidates, notes } = await runPlannerThread({
      body: profileBody(profile),
      target: readStored(sequenceTargetSchema, plan.target, 'plans.target'),
      settings: readStored(planRequestSchema, plan.settings, 'plans.settings'),
    }, onProgress, undefined, stop.signal);
    await pending;
    await db.transaction(async (tx) => {
      const stored = await tx.update(plans).set({ state: 'done', progress: 1, progressNote: 'done', candidates, notes, finishedAt: new Date() }).where(isOpen(plan.id)).returning({ id: plans.id });
      if (!stored.length) return; // another attempt finished it first
      await recordAudit(tx, {
        actorId: null, action: 'plan.done', objectType: 'plan', objectId: plan.id,
        detail: { sequenceId: plan.sequenceId, candidates: candidates.length, bestErrorDeg: candidates[0]?.errorDeg ?? null, elapsedS: (Date.now() - started) / 1000 },
      });
    });
  } catch (err) {
    await pending.catch(() => {});
    if (err instanceof PlanStoppedError) {
      // Cancelled: the row already says so. Taken back by the queue: another attempt runs it.
      if (opts.signal?.aborted) throw new Error('the queue took this plan back (cancelled or its claim expired)');
      return;
    }
    const message = err instanceof Error ? err.message : String(err);
    ctx.logger.warn({ err, job }, 'planning failed');
    const stored = await db.update(plans).set({ state: 'failed', error: message, notes: err instanceof PlanUnreachableError ? err.notes : [], finishedAt: new Date() }).where(isOpen(plan.id)).returning({ id: plans.id });
    if (stored.length) await recordAudit(db, { actorId: null, action: 'plan.failed', objectType: 'plan', objectId: plan.id, detail: { sequenceId: plan.sequenceId, error: message } });
  } finally {
    clearInterval(watch);
    opts.signal?.removeEventListener('abort', onJobAbort);
  }
}

/**
 * Cancels an open plan (state `cancelled`, the reason kept in `error`); its planner thread stops
 * within about a second wherever it runs. False when the plan had already ended.
 */
export async function cancelPlan(ctx: AppContext, planId: string, reason: string): Promise<boolean> {
  const rows = await ctx.db.update(plans).set({ state: 'cancelled', error: reason, finishedAt: new Date() })
    .where(isOpen(planId)).returning({ id: plans.id });
  if (!rows.length) return false;
  // A queued job would only find a closed plan; cancelling it keeps the queue's counts honest.
  const boss = ctx.jobs?.boss;
  if (boss) {
    const live = (await boss.findJobs(PLAN_QUEUE, { data: { planId } })).filter((j) => j.state === 'created' || j.state === 'retry' || j.state === 'active');
    if (live.length) await boss.cancel(PLAN_QUEUE, live.map((j) => j.id));
  }
  return true;
}
