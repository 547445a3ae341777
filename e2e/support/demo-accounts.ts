import { DEMO_PASSWORD, DEMO_PEOPLE } from '../../db/seed/demo-people.ts';
import type { Role } from '../../shared/contracts/roles.ts';

export { DEMO_PASSWORD };

/** The first seeded demo person with each role (e-mail and name), for signing in as that role. */
export const DEMO_BY_ROLE: Record<Role, { email: string; name: string }> = Object.fromEntries(
  (['admin', 'planner', 'reviewer', 'trainee'] as const).map((role) => {
    const p = DEMO_PEOPLE.find((d) => d.role === role);
    if (!p) throw new Error(`The demo seed has no ${role}.`);
    return [role, { email: p.email, name: p.name }];
  }),
) as Record<Role, { email: string; name: string }>;
