import { bigint, doublePrecision, index, integer, jsonb, pgTable, primaryKey, text, uuid } from 'drizzle-orm/pg-core';

import { JOB_STATES } from '../../shared/contracts/job-state.ts';
import type { RobustnessModel } from '../../shared/contracts/robustness.ts';
import type { RobustnessFigures, RobustnessRunInputs, RobustnessSample } from '../../shared/contracts/robustness-stored.ts';
import { createdAt, instant, linkTo, rowId } from './columns.ts';
import { plans } from './plans.ts';
import { sequenceVersions } from './sequences.ts';
import { users } from './users.ts';

/**
 * One robustness run (a seeded Monte Carlo) of a sequence version or of a plan candidate, split into
 * chunks that worker processes run as separate jobs; the figures are merged when the last chunk is in.
 * `inputs` is the snapshot every chunk computes from (body, compiled sequence, target, tolerance), so
 * a later edit elsewhere never mixes into a running run.
 */
export const robustnessRuns = pgTable(
  'robustness_runs',
  {
    id: rowId(),
    sequenceVersionId: linkTo('sequence_version_id', () => sequenceVersions.id),
    planId: linkTo('plan_id', () => plans.id),
    candidateIndex: integer('candidate_index'),
    state: text('state', { enum: JOB_STATES }).notNull().default('queued'),
    samples: integer('samples').notNull(),
    chunkSize: integer('chunk_size').notNull(),
    seed: bigint('seed', { mode: 'number' }).notNull(),
    // RobustnessModel JSON.
    model: jsonb('model').$type<RobustnessModel>().notNull(),
    toleranceDeg: doublePrecision('tolerance_deg').notNull(),
    // { body, sequence, target } (RobustnessInputs without seed, model and tolerance).
    inputs: jsonb('inputs').$type<RobustnessRunInputs>().notNull(),
    doneSamples: integer('done_samples').notNull().default(0),
    // Once done.
    figures: jsonb('figures').$type<RobustnessFigures>(),
    error: text('error'),
    requestedBy: linkTo('requested_by', () => users.id),
    createdAt: createdAt(),
    startedAt: instant('started_at'),
    finishedAt: instant('finished_at'),
  },
  (t) => [index('robustness_runs_version').on(t.sequenceVersionId), index('robustness_runs_plan').on(t.planId), index('robustness_runs_state').on(t.state)],
);

/** One chunk of a run: samples [from, to); its per-sample results once done. */
export const robustnessChunks = pgTable(
  'robustness_chunks',
  {
    runId: uuid('run_id')
      .notNull()
      .references(() => robustnessRuns.id, { onDelete: 'cascade' }),
    chunkIndex: integer('chunk_index').notNull(),
    fromSample: integer('from_sample').notNull(),
    toSample: integer('to_sample').notNull(),
    state: text('state', { enum: JOB_STATES }).notNull().default('queued'),
    // Once done.
    results: jsonb('results').$type<RobustnessSample[]>(),
    attempts: integer('attempts').notNull().default(0),
    error: text('error'),
    finishedAt: instant('finished_at'),
  },
  (t) => [primaryKey({ columns: [t.runId, t.chunkIndex] })],
);

export type RobustnessRunRow = typeof robustnessRuns.$inferSelect;
export type RobustnessChunkRow = typeof robustnessChunks.$inferSelect;
