/**
 * Loads a sequence version with what the rehearsal view needs (sequence, crew member, profile body)
 * and applies the object-level rule: a trainee sees only cleared versions of their own crew member.
 */
import { eq } from 'drizzle-orm';

import type { Database } from '../../db/client.ts';
import { crewMembers, profileVersions, sequences, sequenceVersions } from '../../db/schema/index.ts';
import type { SessionUser } from '../../shared/contracts/auth.ts';
import type { VersionStatus } from '../../shared/contracts/version-status.ts';
import { forbidden, notFound } from '../http/http-error.ts';

/** A version row joined with its sequence, crew member and profile body. */
export interface LoadedVersion {
  id: string;
  sequenceId: string;
  sequenceName: string;
  version: number;
  status: VersionStatus;
  crewMemberId: string;
  crewMemberName: string;
  target: unknown;
  /** compiled jsonb as stored (engine sequence contract, possibly wrapped with cues). */
  compiled: unknown;
  /** primitives jsonb as stored (the composer's list). */
  primitives: unknown;
  profileVersionId: string;
  /** profile_versions.body jsonb (body contract). */
  body: unknown;
  /** report jsonb as stored (the verification report; null before verification). */
  report: unknown;
  /** Engine version that verified it (null before verification). */
  engineVersion: string | null;
  clearedAt: Date | null;
}

/** Statuses a trainee may open in the player. */
export const PLAYABLE_FOR_TRAINEE: readonly VersionStatus[] = ['cleared'];

/** The version by id, or null. */
export async function loadVersion(db: Database, versionId: string): Promise<LoadedVersion | null> {
  const [row] = await db
    .select({ v: sequenceVersions, s: sequences, crewName: crewMembers.name, body: profileVersions.body })
    .from(sequenceVersions)
    .innerJoin(sequences, eq(sequences.id, sequenceVersions.sequenceId))
    .innerJoin(crewMembers, eq(crewMembers.id, sequences.crewMemberId))
    .innerJoin(profileVersions, eq(profileVersions.id, sequenceVersions.profileVersionId))
    .where(eq(sequenceVersions.id, versionId));
  if (!row) return null;
  return {
    id: row.v.id, sequenceId: row.s.id, sequenceName: row.s.name, version: row.v.version, status: row.v.status,
    crewMemberId: row.s.crewMemberId, crewMemberName: row.crewName, target: row.v.target, compiled: row.v.compiled, primitives: row.v.primitives,
    profileVersionId: row.v.profileVersionId, body: row.body, report: row.v.report, engineVersion: row.v.engineVersion, clearedAt: row.v.clearedAt,
  };
}

/** The few columns the access rule needs (no body, no steps). */
export interface VersionAccess {
  id: string;
  status: VersionStatus;
  crewMemberId: string;
  profileVersionId: string;
}

/** Applies the rehearsal view's rule to a version (see loadVersionFor). */
function assertPlayable(user: SessionUser, v: { status: VersionStatus; crewMemberId: string }): void {
  if (user.role !== 'trainee') return;
  if (!user.crewMemberId || v.crewMemberId !== user.crewMemberId) throw notFound('Sequence version');
  if (!PLAYABLE_FOR_TRAINEE.includes(v.status)) {
    throw forbidden(v.status === 'recheck'
      ? 'This version needs a re-check after a profile change; rehearse it again once it is cleared.'
      : 'Only cleared versions can be rehearsed.');
  }
}

/** Like loadVersionFor, reading only what the rule needs: enough to serve a cached motion. */
export async function versionAccessFor(db: Database, user: SessionUser, versionId: string): Promise<VersionAccess> {
  const [row] = await db
    .select({ id: sequenceVersions.id, status: sequenceVersions.status, crewMemberId: sequences.crewMemberId, profileVersionId: sequenceVersions.profileVersionId })
    .from(sequenceVersions)
    .innerJoin(sequences, eq(sequences.id, sequenceVersions.sequenceId))
    .where(eq(sequenceVersions.id, versionId));
  if (!row) throw notFound('Sequence version');
  assertPlayable(user, row);
  return row;
}

/**
 * The version if `user` may see it in the rehearsal view; 404 when it does not exist or belongs to
 * another crew member (a trainee learns nothing about others' versions), 403 when it is the trainee's
 * own but not cleared.
 */
export async function loadVersionFor(db: Database, user: SessionUser, versionId: string): Promise<LoadedVersion> {
  const v = await loadVersion(db, versionId);
  if (!v) throw notFound('Sequence version');
  assertPlayable(user, v);
  return v;
}
