import { z } from 'zod';

/** The four roles a user can hold; one per user. */
export const ROLES = ['admin', 'planner', 'reviewer', 'trainee'] as const;
export const roleSchema = z.enum(ROLES);
export type Role = z.infer<typeof roleSchema>;

/** Human labels for the roles, used by the Team screen and invitations. */
export const ROLE_LABELS: Record<Role, string> = {
  admin: 'Administrator',
  planner: 'Flight planner',
  reviewer: 'Reviewer',
  trainee: 'Crew trainee',
};
