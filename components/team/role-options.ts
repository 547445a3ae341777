import { type Role, ROLES } from '@/shared/contracts/roles';

/** Short role names that fit four to a row on a phone (the long ones are ROLE_LABELS). */
export const SHORT_ROLE_LABELS: Record<Role, string> = { admin: 'Admin', planner: 'Planner', reviewer: 'Reviewer', trainee: 'Trainee' };

/** The roles as SegmentedControl options. */
export const ROLE_OPTIONS = ROLES.map((r) => ({ value: r, label: SHORT_ROLE_LABELS[r] }));
