import { eq } from 'drizzle-orm';
import type { NextFunction, Request, Response } from 'express';

import type { Database } from '../../db/client.ts';
import { type CrewMemberRow, crewMembers } from '../../db/schema/index.ts';
import type { SessionUser } from '../../shared/contracts/auth.ts';
import type { Role } from '../../shared/contracts/roles.ts';
import { forbidden, notFound } from '../http/http-error.ts';

/** Roles that create and edit crew members, profile versions and suits. */
export const CREW_EDITORS: readonly Role[] = ['planner', 'admin'];

/** Middleware: only planners and admins pass (reviewers and trainees read). */
export function requireCrewEditor(req: Request, _res: Response, next: NextFunction) {
  if (!req.user || !CREW_EDITORS.includes(req.user.role)) return next(forbidden('Only planners and admins edit crew profiles and suits.'));
  next();
}

/** True when the user may read this crew member: staff read all, a trainee only their own. */
export function canReadMember(user: SessionUser, crewMemberId: string): boolean {
  return user.role !== 'trainee' || user.crewMemberId === crewMemberId;
}

/**
 * Loads a crew member the user may read. Another member's id answers 404 for a trainee, exactly as
 * an unknown id does, so a trainee cannot probe who exists.
 */
export async function readableMember(db: Pick<Database, 'select'>, user: SessionUser, crewMemberId: string): Promise<CrewMemberRow> {
  if (!canReadMember(user, crewMemberId)) throw notFound('Crew member');
  const [row] = await db.select().from(crewMembers).where(eq(crewMembers.id, crewMemberId));
  if (!row) throw notFound('Crew member');
  return row;
}
