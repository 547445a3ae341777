/**
 * Nothing stays `queued` or `running` without a job behind it. Worker processes run this at start and
 * then every supervisor interval: for each open plan, re-verification and robustness chunk it looks
 * up the record's jobs; when none is queued or active any more, the record either gets a job again
 * (it never had one, e.g. it was saved while no queue ran, or its job was lost with a dead process
 * before heartbeats existed) or ends `failed` with the reason its last job ended with (retries used
 * up by workers that died).
 */
import { and, eq, inArray, isNull, lt } from 'drizzle-orm';
import type { PgBoss } from 'pg-boss';

import { invitations, plans, reverifications, robustnessChunks, robustnessRuns } from '../../db/schema/index.ts';
import type { AppContext } from '../app-context.ts';
import { recordAudit } from '../audit/record-audit.ts';
import type { InvitationMailJob } from '../team/deliver-invitation.ts';
import { INVITATION_MAIL_QUEUE, PLAN_QUEUE, REVERIFY_QUEUE, ROBUSTNESS_CHUNK_QUEUE } from './queue-names.ts';
import type { ReverifyJob } from './reverify-version.ts';
import { enqueueRobustnessChunks, failRobustnessRun, OPEN_STATES } from './robustness/robustness-runs.ts';
import type { PlanJob } from './run-plan.ts';

/** Records younger than this may not have their job yet (it is sent after the record commits). */
const GRACE_MS = 5000;

type JobState = 'created' | 'retry' | 'active' | 'completed' | 'cancelled' | 'failed';
const LIVE: JobState[] = ['created', 'retry', 'active'];

/** What became of a record's jobs. */
type Verdict = { kind: 'live' } | { kind: 'none' } | { kind: 'ended'; reason: string };

async function verdict(boss: PgBoss, queue: string, data: object): Promise<Verdict> {
  const jobs = await boss.findJobs(queue, { data });
  if (!jobs.length) return { kind: 'none' };
  if (jobs.some((j) => LIVE.includes(j.state))) return { kind: 'live' };
  const last = [...jobs].sort((a, b) => +(b.completedOn ?? b.createdOn) - +(a.completedOn ?? a.createdOn))[0];
  return { kind: 'ended', reason: jobEndReason(last.state, last.output, last.retryCount) };
}

/** A plain reason from a finished job's state and output (pg-boss stores the error there). */
export function jobEndReason(state: string, output: unknown, retryCount: number): string {
  const o = output as { message?: unknown; value?: unknown } | null;
  const detail = typeof o?.message === 'string' ? o.message : typeof o?.value === 'string' ? o.value : null;
  if (state === 'cancelled') return 'its job was cancelled';
  if (state === 'completed') return 'its job ended without storing a result';
  const attempts = retryCount + 1;
  return `the worker running it stopped or failed ${attempts === 1 ? 'once' : `${attempts} times`}${detail ? ` (${detail})` : ''}; start it again`;
}

export interface JobSender {
  boss: PgBoss;
  enqueuePlan?(planId: string): Promise<void>;
  enqueueReverification(ids: string[], toProfileVersionId: string): Promise<void>;
  enqueueInvitationMail?(invitationId: string): Promise<void>;
}

