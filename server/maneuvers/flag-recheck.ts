/**
 * Reaction to a crew member's current profile changing: every cleared or under-review version of
 * their sequences bound to another profile version becomes `recheck` (with `staleSince`) and gets a
 * queued re-verification record — inside the transaction that saves the profile, so the save and its
 * flags commit together or not at all. The queued records are the outbox: their jobs are sent after
 * commit, and the workers' reconcile pass sends any that a crash in between left without one.
 */
import { and, eq, inArray, ne } from 'drizzle-orm';

import type { Database } from '../../db/client.ts';
import { reverifications, sequences, sequenceVersions } from '../../db/schema/index.ts';
import type { AppContext } from '../app-context.ts';
import { recordAudit } from '../audit/record-audit.ts';
import { statusesAllowing, transition } from './status-machine.ts';

/** An open transaction of the app database. */
type Tx = Parameters<Parameters<Database['transaction']>[0]>[0];

/** The profile change that makes versions stale. */
export interface StaleCause {
  crewMemberId: string;
  /** The new current profile version. */
  profileVersionId: string;
  /** Who saved it; null for the seed. */
  actorId: string | null;
}

/** Versions flagged by one profile change, waiting for their re-verification jobs. */
export interface FlaggedVersions {
  toProfileVersionId: string;
  versionIds: string[];
}

/** Flags the stale versions inside `tx` and writes their queued re-verification records; returns the ids flagged. */
export async function flagStaleVersions(tx: Tx, cause: StaleCause): Promise<FlaggedVersions> {
  const rows = await tx
    .select({ v: sequenceVersions })
    .from(sequenceVersions)
    .innerJoin(sequences, eq(sequences.id, sequenceVersions.sequenceId))
    .where(and(
      eq(sequences.crewMemberId, cause.crewMemberId),
      inArray(sequenceVersions.status, statusesAllowing('profile_changed')),
      ne(sequenceVersions.profileVersionId, cause.profileVersionId),
    ));
  const versionIds: string[] = [];
  const now = new Date();
  for (const { v } of rows) {
    const to = transition(v.status, 'profile_changed')!;
    const done = await tx.update(sequenceVersions).set({ status: to, staleSince: now })
      .where(and(eq(sequenceVersions.id, v.id), eq(sequenceVersions.status, v.status))).returning({ id: sequenceVersions.id });
    if (!done.length) continue;
    await tx.insert(reverifications).values({ sequenceVersionId: v.id, fromProfileVersionId: v.profileVersionId, toProfileVersionId: cause.profileVersionId });
    await recordAudit(tx, {
      actorId: cause.actorId, action: 'sequence_version.recheck', objectType: 'sequence_version', objectId: v.id,
      detail: { from: v.status, fromProfileVersionId: v.profileVersionId, toProfileVersionId: cause.profileVersionId },
    });
    versionIds.push(v.id);
  }
  return { toProfileVersionId: cause.profileVersionId, versionIds };
}

/**
 * After commit: hands the flagged versions' re-verifications to the job queue. A failure here loses
 * nothing (the records stay `queued` and the reconcile pass sends their jobs), so it is logged, not thrown.
 */
export async function sendRecheckJobs(ctx: AppContext, flagged: readonly FlaggedVersions[]): Promise<void> {
  for (const f of flagged) {
    if (!f.versionIds.length) continue;
    if (!ctx.jobs) {
      ctx.logger.warn({ count: f.versionIds.length }, 'no job queue running: re-verification records stay queued');
      continue;
    }
    try {
      await ctx.jobs.enqueueReverification(f.versionIds, f.toProfileVersionId);
    } catch (err) {
      ctx.logger.error({ err, flagged: f }, 'could not send re-verification jobs; the reconcile pass will');
    }
  }
}
