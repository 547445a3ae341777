import type { WorkFilter } from '@/shared/contracts/background-work';
import type { CompileRequest } from '@/shared/contracts/maneuver';

import type { AuditFilters } from './use-audit';
import type { SequenceListFilters } from './use-sequences';

/*
 * Every cache family of the web client, in one place: a change in one area refreshes another
 * (a review refreshes the maneuver lists, a profile save the maneuvers), and each hook module
 * names the others' keys without importing the others' hooks (no import cycles).
 */

/** Makes a key inside a family: the family's root, then the parts. */
type KeyMaker<Root extends string> = <const Parts extends readonly unknown[]>(...parts: Parts) => readonly [Root, ...Parts];

/**
 * A family of query keys under one root: `all` is the root alone, and every member key starts with
 * it, so invalidating `all` refreshes the whole family.
 */
function keyFamily<const Root extends string, Members>(root: Root, members: (key: KeyMaker<Root>) => Members) {
  const key: KeyMaker<Root> = (...parts) => [root, ...parts] as const;
  return { all: [root] as const, ...members(key) };
}

/** The signed-in session; `me`: GET /api/me → the user, or null when signed out. */
export const sessionKeys = keyFamily('session', (key) => ({ me: () => key('me') }));

/** The Crew area; re-verification progress sits under it, so a saved profile (which invalidates the crew) refreshes it at once. */
export const crewKeys = keyFamily('crew', (key) => ({
  list: (q: string, archived = false) => key('list', q, archived ? 'archived' : 'active'),
  member: (id: string) => key('member', id),
  versions: (id: string) => key('versions', id),
  version: (id: string, version: number) => key('version', id, version),
  compare: (id: string, a: number, b: number) => key('compare', id, a, b),
  reverifications: (crewMemberId: string) => key('reverifications', crewMemberId),
}));

/** The suit configurations. */
export const suitKeys = keyFamily('suits', (key) => ({ list: () => key('list') }));

/** The Maneuvers area (sequences, their versions, comparisons). */
export const sequenceKeys = keyFamily('sequences', (key) => ({
  lists: () => key('list'),
  list: (filters: SequenceListFilters) => key('list', filters),
  detail: (sequenceId: string) => key('detail', sequenceId),
  version: (versionId: string) => key('version', versionId),
  compare: (a: string, b: string) => key('compare', a, b),
  compile: (request: CompileRequest) => key('compile', request),
}));

/** The 3D view's motion, at a sample rate or as verified. */
export const motionKeys = keyFamily('motion', (key) => ({ version: (versionId: string, rate: number | undefined) => key(versionId, rate ?? 'verified') }));

/** Maneuver plans ("Suggest steps"). */
export const planKeys = keyFamily('plans', (key) => ({
  detail: (sequenceId: string, planId: string) => key(sequenceId, planId),
  latest: (sequenceId: string) => key(sequenceId, 'latest'),
  /** Outside the family: refreshing plans never re-simulates a previewed suggestion. */
  candidateMotion: (sequenceId: string, planId: string, rank: number) => ['plan-candidate-motion', sequenceId, planId, rank] as const,
}));

/** Version robustness runs. */
export const robustnessKeys = keyFamily('robustness', (key) => ({ version: (versionId: string) => key(versionId) }));

/** The Reviews area. */
export const reviewKeys = keyFamily('reviews', (key) => ({ queue: () => key('queue') }));

/** Rehearsals. */
export const rehearsalKeys = keyFamily('rehearsals', (key) => ({
  available: () => key('available'),
  history: (versionId?: string) => key('history', versionId ?? 'all'),
}));

/** Rehearsal recordings. */
export const captureKeys = keyFamily('rehearsal-captures', (key) => ({
  one: (rehearsalId: string) => key(rehearsalId),
  trend: () => key('trend'),
}));

/** Imported recordings. */
export const recordingKeys = keyFamily('recordings', (key) => ({
  list: () => key('list'),
  one: (id: string) => key('one', id),
}));

/** The Team area (admin). */
export const teamKeys = keyFamily('team', (key) => ({
  users: () => key('users'),
  invitations: () => key('invitations'),
}));

/** Invitation previews (public, by token). */
export const invitationKeys = keyFamily('invitation', (key) => ({ preview: (token: string) => key('preview', token) }));

/** The audit log (admin). */
export const auditKeys = keyFamily('audit', (key) => ({ list: (filters: AuditFilters) => key('list', filters) }));

/** The admin's background-work view. */
export const backgroundWorkKeys = keyFamily('background-work', (key) => ({ list: (filter: WorkFilter) => key(filter) }));
