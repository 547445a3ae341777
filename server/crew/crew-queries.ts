import { and, asc, eq, ilike, isNotNull, isNull, or, type SQL,sql } from 'drizzle-orm';

import type { Database } from '../../db/client.ts';
import { type CrewMemberRow, crewMembers, type ProfileVersionRow,profileVersions, users } from '../../db/schema/index.ts';
import type { SessionUser } from '../../shared/contracts/auth.ts';
import { notFound } from '../http/http-error.ts';
import type { CurrentGlimpse } from './profile-views.ts';

/** Escapes LIKE wildcards so a search for "50%" finds that text literally. */
function likePattern(text: string): string {
  return `%${text.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
}

/**
 * Crew members the user may see, by name, each with a glimpse of its current version (mass and
 * suit, read in SQL: the version's body is not loaded). A trainee gets only their own member; `q`
 * searches name and call sign, case-insensitively; `archived` lists the archived members instead of the active ones.
 */
export async function listCrewMembers(db: Database, user: SessionUser, q?: string, archived = false): Promise<{ member: CrewMemberRow; current: CurrentGlimpse | null }[]> {
  const filters: SQL[] = [archived ? isNotNull(crewMembers.archivedAt) : isNull(crewMembers.archivedAt)];
  if (user.role === 'trainee') {
    if (!user.crewMemberId) return [];
    filters.push(eq(crewMembers.id, user.crewMemberId));
  }
  if (q) filters.push(or(ilike(crewMembers.name, likePattern(q)), ilike(crewMembers.callSign, likePattern(q)))!);
  const rows = await db
    .select({
      member: crewMembers,
      mass: sql<number | null>`(${profileVersions.summary}->>'mass')::float8`,
      suitName: sql<string | null>`${profileVersions.inputs}->'suit'->>'name'`,
    })
    .from(crewMembers)
    .leftJoin(profileVersions, and(eq(profileVersions.crewMemberId, crewMembers.id), eq(profileVersions.version, crewMembers.currentVersion)))
    .where(and(...filters))
    .orderBy(asc(crewMembers.name));
  return rows.map(({ member, mass, suitName }) => ({ member, current: mass === null ? null : { mass, suitName } }));
}

/** Every version of a member, newest first, with the author's name. */
export async function listVersions(db: Database, crewMemberId: string) {
  return db
    .select({ version: profileVersions, authorName: users.name })
    .from(profileVersions)
    .leftJoin(users, eq(users.id, profileVersions.authorId))
    .where(eq(profileVersions.crewMemberId, crewMemberId))
    .orderBy(profileVersions.version)
    .then((rows) => rows.reverse());
}

/** One version of a member by number, with the author's name; 404 when absent. */
export async function getVersion(db: Database, crewMemberId: string, version: number): Promise<{ version: ProfileVersionRow; authorName: string | null }> {
  const [row] = await db
    .select({ version: profileVersions, authorName: users.name })
    .from(profileVersions)
    .leftJoin(users, eq(users.id, profileVersions.authorId))
    .where(and(eq(profileVersions.crewMemberId, crewMemberId), eq(profileVersions.version, version)));
  if (!row) throw notFound(`Profile version ${version}`);
  return row;
}
