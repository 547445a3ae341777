/**
 * The roles and their labels without the zod schema (shared/contracts/roles.ts adds it), so the
 * app's first screen can name a role without shipping the zod runtime.
 */
import { labelledNames } from './labelled-names.ts';

/** The four roles a user can hold (one per user), with the labels the Team screen and invitations show. */
const ROLE_NAMES = labelledNames([
  ['admin', 'Administrator'],
  ['planner', 'Flight planner'],
  ['reviewer', 'Reviewer'],
  ['trainee', 'Crew trainee'],
]);

export const ROLES = ROLE_NAMES.names;
export type Role = (typeof ROLES)[number];

export const ROLE_LABELS = ROLE_NAMES.labels;
