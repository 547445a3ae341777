import { hashPassword } from '../../server/auth/passwords.ts';
import type { Database } from '../client.ts';
import { crewMembers, users } from '../schema/index.ts';
import { DEMO_CREW, DEMO_PASSWORD, DEMO_PEOPLE } from './demo-people.ts';

/** Inserts the demo people and their crew members; returns ids by e-mail and crew key. */
export async function seedTeam(db: Database, bcryptCost: number) {
  const hash = await hashPassword(DEMO_PASSWORD, bcryptCost);
  const crewIds: Record<string, string> = {};
  const userIds: Record<string, string> = {};
  await db.transaction(async (tx) => {
    for (const [key, c] of Object.entries(DEMO_CREW)) {
      const [row] = await tx.insert(crewMembers).values({ name: c.name, callSign: c.callSign }).returning({ id: crewMembers.id });
      crewIds[key] = row.id;
    }
    for (const p of DEMO_PEOPLE) {
      const [row] = await tx
        .insert(users)
        .values({ email: p.email, name: p.name, role: p.role, passwordHash: hash, crewMemberId: p.crewKey ? crewIds[p.crewKey] : null })
        .returning({ id: users.id });
      userIds[p.email] = row.id;
    }
  });
  return { crewIds, userIds };
}
