/**
 * Object-level rules of the maneuvers area (the role table only opens the area):
 * planners and admins author; trainees see only their own crew member's cleared versions
 * (and recheck ones that had been cleared, flagged); reviewers and admins decide.
 */
import { and, eq, isNotNull, isNull, or, type SQL } from 'drizzle-orm';

import { sequences, sequenceVersions } from '../../db/schema/index.ts';
import type { SessionUser } from '../../shared/contracts/auth.ts';
import type { VersionStatus } from '../../shared/contracts/version-status.ts';
import { forbidden, notFound } from '../http/http-error.ts';

/** Whether the user may compose, save and submit. */
export function canAuthor(user: SessionUser): boolean {
  return user.role === 'planner' || user.role === 'admin';
}

/** Whether the user may decide on or comment a version under review. */
export function canReview(user: SessionUser): boolean {
  return user.role === 'reviewer' || user.role === 'admin';
}

/** 403 unless the user may author. */
export function requireAuthor(user: SessionUser): void {
  if (!canAuthor(user)) throw forbidden('Only planners and admins compose and submit maneuvers.');
}

/** SQL condition on sequences for what the user may list (everything for staff). */
export function visibleSequences(user: SessionUser): SQL | undefined {
  if (user.role !== 'trainee') return undefined;
  // A trainee without a linked crew member sees nothing (a condition that never holds); archived maneuvers are retired from rehearsal.
  return and(eq(sequences.crewMemberId, user.crewMemberId ?? '00000000-0000-0000-0000-000000000000'), isNull(sequences.archivedAt));
}

/** SQL condition on versions: cleared, or once cleared and now flagged for a re-check (what a trainee rehearses or is told about). */
export function clearedOrFlagged(): SQL | undefined {
  return or(eq(sequenceVersions.status, 'cleared'), and(eq(sequenceVersions.status, 'recheck'), isNotNull(sequenceVersions.clearedAt)));
}

/** SQL condition on versions for what the user may see (the SQL form of maySeeVersion). */
export function visibleVersions(user: SessionUser): SQL | undefined {
  if (user.role !== 'trainee') return undefined;
  return and(visibleSequences(user), clearedOrFlagged());
}

/** What the visibility rule reads of a version. */
export interface VersionVisibility {
  crewMemberId: string;
  status: VersionStatus;
  clearedAt: Date | null;
  /** Whether its maneuver is archived. */
  archived: boolean;
}

/**
 * The trainee's rule, in one place: their own crew member's versions of maneuvers that are not
 * archived, cleared, or once cleared and now flagged for a re-check. Staff see every version.
 */
export function maySeeVersion(user: SessionUser, v: VersionVisibility): boolean {
  if (user.role !== 'trainee') return true;
  const own = !!user.crewMemberId && user.crewMemberId === v.crewMemberId && !v.archived;
  return own && (v.status === 'cleared' || (v.status === 'recheck' && v.clearedAt !== null));
}

/** 404 unless the user may see this version (a trainee learns nothing about others' versions). */
export function assertVersionVisible(user: SessionUser, v: VersionVisibility): void {
  if (!maySeeVersion(user, v)) throw notFound('Sequence version');
}

/**
 * What the player, the cue card and the rehearsal log open: a visible version (404 otherwise) that
 * a trainee can rehearse now, i.e. cleared (403 for one flagged for a re-check). Staff preview any version.
 */
export function assertRehearsable(user: SessionUser, v: VersionVisibility): void {
  assertVersionVisible(user, v);
  if (user.role === 'trainee' && v.status !== 'cleared') {
    throw forbidden('This version needs a re-check after a profile change; rehearse it again once it is cleared.');
  }
}
