/**
 * Reads versions and sequences as the API shows them (shared/contracts/maneuver.ts), with the
 * names, profile version numbers and latest re-verification joined in.
 */
import { and, asc, desc, eq, inArray, isNotNull, type SQL, sql } from 'drizzle-orm';
import { alias } from 'drizzle-orm/pg-core';

import type { Database } from '../../db/client.ts';
import { crewMembers, profileVersions, type ReverificationRow, reverifications, reviews, robustnessRuns, sequences, type SequenceVersionRow,sequenceVersions, users } from '../../db/schema/index.ts';
import type { JobState } from '../../shared/contracts/job-state.ts';
import type { Reverification, ReviewEntry, SequenceHead, VersionBrief, VersionSummary } from '../../shared/contracts/maneuver.ts';
import { levelOf, type RobustnessBrief } from '../../shared/contracts/robustness.ts';
import type { VersionStatus } from '../../shared/contracts/version-status.ts';
import { clearedOrFlagged } from './maneuver-access.ts';
import { readAcknowledgedFailures, readReportSummary, readSequenceTarget, readVersionTarget } from './stored-version.ts';

const author = alias(users, 'author');
const clearer = alias(users, 'clearer');

/** The columns of a version that lists show: no primitives, compiled steps or report (only its summary). */
const versionListColumns = {
  id: sequenceVersions.id, sequenceId: sequenceVersions.sequenceId, version: sequenceVersions.version, status: sequenceVersions.status,
  profileVersionId: sequenceVersions.profileVersionId, authorId: sequenceVersions.authorId, note: sequenceVersions.note, target: sequenceVersions.target,
  createdAt: sequenceVersions.createdAt, submittedAt: sequenceVersions.submittedAt, clearedBy: sequenceVersions.clearedBy,
  clearedAt: sequenceVersions.clearedAt, staleSince: sequenceVersions.staleSince, engineVersion: sequenceVersions.engineVersion,
  inputsHash: sequenceVersions.inputsHash, reportSummary: sequenceVersions.reportSummary,
  submitNote: sequenceVersions.submitNote, acknowledgedFailures: sequenceVersions.acknowledgedFailures, recheckOfId: sequenceVersions.recheckOfId,
};

/** A re-verification record without its report (only the target error read from it). */
const reverificationColumns = {
  id: reverifications.id, sequenceVersionId: reverifications.sequenceVersionId, fromProfileVersionId: reverifications.fromProfileVersionId,
  toProfileVersionId: reverifications.toProfileVersionId, state: reverifications.state, attitudeShiftDeg: reverifications.attitudeShiftDeg,
  targetErrorDeg: sql<number | null>`(${reverifications.report}->'target'->>'errorDeg')::float8`.as('target_error_deg'),
  engineVersion: sql<string | null>`${reverifications.report}->>'engineVersion'`.as('reverified_engine_version'),
  outcome: reverifications.outcome,
  error: reverifications.error, attempts: reverifications.attempts, createdAt: reverifications.createdAt, finishedAt: reverifications.finishedAt,
};

/** A re-verification record as lists read it. */
export type ReverificationListRow = { [K in keyof typeof reverificationColumns]: K extends 'targetErrorDeg' ? number | null : K extends 'engineVersion' ? string | null : ReverificationRow[K & keyof ReverificationRow] };

/** A version row with what its summary needs (its sequence head and newest re-verification joined in). */
export interface VersionRowJoined {
  v: { [K in keyof typeof versionListColumns]: SequenceVersionRow[K] };
  crewMemberId: string;
  crewMemberName: string;
  sequence: { name: string; target: unknown; createdAt: Date; archivedAt: Date | null };
  profileVersion: number;
  currentProfileVersion: number | null;
  authorName: string | null;
  clearedByName: string | null;
  latestReverification: ReverificationListRow | null;
  latestRobustness: RobustnessListRow | null;
}

