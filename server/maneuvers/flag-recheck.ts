/**
 * Reaction to a crew member's current profile changing: every cleared or under-review version of
 * their sequences bound to another profile version becomes `recheck` (with `staleSince`) and gets a
 * queued re-verification record — inside the transaction that saves the profile, so the save and its
 * flags commit together or not at all. The queued records are the outbox: their jobs are sent after
 * commit, and the workers' reconcile pass sends any that a crash in between left without one.
 */
import { and, eq, inArray, isNotNull, ne } from 'drizzle-orm';

import type { Database } from '../../db/client.ts';
import { reverifications, sequences, sequenceVersions } from '../../db/schema/index.ts';
import type { StaleVersion } from '../../shared/contracts/profile-version.ts';
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
  /** Per flagged version: its status before the save and whether it had been cleared (for the save's answer). */
  details: { versionId: string; was: 'cleared' | 'under_review' | 'recheck'; onceCleared: boolean }[];
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
  const details: FlaggedVersions['details'] = [];
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
    details.push({ versionId: v.id, was: v.status === 'cleared' ? 'cleared' : 'under_review', onceCleared: v.clearedAt !== null });
  }
  // A once-cleared version still waiting for its re-check is re-checked on this newer profile too
  // (its earlier re-verification then saves nothing: its profile is no longer current).
  const waiting = await tx
    .select({ v: sequenceVersions })
    .from(sequenceVersions)
    .innerJoin(sequences, eq(sequences.id, sequenceVersions.sequenceId))
    .where(and(
      eq(sequences.crewMemberId, cause.crewMemberId), eq(sequenceVersions.status, 'recheck'), isNotNull(sequenceVersions.clearedAt),
      ne(sequenceVersions.profileVersionId, cause.profileVersionId),
    ));
  const justFlagged = new Set(versionIds);
  for (const { v } of waiting) {
    if (justFlagged.has(v.id)) continue;
    await tx.insert(reverifications).values({ sequenceVersionId: v.id, fromProfileVersionId: v.profileVersionId, toProfileVersionId: cause.profileVersionId });
    await recordAudit(tx, {
      actorId: cause.actorId, action: 'sequence_version.recheck', objectType: 'sequence_version', objectId: v.id,
      detail: { from: v.status, fromProfileVersionId: v.profileVersionId, toProfileVersionId: cause.profileVersionId },
    });
    versionIds.push(v.id);
    details.push({ versionId: v.id, was: 'recheck', onceCleared: true });
  }
  return { toProfileVersionId: cause.profileVersionId, versionIds, details };
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

/** The flagged versions as the profile save's answer lists them (maneuver name and number). */
export async function staleVersionsOf(db: Database, flagged: readonly FlaggedVersions[]): Promise<StaleVersion[]> {
  const details = flagged.flatMap((f) => f.details);
  if (!details.length) return [];
  const rows = await db.select({ id: sequenceVersions.id, sequenceId: sequences.id, name: sequences.name, version: sequenceVersions.version })
    .from(sequenceVersions).innerJoin(sequences, eq(sequences.id, sequenceVersions.sequenceId))
    .where(inArray(sequenceVersions.id, details.map((d) => d.versionId)));
  const byId = new Map(rows.map((r) => [r.id, r]));
  return details.flatMap((d) => {
    const r = byId.get(d.versionId);
    return r ? [{ versionId: d.versionId, sequenceId: r.sequenceId, sequenceName: r.name, version: r.version, was: d.was, onceCleared: d.onceCleared }] : [];
  }).sort((a, b) => a.sequenceName.localeCompare(b.sequenceName) || a.version - b.version);
}
