/**
 * Nothing stays `queued` or `running` without a job behind it. Worker processes run this at start and
 * then every supervisor interval: for each open plan, re-verification and robustness chunk it looks
 * up the record's jobs; when none is queued or active any more, the record either gets a job again
 * (it never had one, e.g. it was saved while no queue ran, or its job was lost with a dead process
 * before heartbeats existed) or ends `failed` with the reason its last job ended with (retries used
 * up by workers that died). A robustness run whose samples are all in is finished (its figures computed).
 */
import { and, eq, gte, inArray, isNull, lt } from 'drizzle-orm';
import type { JobWithMetadata, PgBoss } from 'pg-boss';
import { z } from 'zod';

import { invitations, plans, reverifications, robustnessChunks, robustnessRuns } from '../../db/schema/index.ts';
import type { AppContext } from '../app-context.ts';
import { recordAudit } from '../audit/record-audit.ts';
import type { InvitationMailJob } from '../team/deliver-invitation.ts';
import { INVITATION_MAIL_QUEUE, PLAN_QUEUE, REVERIFY_QUEUE, ROBUSTNESS_CHUNK_QUEUE } from './queue-names.ts';
import type { ReverifyJob } from './reverify-version.ts';
import { enqueueRobustnessChunks, failRobustnessRun, finishRobustnessRun, OPEN_STATES } from './robustness/robustness-runs.ts';
import type { PlanJob } from './run-plan.ts';

/** Records younger than this may not have their job yet (it is sent after the record commits). */
const GRACE_MS = 5000;

/** pg-boss's own job states (not a record's JobState in shared/contracts/job-state.ts): these still run or will. */
const LIVE: JobWithMetadata['state'][] = ['created', 'retry', 'active'];

/** What became of a record's jobs. */
type Verdict = { kind: 'live' } | { kind: 'none' } | { kind: 'ended'; reason: string };

async function verdict(boss: PgBoss, queue: string, data: object): Promise<Verdict> {
  const jobs = await boss.findJobs(queue, { data });
  if (!jobs.length) return { kind: 'none' };
  if (jobs.some((j) => LIVE.includes(j.state))) return { kind: 'live' };
  const last = [...jobs].sort((a, b) => +(b.completedOn ?? b.createdOn) - +(a.completedOn ?? a.createdOn))[0];
  return { kind: 'ended', reason: jobEndReason(last.state, last.output, last.retryCount) };
}

/** A failed job's output as pg-boss stores it: the Error's fields, or `value` for anything else thrown. */
const failureOutputSchema = z.union([z.object({ message: z.string() }), z.object({ value: z.string() })]);