/** One reconciliation pass; returns how many records it re-queued and failed. */
export async function reconcileWork(ctx: AppContext, queue: JobSender): Promise<{ requeued: number; failed: number }> {
  const { db } = ctx;
  const before = new Date(Date.now() - GRACE_MS);
  let requeued = 0;
  let failed = 0;

  const openPlans = await db.select({ id: plans.id, sequenceId: plans.sequenceId }).from(plans)
    .where(and(inArray(plans.state, [...OPEN_STATES]), lt(plans.createdAt, before)));
  for (const p of openPlans) {
    const v = await verdict(queue.boss, PLAN_QUEUE, { planId: p.id } satisfies PlanJob);
    if (v.kind === 'live') continue;
    if (v.kind === 'none' && queue.enqueuePlan) {
      await queue.enqueuePlan(p.id);
      requeued++;
      continue;
    }
    const reason = v.kind === 'ended' ? `Planning did not finish: ${v.reason}.` : 'Planning did not finish: no worker handles planning here.';
    const [row] = await db.update(plans).set({ state: 'failed', error: reason, finishedAt: new Date() })
      .where(and(eq(plans.id, p.id), inArray(plans.state, [...OPEN_STATES]))).returning({ id: plans.id });
    if (row) {
      failed++;
      await recordAudit(db, { actorId: null, action: 'plan.failed', objectType: 'plan', objectId: p.id, detail: { sequenceId: p.sequenceId, error: reason } });
    }
  }

  const openReverifications = await db.select().from(reverifications)
    .where(and(inArray(reverifications.state, [...OPEN_STATES]), lt(reverifications.createdAt, before)));
  for (const r of openReverifications) {
    const v = await verdict(queue.boss, REVERIFY_QUEUE, { sequenceVersionId: r.sequenceVersionId, toProfileVersionId: r.toProfileVersionId } satisfies ReverifyJob);
    if (v.kind === 'live') continue;
    if (v.kind === 'none') {
      await queue.enqueueReverification([r.sequenceVersionId], r.toProfileVersionId);
      requeued++;
      continue;
    }
    const reason = `Re-verification did not finish: ${v.reason}.`;
    const [row] = await db.update(reverifications).set({ state: 'failed', error: reason, finishedAt: new Date() })
      .where(and(eq(reverifications.id, r.id), inArray(reverifications.state, [...OPEN_STATES]))).returning({ id: reverifications.id });
    if (row) failed++;
  }

  const openChunks = await db.select({ runId: robustnessChunks.runId, chunk: robustnessChunks.chunkIndex, state: robustnessChunks.state })
    .from(robustnessChunks)
    .innerJoin(robustnessRuns, eq(robustnessRuns.id, robustnessChunks.runId))
    .where(and(inArray(robustnessRuns.state, [...OPEN_STATES]), inArray(robustnessChunks.state, [...OPEN_STATES]), lt(robustnessRuns.createdAt, before)));
  const resend = new Map<string, number[]>();
  for (const c of openChunks) {
    const v = await verdict(queue.boss, ROBUSTNESS_CHUNK_QUEUE, { runId: c.runId, chunk: c.chunk });
    if (v.kind === 'live') continue;
    if (v.kind === 'none') {
      if (c.state === 'running') await db.update(robustnessChunks).set({ state: 'queued' }).where(and(eq(robustnessChunks.runId, c.runId), eq(robustnessChunks.chunkIndex, c.chunk)));
      resend.set(c.runId, [...(resend.get(c.runId) ?? []), c.chunk]);
      continue;
    }
    // The job may have finished this chunk since the list was read: fail the run only if it is still open.
    const [now] = await db.select({ state: robustnessChunks.state }).from(robustnessChunks)
      .where(and(eq(robustnessChunks.runId, c.runId), eq(robustnessChunks.chunkIndex, c.chunk)));
    if (!now || !(OPEN_STATES as readonly string[]).includes(now.state)) continue;
    if (await failRobustnessRun(ctx, c.runId, `Robustness run did not finish: ${v.reason}.`, c.chunk)) failed++;
  }
  for (const [runId, chunks] of resend) {
    await enqueueRobustnessChunks(ctx, queue.boss, runId, chunks);
    requeued += chunks.length;
  }

  // Invitation e-mails still `sending` whose job was lost get one; ones whose jobs all ended are `failed` (the admin resends).
  const sending = await db.select({ id: invitations.id }).from(invitations)
    .where(and(eq(invitations.mailState, 'sending'), isNull(invitations.acceptedAt), isNull(invitations.revokedAt), lt(invitations.createdAt, before)));
  for (const inv of sending) {
    const v = await verdict(queue.boss, INVITATION_MAIL_QUEUE, { invitationId: inv.id } satisfies InvitationMailJob);
    if (v.kind === 'live') continue;
    if (v.kind === 'none' && queue.enqueueInvitationMail) {
      await queue.enqueueInvitationMail(inv.id);
      requeued++;
      continue;
    }
    const reason = v.kind === 'ended' ? `Sending stopped: ${v.reason}.` : 'No worker sends e-mail here.';
    const [row] = await db.update(invitations).set({ mailState: 'failed', mailError: reason })
      .where(and(eq(invitations.id, inv.id), eq(invitations.mailState, 'sending'))).returning({ id: invitations.id });
    if (row) failed++;
  }
  return { requeued, failed };
}
