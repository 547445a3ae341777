/**
 * Object-level rules of the maneuvers area (the role table only opens the area):
 * planners and admins author; trainees see only their own crew member's cleared versions
 * (and recheck ones that had been cleared, flagged); reviewers and admins decide.
 */
import { and, eq, isNotNull, isNull, or, type SQL } from 'drizzle-orm';

import { sequences, sequenceVersions } from '../../db/schema/index.ts';
import type { SessionUser } from '../../shared/contracts/auth.ts';
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

/** SQL condition on versions for what the user may see. */
export function visibleVersions(user: SessionUser): SQL | undefined {
  if (user.role !== 'trainee') return undefined;
  return and(
    visibleSequences(user),
    or(eq(sequenceVersions.status, 'cleared'), and(eq(sequenceVersions.status, 'recheck'), isNotNull(sequenceVersions.clearedAt))),
  );
}

/** 404 unless the user may see this version (a trainee learns nothing about others' versions). */
export function assertVersionVisible(user: SessionUser, v: { crewMemberId: string; status: string; clearedAt: Date | null; archived: boolean }): void {
  if (user.role !== 'trainee') return;
  const own = !!user.crewMemberId && user.crewMemberId === v.crewMemberId && !v.archived;
  const shown = v.status === 'cleared' || (v.status === 'recheck' && v.clearedAt !== null);
  if (!own || !shown) throw notFound('Sequence version');
}
