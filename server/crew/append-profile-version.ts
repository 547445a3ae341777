import { desc, eq } from 'drizzle-orm';

import type { Database } from '../../db/client.ts';
import { crewMembers, type ProfileVersionRow, profileVersions, users } from '../../db/schema/index.ts';
import type { Body } from '../../shared/contracts/body.ts';
import type { ProfileSource, ProfileSummary, StoredProfileInputs } from '../../shared/contracts/profile-version.ts';
import { ENGINE_VERSION } from '../engine/version.ts';
import { conflict, notFound } from '../http/http-error.ts';
import { type FlaggedVersions, flagStaleVersions } from '../maneuvers/flag-recheck.ts';

/** An open transaction of the app database. */
export type Tx = Parameters<Parameters<Database['transaction']>[0]>[0];

/** The content of a new profile version. */
export interface NewProfileVersion {
  crewMemberId: string;
  /** The version the author started from; must still be the latest (0: the member has none yet). */
  baseVersion: number;
  source: ProfileSource;
  inputs: StoredProfileInputs;
  body: Body;
  summary: ProfileSummary;
  note: string;
  authorId: string | null;
}

/**
 * Appends version N+1 and makes it current, inside the caller's transaction. The crew member row is
 * locked (SELECT … FOR UPDATE) first, so two concurrent saves on the same base serialise: the second
 * sees the first's version and gets 409 `stale_version` — never a lost update. In the same
 * transaction, versions approved or under review against another profile version are flagged for a
 * re-check (their queued re-verification records are the outbox; pass `flagged` to
 * `sendRecheckJobs` after commit).
 */
export async function appendProfileVersion(tx: Tx, v: NewProfileVersion): Promise<{ row: ProfileVersionRow; flagged: FlaggedVersions }> {
  const [member] = await tx.select().from(crewMembers).where(eq(crewMembers.id, v.crewMemberId)).for('update');
  if (!member) throw notFound('Crew member');
  if (member.archivedAt) throw conflict(`${member.name} is archived. Restore them on Crew before saving a profile version.`, 'archived');
  const latest = member.currentVersion ?? 0;
  if (latest > 0) {
    const [prev] = await tx
      .select({ id: profileVersions.id, createdAt: profileVersions.createdAt, author: users.name })
      .from(profileVersions)
      .leftJoin(users, eq(users.id, profileVersions.authorId))
      .where(eq(profileVersions.crewMemberId, v.crewMemberId))
      .orderBy(desc(profileVersions.version))
      .limit(1);
    if (v.baseVersion !== latest) {
      const who = prev?.author ? ` by ${prev.author}` : '';
      const when = prev ? ` at ${prev.createdAt.toISOString().slice(0, 16).replace('T', ' ')} UTC` : '';
      throw conflict(
        `This profile changed while you were editing: you started from version ${v.baseVersion}, but version ${latest} was saved${who}${when}. ` +
          'Nothing was saved. Reload the profile, check the newer version, then apply your change again.',
        'stale_version',
      );
    }
  } else if (v.baseVersion !== 0) {
    throw conflict(`This crew member has no profile yet, so there is no version ${v.baseVersion} to build on. Nothing was saved; reload and start from scratch.`, 'stale_version');
  }

  const [row] = await tx
    .insert(profileVersions)
    .values({
      crewMemberId: v.crewMemberId,
      version: latest + 1,
      source: v.source,
      inputs: v.inputs,
      body: v.body,
      summary: v.summary,
      engineVersion: ENGINE_VERSION,
      authorId: v.authorId,
      note: v.note,
    })
    .returning();
  await tx.update(crewMembers).set({ currentVersion: row.version }).where(eq(crewMembers.id, v.crewMemberId));
  const flagged = await flagStaleVersions(tx, { crewMemberId: v.crewMemberId, profileVersionId: row.id, actorId: v.authorId });
  return { row, flagged };
}
