import { z } from 'zod';

import { ROLES } from './role-labels.ts';

export { type Role, ROLE_LABELS, ROLES } from './role-labels.ts';

/** A role, validated. */
export const roleSchema = z.enum(ROLES);
