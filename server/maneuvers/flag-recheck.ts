/**
 * Reaction to a crew member's current profile changing: every cleared or under-review version of
 * their sequences bound to another profile version becomes `recheck` (with `staleSince`), gets a
 * queued re-verification record, and is handed to the job queue — the request that saved the
 * profile never waits for the recomputation.
 */
import { and, eq, inArray, ne } from 'drizzle-orm';

import { reverifications, sequences, sequenceVersions } from '../../db/schema/index.ts';
import type { AppContext } from '../app-context.ts';
import { recordAudit } from '../audit/record-audit.ts';
import { onProfileVersionChanged, type ProfileVersionChanged } from '../crew/profile-events.ts';
import { statusesAllowing, transition } from './status-machine.ts';

/** Flags and enqueues; returns the ids of the versions flagged. */
export async function flagVersionsForRecheck(ctx: AppContext, event: ProfileVersionChanged): Promise<string[]> {
  const { db } = ctx;
  const flagged = await db.transaction(async (tx) => {
    const rows = await tx
      .select({ v: sequenceVersions })
      .from(sequenceVersions)
      .innerJoin(sequences, eq(sequences.id, sequenceVersions.sequenceId))
      .where(and(
        eq(sequences.crewMemberId, event.crewMemberId),
        inArray(sequenceVersions.status, statusesAllowing('profile_changed')),
        ne(sequenceVersions.profileVersionId, event.profileVersionId),
      ));
    const ids: string[] = [];
    const now = new Date();
    for (const { v } of rows) {
      const to = transition(v.status, 'profile_changed')!;
      const done = await tx.update(sequenceVersions).set({ status: to, staleSince: now })
        .where(and(eq(sequenceVersions.id, v.id), eq(sequenceVersions.status, v.status))).returning({ id: sequenceVersions.id });
      if (!done.length) continue;
      await tx.insert(reverifications).values({ sequenceVersionId: v.id, fromProfileVersionId: v.profileVersionId, toProfileVersionId: event.profileVersionId });
      await recordAudit(tx, {
        actorId: event.actorId, action: 'sequence_version.recheck', objectType: 'sequence_version', objectId: v.id,
        detail: { from: v.status, fromProfileVersionId: v.profileVersionId, toProfileVersionId: event.profileVersionId },
      });
      ids.push(v.id);
    }
    return ids;
  });
  if (flagged.length) {
    if (ctx.jobs) await ctx.jobs.enqueueReverification(flagged, event.profileVersionId);
    else ctx.logger.warn({ count: flagged.length }, 'no job queue running: re-verification records stay queued');
  }
  return flagged;
}

let subscribed = false;
/** Subscribes the sequences area to profile changes once per process. */
export function subscribeToProfileChanges(): void {
  if (subscribed) return;
  subscribed = true;
  onProfileVersionChanged((ctx, event) => flagVersionsForRecheck(ctx, event).then(() => undefined));
}