/** A plain reason from a finished job's state and output (pg-boss stores the error there). */
export function jobEndReason(state: string, output: unknown, retryCount: number): string {
  const failure = failureOutputSchema.safeParse(output);
  const detail = !failure.success ? null : 'message' in failure.data ? failure.data.message : failure.data.value;
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

/** One kind of open record, and how to settle one whose jobs are gone. */
interface OpenRecords<R> {
  queue: string;
  /** The job data that finds the record's jobs. */
  job(record: R): object;
  /** Sends the record a job again; absent where no worker here handles the kind (the record fails). */
  requeue?: (record: R) => Promise<void>;
  /**
   * Ends the record `failed`: `ended` is why its last job ended, null when it never had one and none
   * can be sent. True when this pass changed the record (it may have finished meanwhile).
   */
  fail(record: R, ended: string | null): Promise<boolean>;
}

/** Gives each record whose jobs are all gone a job again, or ends it `failed`; counts both. */
async function settle<R>(boss: PgBoss, records: readonly R[], kind: OpenRecords<R>, count: { requeued: number; failed: number }): Promise<void> {
  for (const record of records) {
    const v = await verdict(boss, kind.queue, kind.job(record));
    if (v.kind === 'live') continue;
    if (v.kind === 'none' && kind.requeue) {
      await kind.requeue(record);
      count.requeued++;
    } else if (await kind.fail(record, v.kind === 'ended' ? v.reason : null)) count.failed++;
  }
}

/** One reconciliation pass; returns how many records it re-queued and failed. */
export async function reconcileWork(ctx: AppContext, queue: JobSender): Promise<{ requeued: number; failed: number }> {
  const { db } = ctx;
  const before = new Date(Date.now() - GRACE_MS);
  const count = { requeued: 0, failed: 0 };

  const openPlans = await db.select({ id: plans.id, sequenceId: plans.sequenceId }).from(plans)
    .where(and(inArray(plans.state, [...OPEN_STATES]), lt(plans.createdAt, before)));
  await settle(queue.boss, openPlans, {
    queue: PLAN_QUEUE,
    job: (p) => ({ planId: p.id }) satisfies PlanJob,
    requeue: queue.enqueuePlan && ((p) => queue.enqueuePlan!(p.id)),
    fail: async (p, ended) => {
      const reason = ended ? `Planning did not finish: ${ended}.` : 'Planning did not finish: no worker handles planning here.';
      const [row] = await db.update(plans).set({ state: 'failed', error: reason, finishedAt: new Date() })
        .where(and(eq(plans.id, p.id), inArray(plans.state, [...OPEN_STATES]))).returning({ id: plans.id });
      if (row) await recordAudit(db, { actorId: null, action: 'plan.failed', objectType: 'plan', objectId: p.id, detail: { sequenceId: p.sequenceId, error: reason } });
      return Boolean(row);
    },
  }, count);

  const openReverifications = await db.select().from(reverifications)
    .where(and(inArray(reverifications.state, [...OPEN_STATES]), lt(reverifications.createdAt, before)));
  await settle(queue.boss, openReverifications, {
    queue: REVERIFY_QUEUE,
    job: (r) => ({ sequenceVersionId: r.sequenceVersionId, toProfileVersionId: r.toProfileVersionId }) satisfies ReverifyJob,
    requeue: (r) => queue.enqueueReverification([r.sequenceVersionId], r.toProfileVersionId),
    fail: async (r, ended) => {
      const [row] = await db.update(reverifications).set({ state: 'failed', error: `Re-verification did not finish: ${ended ?? 'it had no job'}.`, finishedAt: new Date() })
        .where(and(eq(reverifications.id, r.id), inArray(reverifications.state, [...OPEN_STATES]))).returning({ id: reverifications.id });
      return Boolean(row);
    },
  }, count);

  // A run whose samples are all in but whose figures are not (its last merging worker died in between) is finished here.
  const complete = await db.select({ id: robustnessRuns.id }).from(robustnessRuns)
    .where(and(inArray(robustnessRuns.state, [...OPEN_STATES]), gte(robustnessRuns.doneSamples, robustnessRuns.samples)));
  for (const run of complete) await finishRobustnessRun(ctx, run.id);

  const openChunks = await db.select({ runId: robustnessChunks.runId, chunk: robustnessChunks.chunkIndex, state: robustnessChunks.state })
    .from(robustnessChunks)
    .innerJoin(robustnessRuns, eq(robustnessRuns.id, robustnessChunks.runId))
    .where(and(inArray(robustnessRuns.state, [...OPEN_STATES]), inArray(robustnessChunks.state, [...OPEN_STATES]), lt(robustnessRuns.createdAt, before)));
  // Chunks without a job are sent again one batch per run, after the pass.
  const resend = new Map<string, number[]>();
  const chunkWhere = (c: { runId: string; chunk: number }) => and(eq(robustnessChunks.runId, c.runId), eq(robustnessChunks.chunkIndex, c.chunk));
  await settle(queue.boss, openChunks, {
    queue: ROBUSTNESS_CHUNK_QUEUE,
    job: (c) => ({ runId: c.runId, chunk: c.chunk }),
    requeue: async (c) => {
      if (c.state === 'running') await db.update(robustnessChunks).set({ state: 'queued' }).where(chunkWhere(c));
      resend.set(c.runId, [...(resend.get(c.runId) ?? []), c.chunk]);
    },
    fail: async (c, ended) => {
      // The job may have finished this chunk since the list was read: fail the run only if it is still open.
      const [now] = await db.select({ state: robustnessChunks.state }).from(robustnessChunks).where(chunkWhere(c));
      if (!now || !(OPEN_STATES as readonly string[]).includes(now.state)) return false;
      return failRobustnessRun(ctx, c.runId, `Robustness run did not finish: ${ended ?? 'it had no job'}.`, c.chunk);
    },
  }, count);
  for (const [runId, chunks] of resend) await enqueueRobustnessChunks(ctx, queue.boss, runId, chunks);

  // Invitation e-mails still `sending` whose job was lost get one; ones whose jobs all ended are `failed` (the admin resends).
  const sending = await db.select({ id: invitations.id }).from(invitations)
    .where(and(eq(invitations.mailState, 'sending'), isNull(invitations.acceptedAt), isNull(invitations.revokedAt), lt(invitations.createdAt, before)));
  await settle(queue.boss, sending, {
    queue: INVITATION_MAIL_QUEUE,
    job: (inv) => ({ invitationId: inv.id }) satisfies InvitationMailJob,
    requeue: queue.enqueueInvitationMail && ((inv) => queue.enqueueInvitationMail!(inv.id)),
    fail: async (inv, ended) => {
      const reason = ended ? `Sending stopped: ${ended}.` : 'No worker sends e-mail here.';
      const [row] = await db.update(invitations).set({ mailState: 'failed', mailError: reason })
        .where(and(eq(invitations.id, inv.id), eq(invitations.mailState, 'sending'))).returning({ id: invitations.id });
      return Boolean(row);
    },
  }, count);
  return count;
}
