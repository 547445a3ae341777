import { sql } from 'drizzle-orm';
import { type AnyPgColumn, doublePrecision, index, integer, jsonb, pgEnum, pgTable, text, unique } from 'drizzle-orm/pg-core';

import { JOB_STATES } from '../../shared/contracts/job-state.ts';
import { type ReportSummary, type SequenceTargetInput, type VerificationReport } from '../../shared/contracts/maneuver.ts';
import { VERSION_STATUSES } from '../../shared/contracts/version-status.ts';
import type { Primitive } from '../../shared/primitives/primitive-schemas.ts';
import type { CheckFailure } from '../../shared/product/version-checks.ts';
import { createdAt, instant, linkTo, rowId } from './columns.ts';
import { crewMembers, profileVersions } from './crew.ts';
import { users } from './users.ts';

export const versionStatusEnum = pgEnum('version_status', VERSION_STATUSES);

/** A named maneuver for one crew member with its target reorientation (JSON per shared contracts). */
export const sequences = pgTable(
  'sequences',
  {
    id: rowId(),
    crewMemberId: linkTo('crew_member_id', () => crewMembers.id).notNull(),
    name: text('name').notNull(),
    target: jsonb('target').$type<SequenceTargetInput>().notNull(),
    createdBy: linkTo('created_by', () => users.id),
    createdAt: createdAt(),
    // Archived maneuvers leave every default list and take no new versions until restored.
    archivedAt: instant('archived_at'),
    archivedBy: linkTo('archived_by', () => users.id),
  },
  // A trainee's list and the crew filter select by crew member; the maneuver list's order (name,
  // then id) lets a page be read in index order, stopping at its limit.
  (t) => [index('sequences_crew_member_idx').on(t.crewMemberId), index('sequences_name_id_idx').on(t.name, t.id)],
);

/**
 * One version of a sequence: composer primitives, the compiled engine steps, the profile version it
 * was computed for, and its verification report. Once cleared (approved) the content is frozen by a
 * trigger; only the status may move on (to replaced or recheck).
 */
export const sequenceVersions = pgTable(
  'sequence_versions',
  {
    id: rowId(),
    sequenceId: linkTo('sequence_id', () => sequences.id).notNull(),
    version: integer('version').notNull(),
    primitives: jsonb('primitives').$type<Primitive[]>().notNull(),
    // The target this version was composed and verified for (shared/contracts/maneuver.ts); the sequence's own target is the next version's default.
    target: jsonb('target').$type<SequenceTargetInput>().notNull(),
    compiled: jsonb('compiled').notNull(),
    profileVersionId: linkTo('profile_version_id', () => profileVersions.id).notNull(),
    status: versionStatusEnum('status').notNull().default('drafting'),
    report: jsonb('report').$type<VerificationReport>(),
    // The report's headline figures (ReportSummary), computed by PostgreSQL (migration 0004) for lists.
    reportSummary: jsonb('report_summary').$type<ReportSummary>().generatedAlwaysAs(sql`holonaut_report_summary(report)`),
    engineVersion: text('engine_version'),
    inputsHash: text('inputs_hash'),
    authorId: linkTo('author_id', () => users.id),
    note: text('note').notNull().default(''),
    createdAt: createdAt(),
    submittedAt: instant('submitted_at'),
    clearedBy: linkTo('cleared_by', () => users.id),
    clearedAt: instant('cleared_at'),
    staleSince: instant('stale_since'),
    // Guarded submit: the submitter's note to the reviewer and the failed checks they acknowledged (CheckFailure[] JSON; null when none failed).
    submitNote: text('submit_note'),
    acknowledgedFailures: jsonb('acknowledged_failures').$type<CheckFailure[]>(),
    // A re-check version (saved by the re-verification after a profile change): the cleared version it re-checks.
    recheckOfId: linkTo('recheck_of_id', (): AnyPgColumn => sequenceVersions.id),
  },
  (t) => [
    unique('sequence_versions_seq_version').on(t.sequenceId, t.version),
    // The review queue and re-checks select by status; re-checks by profile version.
    index('sequence_versions_status_idx').on(t.status),
    index('sequence_versions_profile_version_idx').on(t.profileVersionId),
  ],
);

/** A reviewer's decision or comment on a version, with the exact bindings it was made against. */
export const reviews = pgTable(
  'reviews',
  {
  id: rowId(),
  sequenceVersionId: linkTo('sequence_version_id', () => sequenceVersions.id).notNull(),
  reviewerId: linkTo('reviewer_id', () => users.id).notNull(),
  // clear | send_back | comment
  decision: text('decision').notNull(),
  comment: text('comment').notNull().default(''),
  profileVersionId: linkTo('profile_version_id', () => profileVersions.id),
  engineVersion: text('engine_version'),
  createdAt: createdAt(),
  },
  (t) => [index('reviews_sequence_version_idx').on(t.sequenceVersionId)],
);

/** Background recomputation of a version against a newer profile version (pg-boss job outcome). */
export const reverifications = pgTable(
  'reverifications',
  {
  id: rowId(),
  sequenceVersionId: linkTo('sequence_version_id', () => sequenceVersions.id).notNull(),
  fromProfileVersionId: linkTo('from_profile_version_id', () => profileVersions.id).notNull(),
  toProfileVersionId: linkTo('to_profile_version_id', () => profileVersions.id).notNull(),
  state: text('state', { enum: JOB_STATES }).notNull().default('queued'),
  // Angle between the old and the recomputed final attitude, degrees.
  attitudeShiftDeg: doublePrecision('attitude_shift_deg'),
  report: jsonb('report').$type<VerificationReport>(),
  // The re-check version this re-verification saved (a once-cleared version's successor under review).
  resultVersionId: linkTo('result_version_id', () => sequenceVersions.id),
  // What the finished re-verification concluded, in words (an engine change: unchanged, or re-check saved).
  outcome: text('outcome'),
  error: text('error'),
  attempts: integer('attempts').notNull().default(0),
  createdAt: createdAt(),
  finishedAt: instant('finished_at'),
  },
  // Lists show each version's newest record.
  (t) => [index('reverifications_version_created_idx').on(t.sequenceVersionId, t.createdAt)],
);

/** A trainee's logged run of a cleared version. */
export const rehearsals = pgTable(
  'rehearsals',
  {
  id: rowId(),
  sequenceVersionId: linkTo('sequence_version_id', () => sequenceVersions.id).notNull(),
  traineeId: linkTo('trainee_id', () => users.id).notNull(),
  performedAt: instant('performed_at').notNull().defaultNow(),
  playbackSpeed: doublePrecision('playback_speed').notNull(),
  completedSteps: integer('completed_steps').notNull(),
  totalSteps: integer('total_steps').notNull(),
  selfRating: integer('self_rating').notNull(),
  notes: text('notes').notNull().default(''),
  },
  (t) => [index('rehearsals_trainee_idx').on(t.traineeId, t.performedAt), index('rehearsals_sequence_version_idx').on(t.sequenceVersionId)],
);

export type SequenceRow = typeof sequences.$inferSelect;
export type SequenceVersionRow = typeof sequenceVersions.$inferSelect;
export type ReviewRow = typeof reviews.$inferSelect;
export type ReverificationRow = typeof reverifications.$inferSelect;
export type RehearsalRow = typeof rehearsals.$inferSelect;
