import type { Role } from '../../shared/contracts/roles.ts';

const ALL: readonly Role[] = ['admin', 'planner', 'reviewer', 'trainee'];
const STAFF: readonly Role[] = ['admin', 'planner', 'reviewer'];

/**
 * Who may call each API area: the one table the server enforces (see server/app.ts).
 * Finer rules that depend on the object (a trainee sees only their own crew member, a reviewer
 * never clears their own version) live in the services that own those objects.
 */
export const ACCESS_POLICY = {
  me: ALL,
  team: ['admin'],
  audit: ['admin'],
  jobs: ['admin'],
  simulate: STAFF,
  crew: ALL,
  suits: ALL,
  uploads: ['admin', 'planner'],
  sequences: ALL,
  reviews: ['admin', 'reviewer'],
  rehearsals: ALL,
  motion: ALL,
  recordings: STAFF,
} as const satisfies Record<string, readonly Role[]>;

export type AccessArea = keyof typeof ACCESS_POLICY;
