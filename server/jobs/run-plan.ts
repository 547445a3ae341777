/**
 * The planning job: runs the maneuver planner for one `plans` row on the body of the profile
 * version it was requested for, in a worker thread, storing progress (at most about once a second)
 * and finally the ranked candidates or the error. Not retried: the planner is deterministic, so a
 * failure would repeat.
 */
import { eq } from 'drizzle-orm';

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

/** Least time between progress writes, ms. */
const PROGRESS_EVERY_MS = 1000;

/** Runs one plan; never throws for planner failures (they are stored on the row). */
export async function runPlan(ctx: AppContext, job: PlanJob): Promise<void> {
  const { db } = ctx;
  const [plan] = await db.select().from(plans).where(eq(plans.id, job.planId));
  if (!plan || plan.state === 'done' || plan.state === 'failed') return; // unknown or a duplicate job
  const started = Date.now();
  await db.update(plans).set({ state: 'running', startedAt: new Date(started), progress: 0, progressNote: 'starting', engineVersion: ENGINE_VERSION }).where(eq(plans.id, plan.id));

  let lastWrite = 0;
  let pending: Promise<unknown> = Promise.resolve();
  const onProgress = (fraction: number, note: string) => {
    const now = Date.now();
    if (now - lastWrite < PROGRESS_EVERY_MS) return;
    lastWrite = now;
    pending = pending.then(() => db.update(plans).set({ progress: fraction, progressNote: note }).where(eq(plans.id, plan.id)));
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
      await tx.update(plans).set({ state: 'done', progress: 1, progressNote: 'done', candidates, finishedAt: new Date() }).where(eq(plans.id, plan.id));
      await recordAudit(tx, {
        actorId: null, action: 'plan.done', objectType: 'plan', objectId: plan.id,
        detail: { sequenceId: plan.sequenceId, candidates: candidates.length, bestErrorDeg: candidates[0]?.errorDeg ?? null, elapsedS: (Date.now() - started) / 1000 },
      });
    });
  } catch (err) {
    await pending.catch(() => {});
    const message = err instanceof Error ? err.message : String(err);
    ctx.logger.warn({ err, job }, 'planning failed');
    await db.update(plans).set({ state: 'failed', error: message, finishedAt: new Date() }).where(eq(plans.id, plan.id));
    await recordAudit(db, { actorId: null, action: 'plan.failed', objectType: 'plan', objectId: plan.id, detail: { sequenceId: plan.sequenceId, error: message } });
  }
}