/** The newest robustness run of a version as lists read it (no samples, no inputs). */
const robustnessColumns = {
  id: robustnessRuns.id, state: robustnessRuns.state, samples: robustnessRuns.samples, doneSamples: robustnessRuns.doneSamples,
  toleranceDeg: robustnessRuns.toleranceDeg,
  feedbackP95Deg: sql<number | null>`(${robustnessRuns.figures}->>'feedbackP95Deg')::float8`.as('feedback_p95_deg'),
};
interface RobustnessListRow { id: string; state: JobState; samples: number; doneSamples: number; toleranceDeg: number; feedbackP95Deg: number | null }

/** The list view of a run: state, progress, feedback p95 and its level. */
export function toRobustnessBrief(r: RobustnessListRow): RobustnessBrief {
  const feedbackP95Deg = r.state === 'done' ? r.feedbackP95Deg : null;
  return {
    state: r.state, progress: r.state === 'done' ? 1 : r.doneSamples / Math.max(1, r.samples),
    feedbackP95Deg, toleranceDeg: r.toleranceDeg, level: levelOf(feedbackP95Deg, r.toleranceDeg),
  };
}

/**
 * Version rows matching `where`, newest version first, in one query: the sequence, crew member,
 * profile version number, names and the newest re-verification are joined in.
 */
export async function selectVersions(db: Database, where: SQL | undefined): Promise<VersionRowJoined[]> {
  const rev = db.select(reverificationColumns).from(reverifications)
    .where(eq(reverifications.sequenceVersionId, sequenceVersions.id))
    .orderBy(desc(reverifications.createdAt)).limit(1).as('latest_reverification');
  const run = db.select(robustnessColumns).from(robustnessRuns)
    .where(eq(robustnessRuns.sequenceVersionId, sequenceVersions.id))
    .orderBy(desc(robustnessRuns.createdAt)).limit(1).as('latest_robustness');
  const rows = await db
    .select({
      v: versionListColumns,
      crewMemberId: sequences.crewMemberId,
      crewMemberName: crewMembers.name,
      sequence: { name: sequences.name, target: sequences.target, createdAt: sequences.createdAt, archivedAt: sequences.archivedAt },
      profileVersion: profileVersions.version,
      currentProfileVersion: crewMembers.currentVersion,
      authorName: author.name,
      clearedByName: clearer.name,
      rev: {
        id: rev.id, sequenceVersionId: rev.sequenceVersionId, fromProfileVersionId: rev.fromProfileVersionId, toProfileVersionId: rev.toProfileVersionId,
        state: rev.state, attitudeShiftDeg: rev.attitudeShiftDeg, targetErrorDeg: rev.targetErrorDeg, engineVersion: rev.engineVersion, outcome: rev.outcome,
        error: rev.error, attempts: rev.attempts,
        createdAt: rev.createdAt, finishedAt: rev.finishedAt,
      },
      run: { id: run.id, state: run.state, samples: run.samples, doneSamples: run.doneSamples, toleranceDeg: run.toleranceDeg, feedbackP95Deg: run.feedbackP95Deg },
    })
    .from(sequenceVersions)
    .innerJoin(sequences, eq(sequences.id, sequenceVersions.sequenceId))
    .innerJoin(crewMembers, eq(crewMembers.id, sequences.crewMemberId))
    .innerJoin(profileVersions, eq(profileVersions.id, sequenceVersions.profileVersionId))
    .leftJoin(author, eq(author.id, sequenceVersions.authorId))
    .leftJoin(clearer, eq(clearer.id, sequenceVersions.clearedBy))
    .leftJoinLateral(rev, sql`true`)
    .leftJoinLateral(run, sql`true`)
    .where(where)
    .orderBy(desc(sequenceVersions.version));
  return rows.map(({ rev: r, run: rr, ...row }) => ({
    ...row,
    latestReverification: r && r.id ? (r) : null,
    latestRobustness: rr && rr.id ? (rr) : null,
  }));
}

