/**
 * The planning job: runs the maneuver planner for one `plans` row on the body of the profile
 * version it was requested for, in a worker thread, storing progress (at most about once a second)
 * and finally the ranked candidates or the error. A planner failure is stored, not retried (the
 * planner is deterministic, so it would repeat); the queue retries a plan whose worker died, and the
 * final write happens only while the plan is still open, so a retried plan stores one result.
 */
import { and, eq, inArray } from 'drizzle-orm';

import { plans, profileVersions } from '../../db/schema/index.ts';
import type { Body } from '../../shared/contracts/body.ts';
import { sequenceTargetSchema } from '../../shared/contracts/maneuver.ts';
import { planRequestSchema } from '../../shared/contracts/plan.ts';
import type { AppContext } from '../app-context.ts';
import { recordAudit } from '../audit/record-audit.ts';
import { ENGINE_VERSION } from '../engine/version.ts';
import { runPlannerThread } from '../planning/run-planner-thread.ts';

/** Job payload. */
export interface PlanJob {
  planId: string;
}

const OPEN = ['queued', 'running'];
const isOpen = (id: string) => and(eq(plans.id, id), inArray(plans.state, OPEN));

/** Least time between progress writes, ms. */
const PROGRESS_EVERY_MS = 1000;

/** Runs one plan; never throws for planner failures (they are stored on the row). */
export async function runPlan(ctx: AppContext, job: PlanJob): Promise<void> {
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
  try {
    const [profile] = await db.select().from(profileVersions).where(eq(profileVersions.id, plan.profileVersionId));
    if (!profile) throw new Error(`profile version ${plan.profileVersionId} not found`);
    const candidates = await runPlannerThread({
      body: profile.body as Body,
      target: sequenceTargetSchema.parse(plan.target),
      settings: planRequestSchema.parse(plan.settings),
    }, onProgress);
    await pending;
    await db.transaction(async (tx) => {
      const stored = await tx.update(plans).set({ state: 'done', progress: 1, progressNote: 'done', candidates, finishedAt: new Date() }).where(isOpen(plan.id)).returning({ id: plans.id });
      if (!stored.length) return; // another attempt finished it first
      await recordAudit(tx, {
        actorId: null, action: 'plan.done', objectType: 'plan', objectId: plan.id,
        detail: { sequenceId: plan.sequenceId, candidates: candidates.length, bestErrorDeg: candidates[0]?.errorDeg ?? null, elapsedS: (Date.now() - started) / 1000 },
      });
    });
  } catch (err) {
    await pending.catch(() => {});
    const message = err instanceof Error ? err.message : String(err);
    ctx.logger.warn({ err, job }, 'planning failed');
    const stored = await db.update(plans).set({ state: 'failed', error: message, finishedAt: new Date() }).where(isOpen(plan.id)).returning({ id: plans.id });
    if (stored.length) await recordAudit(db, { actorId: null, action: 'plan.failed', objectType: 'plan', objectId: plan.id, detail: { sequenceId: plan.sequenceId, error: message } });
  }
}
