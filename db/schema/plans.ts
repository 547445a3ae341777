import { doublePrecision, index, jsonb, pgTable, text } from 'drizzle-orm/pg-core';

import { JOB_STATES } from '../../shared/contracts/job-state.ts';
import type { SequenceTargetInput } from '../../shared/contracts/maneuver.ts';
import type { PlanCandidate, PlanSettings } from '../../shared/contracts/plan.ts';
import { createdAt, instant, linkTo, rowId } from './columns.ts';
import { profileVersions } from './crew.ts';
import { sequences } from './sequences.ts';
import { users } from './users.ts';

/**
 * A planner run ("Suggest steps") for a sequence: settings, state and the ranked candidates
 * (shapes in shared/contracts/plan.ts). Filled by the planning job.
 */
export const plans = pgTable(
  'plans',
  {
  id: rowId(),
  sequenceId: linkTo('sequence_id', () => sequences.id).notNull(),
  // The body the plan used (the crew member's current profile version when requested).
  profileVersionId: linkTo('profile_version_id', () => profileVersions.id).notNull(),
  requestedBy: linkTo('requested_by', () => users.id),
  state: text('state', { enum: JOB_STATES }).notNull().default('queued'),
  // The sequence target at request time (SequenceTarget JSON).
  target: jsonb('target').$type<SequenceTargetInput>().notNull(),
  // PlanSettings JSON.
  settings: jsonb('settings').$type<PlanSettings>().notNull(),
  // 0–1 while running.
  progress: doublePrecision('progress').notNull().default(0),
  progressNote: text('progress_note').notNull().default(''),
  // PlanCandidate[] JSON once done.
  candidates: jsonb('candidates').$type<PlanCandidate[]>(),
  error: text('error'),
  // The planner's notes (string[] JSON): why a target cannot be reached (which axis, which limit), sweeps not used.
  notes: jsonb('notes').$type<string[]>().notNull().default([]),
  engineVersion: text('engine_version'),
  createdAt: createdAt(),
  startedAt: instant('started_at'),
  finishedAt: instant('finished_at'),
  },
  // A sequence's plans, newest first.
  (t) => [index('plans_sequence_created_idx').on(t.sequenceId, t.createdAt)],
);

export type PlanRow = typeof plans.$inferSelect;