/** Re-verification records of the given versions, newest first (reports not read). */
export async function selectReverifications(db: Database, versionIds: string[]): Promise<ReverificationListRow[]> {
  if (!versionIds.length) return [];
  return db.select(reverificationColumns).from(reverifications).where(inArray(reverifications.sequenceVersionId, versionIds)).orderBy(desc(reverifications.createdAt));
}

/** A re-verification record as the API shows it. */
export function toReverification(r: ReverificationListRow): Reverification {
  return {
    id: r.id, fromProfileVersionId: r.fromProfileVersionId, toProfileVersionId: r.toProfileVersionId,
    state: r.state, attitudeShiftDeg: r.attitudeShiftDeg, targetErrorDeg: r.targetErrorDeg,
    engineVersion: r.engineVersion, outcome: r.outcome, error: r.error, attempts: r.attempts, createdAt: r.createdAt.toISOString(), finishedAt: r.finishedAt?.toISOString() ?? null,
  };
}

/** The summary of one joined version row. */
export function toVersionSummary(row: VersionRowJoined): VersionSummary {
  const { v } = row;
  return {
    id: v.id, sequenceId: v.sequenceId, version: v.version, status: v.status,
    profileVersionId: v.profileVersionId, profileVersion: row.profileVersion,
    profileIsCurrent: row.currentProfileVersion === row.profileVersion,
    authorId: v.authorId, authorName: row.authorName, note: v.note, target: readVersionTarget(v.id, v.target),
    createdAt: v.createdAt.toISOString(), submittedAt: v.submittedAt?.toISOString() ?? null,
    clearedBy: v.clearedBy, clearedByName: row.clearedByName, clearedAt: v.clearedAt?.toISOString() ?? null,
    staleSince: v.staleSince?.toISOString() ?? null, engineVersion: v.engineVersion, inputsHash: v.inputsHash,
    summary: readReportSummary(v.id, v.reportSummary),
    reverification: row.latestReverification ? toReverification(row.latestReverification) : null,
    submitNote: v.submitNote, acknowledgedFailures: readAcknowledgedFailures(v.id, v.acknowledgedFailures), recheckOfId: v.recheckOfId,
    robustness: row.latestRobustness ? toRobustnessBrief(row.latestRobustness) : null,
  };
}

/** The sequence head of a joined version row. */
export function toSequenceHead(row: VersionRowJoined): SequenceHead {
  return {
    id: row.v.sequenceId, crewMemberId: row.crewMemberId, crewMemberName: row.crewMemberName, name: row.sequence.name,
    target: readSequenceTarget(row.v.sequenceId, row.sequence.target), createdAt: row.sequence.createdAt.toISOString(),
    archivedAt: row.sequence.archivedAt?.toISOString() ?? null,
  };
}

/** Summaries of the versions matching `where`, newest first. */
export async function versionSummaries(db: Database, where: SQL | undefined): Promise<{ rows: VersionRowJoined[]; summaries: VersionSummary[] }> {
  const rows = await selectVersions(db, where);
  return { rows, summaries: rows.map(toVersionSummary) };
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
    target: readSequenceTarget(s.id, s.target), createdAt: s.createdAt.toISOString(), archivedAt: s.archivedAt?.toISOString() ?? null,
  }));
}

/** A sequence head with the ids of its newest visible version and of the version trainees rehearse. */
export interface SequenceListRow {
  head: SequenceHead;
  versionCount: number;
  latest: VersionBrief | null;
  cleared: VersionBrief | null;
}

/** The list's brief of a version from its lateral look-up (null: none). */
function toBrief(v: { id: string | null; version: number | null; status: VersionStatus | null; summary: unknown; robustness: RobustnessListRow | null }): VersionBrief | null {
  if (!v.id || v.version === null || !v.status) return null;
  const s = readReportSummary(v.id, v.summary);
  return {
    id: v.id, version: v.version, status: v.status,
    summary: s ? { durationS: s.durationS, targetErrorDeg: s.targetErrorDeg, withinTolerance: s.withinTolerance, rangeViolationCount: s.rangeViolationCount } : null,
    robustness: v.robustness ? toRobustnessBrief(v.robustness) : null,
  };
}

