/** A crew member's current profile version (the one new sequence versions bind to). */
import { and, eq } from 'drizzle-orm';

import type { Database } from '../../db/client.ts';
import { crewMembers, type ProfileVersionRow, profileVersions } from '../../db/schema/index.ts';
import { conflict, notFound } from '../http/http-error.ts';

/** The current profile version row; 404 for an unknown crew member, 409 when they have no profile yet. */
export async function currentProfile(db: Pick<Database, 'select'>, crewMemberId: string): Promise<ProfileVersionRow> {
  const [member] = await db.select().from(crewMembers).where(eq(crewMembers.id, crewMemberId));
  if (!member) throw notFound('Crew member');
  if (!member.currentVersion) throw conflict(`${member.name} has no inertia profile yet: save one in Crew before verifying a maneuver.`, 'no_profile');
  const [pv] = await db.select().from(profileVersions)
    .where(and(eq(profileVersions.crewMemberId, crewMemberId), eq(profileVersions.version, member.currentVersion)));
  if (!pv) throw conflict(`${member.name}'s current profile version ${member.currentVersion} is missing.`, 'no_profile');
  return pv;
}
