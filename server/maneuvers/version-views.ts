/**
 * Reads versions and sequences as the API shows them (shared/contracts/maneuver.ts), with the
 * names, profile version numbers and latest re-verification joined in.
 */
import { and, asc, desc, eq, inArray, type SQL } from 'drizzle-orm';
import { alias } from 'drizzle-orm/pg-core';

import type { Database } from '../../db/client.ts';
import { crewMembers, profileVersions, reverifications, reviews, sequences, sequenceVersions, users, type ReverificationRow, type SequenceVersionRow } from '../../db/schema/index.ts';
import type { Reverification, ReviewEntry, SequenceHead, SequenceTarget, VerificationReport, VersionSummary } from '../../shared/contracts/maneuver.ts';
import { sequenceTargetSchema } from '../../shared/contracts/maneuver.ts';
import { summarizeReport } from './build-report.ts';

const author = alias(users, 'author');
const clearer = alias(users, 'clearer');

/** A version row with what its summary needs. */
export interface VersionRowJoined {
  v: SequenceVersionRow;
  crewMemberId: string;
  profileVersion: number;
  currentProfileVersion: number | null;
  authorName: string | null;
  clearedByName: string | null;
}

/** Version rows matching `where`, newest version first. */
export async function selectVersions(db: Database, where: SQL | undefined): Promise<VersionRowJoined[]> {
  return db
    .select({
      v: sequenceVersions,
      crewMemberId: sequences.crewMemberId,
      profileVersion: profileVersions.version,
      currentProfileVersion: crewMembers.currentVersion,
      authorName: author.name,
      clearedByName: clearer.name,
    })
    .from(sequenceVersions)
    .innerJoin(sequences, eq(sequences.id, sequenceVersions.sequenceId))
    .innerJoin(crewMembers, eq(crewMembers.id, sequences.crewMemberId))
    .innerJoin(profileVersions, eq(profileVersions.id, sequenceVersions.profileVersionId))
    .leftJoin(author, eq(author.id, sequenceVersions.authorId))
    .leftJoin(clearer, eq(clearer.id, sequenceVersions.clearedBy))
    .where(where)
    .orderBy(desc(sequenceVersions.version));
}

/** Re-verification records of the given versions, newest first. */
export async function selectReverifications(db: Database, versionIds: string[]): Promise<ReverificationRow[]> {
  if (!versionIds.length) return [];
  return db.select().from(reverifications).where(inArray(reverifications.sequenceVersionId, versionIds)).orderBy(desc(reverifications.createdAt));
}

/** A re-verification record as the API shows it. */
export function toReverification(r: ReverificationRow): Reverification {
  const report = r.report as VerificationReport | null;
  return {
    id: r.id, fromProfileVersionId: r.fromProfileVersionId, toProfileVersionId: r.toProfileVersionId,
    state: r.state as Reverification['state'], attitudeShiftDeg: r.attitudeShiftDeg, targetErrorDeg: report?.target.errorDeg ?? null,
    error: r.error, attempts: r.attempts, createdAt: r.createdAt.toISOString(), finishedAt: r.finishedAt?.toISOString() ?? null,
  };
}

/** The summary of one joined version row; `latestReverification` is the newest record, if any. */
export function toVersionSummary(row: VersionRowJoined, latestReverification: ReverificationRow | undefined): VersionSummary {
  const { v } = row;
  const report = v.report as VerificationReport | null;
  return {
    id: v.id, sequenceId: v.sequenceId, version: v.version, status: v.status,
    profileVersionId: v.profileVersionId, profileVersion: row.profileVersion,
    profileIsCurrent: row.currentProfileVersion === row.profileVersion,
    authorId: v.authorId, authorName: row.authorName, note: v.note,
    createdAt: v.createdAt.toISOString(), submittedAt: v.submittedAt?.toISOString() ?? null,
    clearedBy: v.clearedBy, clearedByName: row.clearedByName, clearedAt: v.clearedAt?.toISOString() ?? null,
    staleSince: v.staleSince?.toISOString() ?? null, engineVersion: v.engineVersion, inputsHash: v.inputsHash,
    summary: report ? summarizeReport(report) : null,
    reverification: latestReverification ? toReverification(latestReverification) : null,
  };
}

/** Summaries of the versions matching `where`, newest first. */
export async function versionSummaries(db: Database, where: SQL | undefined): Promise<{ rows: VersionRowJoined[]; summaries: VersionSummary[] }> {
  const rows = await selectVersions(db, where);
  const revs = await selectReverifications(db, rows.map((r) => r.v.id));
  const latest = new Map<string, ReverificationRow>();
  for (const r of revs) if (!latest.has(r.sequenceVersionId)) latest.set(r.sequenceVersionId, r);
  return { rows, summaries: rows.map((r) => toVersionSummary(r, latest.get(r.v.id))) };
}

/** Sequence heads matching `where`, by name. */
export async function sequenceHeads(db: Database, where: SQL | undefined): Promise<SequenceHead[]> {
  const rows = await db
    .select({ s: sequences, crewMemberName: crewMembers.name })
    .from(sequences)
    .innerJoin(crewMembers, eq(crewMembers.id, sequences.crewMemberId))
    .where(where)
    .orderBy(asc(sequences.name));
  return rows.map(({ s, crewMemberName }) => ({
    id: s.id, crewMemberId: s.crewMemberId, crewMemberName, name: s.name,
    target: readTarget(s.target), createdAt: s.createdAt.toISOString(),
  }));
}

/**
 * The stored target, with defaults filled. Rows written outside this API with a bare
 * `{ yaw, pitch, roll }` (degrees) are read as that; anything unreadable as "no reorientation".
 */
export function readTarget(json: unknown): SequenceTarget {
  const parsed = sequenceTargetSchema.safeParse(json);
  if (parsed.success) return parsed.data;
  const o = (json ?? {}) as Record<string, unknown>;
  const num = (k: string) => (typeof o[k] === 'number' && Number.isFinite(o[k]) ? (o[k] as number) : 0);
  return sequenceTargetSchema.parse({ mode: 'ypr', yprDeg: { yaw: num('yaw'), pitch: num('pitch'), roll: num('roll') } });
}

/** Review entries of a version, oldest first. */
export async function reviewEntries(db: Database, versionId: string): Promise<ReviewEntry[]> {
  const rows = await db
    .select({ r: reviews, name: users.name })
    .from(reviews)
    .innerJoin(users, eq(users.id, reviews.reviewerId))
    .where(eq(reviews.sequenceVersionId, versionId))
    .orderBy(asc(reviews.createdAt));
  return rows.map(({ r, name }) => ({
    id: r.id, reviewerId: r.reviewerId, reviewerName: name, decision: r.decision as ReviewEntry['decision'], comment: r.comment,
    profileVersionId: r.profileVersionId, engineVersion: r.engineVersion, createdAt: r.createdAt.toISOString(),
  }));
}

/** Convenience: `and` that drops undefined parts. */
export function allOf(...parts: (SQL | undefined)[]): SQL | undefined {
  const p = parts.filter((x): x is SQL => x !== undefined);
  return p.length ? and(...p) : undefined;
}