/** Narrowing of the list beyond `where`: filters on the newest visible version and a page by name. */
export interface SequenceListOptions {
  /** Only maneuvers whose newest visible version has this status. */
  latestStatus?: VersionStatus;
  /** Only maneuvers with at least one visible version. */
  withVersions?: boolean;
  /** Only maneuvers after this one in the list's order (name, then id). */
  after?: { name: string; id: string };
  /** At most this many. */
  limit?: number;
}

/**
 * Sequence heads matching `where`, by name (then id), each with its visible version count and
 * briefs of the newest visible version and of the rehearsable one (newest cleared, or a
 * once-cleared recheck one), in one query (index-backed lateral look-ups, whatever the number of
 * versions; with a limit, the look-ups run for that page only).
 */
export async function sequenceListRows(db: Database, where: SQL | undefined, visible: SQL | undefined, options: SequenceListOptions = {}): Promise<SequenceListRow[]> {
  const ofSequence = eq(sequenceVersions.sequenceId, sequences.id);
  // The newest robustness run of the version, as one JSON value (state, progress, feedback p95 and tolerance).
  const run = sql<RobustnessListRow | null>`(SELECT jsonb_build_object('id', r.id, 'state', r.state, 'samples', r.samples, 'doneSamples', r.done_samples,
    'toleranceDeg', r.tolerance_deg, 'feedbackP95Deg', (r.figures->>'feedbackP95Deg')::float8)
    FROM robustness_runs r WHERE r.sequence_version_id = sequence_versions.id ORDER BY r.created_at DESC LIMIT 1)`;
  const brief = { id: sequenceVersions.id, version: sequenceVersions.version, status: sequenceVersions.status, summary: sequenceVersions.reportSummary, robustness: run.as('robustness') };
  const latest = db.select(brief).from(sequenceVersions)
    .where(allOf(ofSequence, visible)).orderBy(desc(sequenceVersions.version)).limit(1).as('latest');
  const cleared = db.select(brief).from(sequenceVersions)
    .where(allOf(ofSequence, visible, clearedOrFlagged()))
    .orderBy(desc(sequenceVersions.version)).limit(1).as('cleared');
  const count = sql<number>`(SELECT count(*)::int FROM ${sequenceVersions} WHERE ${allOf(ofSequence, visible)})`;
  const { latestStatus, withVersions, after, limit } = options;
  const query = db
    .select({
      s: sequences, crewMemberName: crewMembers.name, versionCount: count,
      latest: { id: latest.id, version: latest.version, status: latest.status, summary: latest.summary, robustness: sql<RobustnessListRow | null>`"latest"."robustness"` },
      cleared: { id: cleared.id, version: cleared.version, status: cleared.status, summary: cleared.summary, robustness: sql<RobustnessListRow | null>`"cleared"."robustness"` },
    })
    .from(sequences)
    .innerJoin(crewMembers, eq(crewMembers.id, sequences.crewMemberId))
    .leftJoinLateral(latest, sql`true`)
    .leftJoinLateral(cleared, sql`true`)
    .where(allOf(
      where,
      latestStatus ? eq(latest.status, latestStatus) : undefined,
      withVersions ? isNotNull(latest.id) : undefined,
      after ? sql`(${sequences.name}, ${sequences.id}) > (${after.name}, ${after.id}::uuid)` : undefined,
    ))
    .orderBy(asc(sequences.name), asc(sequences.id));
  const rows = await (limit === undefined ? query : query.limit(limit));
  return rows.map(({ s, crewMemberName, versionCount, latest: l, cleared: c }) => ({
    head: { id: s.id, crewMemberId: s.crewMemberId, crewMemberName, name: s.name, target: readSequenceTarget(s.id, s.target), createdAt: s.createdAt.toISOString(), archivedAt: s.archivedAt?.toISOString() ?? null },
    versionCount, latest: l ? toBrief(l) : null, cleared: c ? toBrief(c) : null,
  }));
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
