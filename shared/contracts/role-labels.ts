/**
 * The roles and their labels without the zod schema (shared/contracts/roles.ts adds it), so the
 * app's first screen can name a role without shipping the zod runtime.
 */

/** The four roles a user can hold; one per user. */
export const ROLES = ['admin', 'planner', 'reviewer', 'trainee'] as const;
export type Role = (typeof ROLES)[number];

/** Human labels for the roles, used by the Team screen and invitations. */
export const ROLE_LABELS: Record<Role, string> = {
  admin: 'Administrator',
  planner: 'Flight planner',
  reviewer: 'Reviewer',
  trainee: 'Crew trainee',
};
