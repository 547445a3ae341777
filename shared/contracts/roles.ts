import { z } from 'zod';

import { ROLES } from './role-labels.ts';

export { ROLE_LABELS, ROLES, type Role } from './role-labels.ts';

/** A role, validated. */
export const roleSchema = z.enum(ROLES);
