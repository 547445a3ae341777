/**
 * Archive and restore a crew member. Archiving keeps every profile version, maneuver and rehearsal
 * (approvals stay bound to them); it takes the member and their maneuvers out of default lists and
 * refuses new profile versions and new maneuvers until the member is restored.
 */
import { eq } from 'drizzle-orm';

import { crewMembers } from '../../db/schema/index.ts';
import type { SessionUser } from '../../shared/contracts/auth.ts';
import type { AppContext } from '../app-context.ts';
import { recordAudit } from '../audit/record-audit.ts';
import { conflict, notFound } from '../http/http-error.ts';

/** Archives (or restores) a member; 409 when the member already is in that state. */
export async function setMemberArchived(ctx: AppContext, user: SessionUser, crewMemberId: string, archived: boolean): Promise<void> {
  await ctx.db.transaction(async (tx) => {
    const [member] = await tx.select().from(crewMembers).where(eq(crewMembers.id, crewMemberId)).for('update');
    if (!member) throw notFound('Crew member');
    if (archived === (member.archivedAt !== null)) {
      throw conflict(archived ? `${member.name} is already archived.` : `${member.name} is not archived.`, archived ? 'already_archived' : 'not_archived');
    }
    await tx.update(crewMembers)
      .set(archived ? { archivedAt: new Date(), archivedBy: user.id } : { archivedAt: null, archivedBy: null })
      .where(eq(crewMembers.id, crewMemberId));
    await recordAudit(tx, { actorId: user.id, action: archived ? 'crew.archive' : 'crew.restore', objectType: 'crew_member', objectId: crewMemberId, detail: { name: member.name } });
  });
}
