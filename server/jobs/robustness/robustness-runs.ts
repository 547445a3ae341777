/**
 * Robustness runs as background work: a run is split into chunks of samples, each chunk is a job any
 * worker process may take, and the last chunk to finish merges every chunk's samples into the figures
 * (summariseRobustness). Sample i is seeded by (seed, i), so the figures do not depend on the split.
 *
 * Exactly one result per run: a chunk's samples are written only while it is not done and its run
 * is open, in the same statement that adds them to the run's count of done samples, so a retried or
 * duplicated chunk job changes nothing and a cancelled or failed run takes no more results. The
 * merge that brings the count to the run's samples computes the figures (finishRobustnessRun, which
 * the reconciliation pass also calls for a run whose count is full but whose figures are missing,
 * should that worker die in between). A chunk's worker checks its run's state every second and
 * stops when the run was cancelled.
 *
 * A chunk costs the database four statements: the queue's fetch and completion, the claim and the
 * merge; lock order is a run's chunk rows before its run row (claim, merge and closing a run all take
 * them so, finishing takes the run row only); the merge holds the run row only for its own
 * statement, so workers finishing chunks together barely wait for each other.
 */
import { performance } from 'node:perf_hooks';

import { and, asc, eq, inArray, notInArray, sql } from 'drizzle-orm';
import type { PgBoss } from 'pg-boss';
import { z } from 'zod';

import type { Database } from '../../../db/client.ts';
import { type RobustnessChunkRow, robustnessChunks, type RobustnessRunRow, robustnessRuns } from '../../../db/schema/index.ts';
import { readStored, StoredDataError } from '../../../db/stored-json.ts';
import type { Body } from '../../../shared/contracts/body.ts';
import { DEFAULT_ROBUSTNESS_MODEL, type RobustnessModel, robustnessModelSchema } from '../../../shared/contracts/robustness.ts';
import type { RobustnessRun } from '../../../shared/contracts/robustness-run.ts';
import {
  type RobustnessFigures, robustnessFiguresSchema, type RobustnessRunInputs, robustnessRunInputsSchema, type RobustnessSample, robustnessSampleSchema,
} from '../../../shared/contracts/robustness-stored.ts';
import type { Sequence } from '../../../shared/contracts/sequence.ts';
import type { Quat } from '../../../shared/math/quaternion.ts';
import type { AppContext } from '../../app-context.ts';
import { recordAudit } from '../../audit/record-audit.ts';
import type { StoredVersion } from '../../maneuvers/stored-version.ts';
import { targetQuat } from '../../maneuvers/target-attitude.ts';
import { type RobustnessInputs, summariseRobustness } from '../../planning/robustness.ts';
import { ROBUSTNESS_CHUNK_QUEUE } from '../queue-names.ts';
import { ChunkAbortedError, type ChunkPool, type ChunkResult } from './chunk-pool.ts';

/** Samples of a version's run unless asked otherwise. */
export const DEFAULT_ROBUSTNESS_SAMPLES = 1000;
/** Seed of a version's run unless asked otherwise (a fixed seed: the same version gives the same figures). */
export const DEFAULT_ROBUSTNESS_SEED = 1;
/**
 * Most chunks of a default split. Each chunk costs the queue and the database a few milliseconds of
 * CPU (fetch, claim, merge, completion, on a worker and in PostgreSQL), as much as tens of samples
 * on an idle machine, so a run is cut into few chunks (npm run bench:jobs measured both).
 */
export const CHUNKS_PER_RUN = 10;
/** Fewest samples in a chunk of a default split (a small run is cut into fewer chunks). */
export const MIN_CHUNK_SAMPLES = 25;
/** Size of a default split's last chunk relative to its first. */
const LAST_TO_FIRST = 0.2;

/** Samples [from, to) of one chunk. */
export interface ChunkRange { from: number; to: number }

/**
 * How a run of `samples` is cut. With `chunkSize`, into chunks of that size (the last one short).
 * Otherwise into up to CHUNKS_PER_RUN chunks whose sizes shrink geometrically to a fifth of the
 * first, none under MIN_CHUNK_SAMPLES unless the run is smaller: chunks are taken in order, so the
 * large ones keep every worker busy and the small last ones let the workers finish together (with
 * equal chunks, a worker that takes the last one leaves the others idle for up to a whole chunk).
 */
export function chunkRanges(samples: number, chunkSize?: number): ChunkRange[] {
  const out: ChunkRange[] = [];
  if (chunkSize !== undefined) {
    const size = Math.max(1, chunkSize);
    for (let from = 0; from < samples; from += size) out.push({ from, to: Math.min(samples, from + size) });
    return out;
  }
  const weightsOf = (k: number) => Array.from({ length: k }, (_, i) => (k === 1 ? 1 : LAST_TO_FIRST ** (i / (k - 1))));
  const sum = (w: number[]) => w.reduce((x, y) => x + y, 0);
  // The most chunks whose last one still holds MIN_CHUNK_SAMPLES.
  let k = CHUNKS_PER_RUN;
  while (k > 1 && (samples * weightsOf(k)[k - 1]) / sum(weightsOf(k)) < MIN_CHUNK_SAMPLES) k--;
  const w = weightsOf(k), total = sum(w);
  let acc = 0, from = 0;
  for (let i = 0; i < k && from < samples; i++) {
    acc += w[i];
    const to = i === k - 1 ? samples : Math.round((samples * acc) / total);
    if (to > from) out.push({ from, to });
    from = to;
  }
  return out;
}

/** States in which a run or chunk may still change. */
export const OPEN_STATES = ['queued', 'running'] as const;
const CLOSED_STATES = ['done', 'failed', 'cancelled'];

/** Job payload of one chunk. */
export interface RobustnessChunkJob {
  runId: string;
  chunk: number;
}

/** A run's stored JSON, read once where the row is read (an unreadable value throws StoredDataError). */
export function runModel(run: Pick<RobustnessRunRow, 'model'>): RobustnessModel {
  return readStored(robustnessModelSchema, run.model, 'robustness_runs.model');
}

/** What every chunk of the run computes from: the stored snapshot plus the run's own settings. */
export function storedRunInputs(run: Pick<RobustnessRunRow, 'inputs' | 'toleranceDeg' | 'seed' | 'model'>): RobustnessInputs {
  const stored = readStored(robustnessRunInputsSchema, run.inputs, 'robustness_runs.inputs');
  return { ...stored, toleranceDeg: run.toleranceDeg, seed: run.seed, model: runModel(run) };
}

/** The merged figures, null until the run is done. */
export function runFigures(run: Pick<RobustnessRunRow, 'figures'>): RobustnessFigures | null {
  return run.figures === null ? null : readStored(robustnessFiguresSchema, run.figures, 'robustness_runs.figures');
}

/** A done chunk's stored samples. */
export function storedSamples(results: RobustnessChunkRow['results']): RobustnessSample[] {
  return readStored(z.array(robustnessSampleSchema), results, 'robustness_chunks.results');
}

/** What a new run needs. */
export interface NewRun {
  sequenceVersionId?: string;
  planId?: string;
  candidateIndex?: number;
  body: Body;
  sequence: Sequence;
  target: Quat;
  toleranceDeg: number;
  samples?: number;
  seed?: number;
  model?: RobustnessModel;
  chunkSize?: number;
  requestedBy?: string | null;
}

/** The inputs of a version's run: its compiled steps on the body of its profile version, toward its target. */
export function versionRunInputs(v: StoredVersion): Pick<NewRun, 'body' | 'sequence' | 'target' | 'toleranceDeg' | 'sequenceVersionId'> {
  return {
    sequenceVersionId: v.id,
    body: v.body,
    sequence: v.compiled.sequence,
    target: targetQuat(v.target),
    toleranceDeg: v.target.toleranceDeg,
  };
}

/** Inserts a run and its chunks (queued); returns the run id. Enqueue its chunks after the commit. */
export async function createRobustnessRun(db: Database, run: NewRun): Promise<string> {
  const samples = run.samples ?? DEFAULT_ROBUSTNESS_SAMPLES;
  const ranges = chunkRanges(samples, run.chunkSize);
  const model = robustnessModelSchema.parse(run.model ?? DEFAULT_ROBUSTNESS_MODEL);
  return db.transaction(async (tx) => {
    const [row] = await tx.insert(robustnessRuns).values({
      sequenceVersionId: run.sequenceVersionId ?? null,
      planId: run.planId ?? null,
      candidateIndex: run.candidateIndex ?? null,
      samples,
      // The largest chunk (a default split's chunks shrink toward the end).
      chunkSize: ranges[0]?.to ?? 0,
      seed: run.seed ?? DEFAULT_ROBUSTNESS_SEED,
      model,
      toleranceDeg: run.toleranceDeg,
      inputs: { body: run.body, sequence: run.sequence, target: [...run.target] } satisfies RobustnessRunInputs,
      requestedBy: run.requestedBy ?? null,
    }).returning({ id: robustnessRuns.id });
    await tx.insert(robustnessChunks).values(ranges.map((r, i) => ({ runId: row.id, chunkIndex: i, fromSample: r.from, toSample: r.to })));
    return row.id;
  });
}

/** Sends a job for every chunk of the run that is still queued (a duplicate job is harmless). */
export async function enqueueRobustnessChunks(ctx: AppContext, boss: PgBoss, runId: string, only?: number[]): Promise<void> {
  const open = await ctx.db.select({ chunk: robustnessChunks.chunkIndex }).from(robustnessChunks)
    .where(and(eq(robustnessChunks.runId, runId), eq(robustnessChunks.state, 'queued')))
    .orderBy(asc(robustnessChunks.chunkIndex));
  const wanted = only ? open.filter((c) => only.includes(c.chunk)) : open;
  if (!wanted.length) return;
  await boss.insert(ROBUSTNESS_CHUNK_QUEUE, wanted.map((c) => ({ data: { runId, chunk: c.chunk } satisfies RobustnessChunkJob })));
}

/**
 * Inputs of the runs this process worked on lately, by run id (a run's inputs never change): a run's
 * further chunks skip reading and parsing them again.
 */
const runInputs = new Map<string, RobustnessInputs>();
const RUN_INPUTS_KEPT = 8;

async function inputsOf(db: Database, runId: string): Promise<RobustnessInputs | null> {
  const kept = runInputs.get(runId);
  if (kept) return kept;
  const [run] = await db.select({ inputs: robustnessRuns.inputs, toleranceDeg: robustnessRuns.toleranceDeg, seed: robustnessRuns.seed, model: robustnessRuns.model })
    .from(robustnessRuns).where(eq(robustnessRuns.id, runId));
  if (!run) return null;
  const inputs = storedRunInputs(run);
  runInputs.set(runId, inputs);
  if (runInputs.size > RUN_INPUTS_KEPT) runInputs.delete(runInputs.keys().next().value!);
  return inputs;
}

/**
 * Runs one chunk job. Throws only for what a retry may fix (the process shutting down, the database).
 * `compute` is the thread pool (or a gate in front of it). Logs where the chunk's time went at debug
 * level (`chunkTiming`: claim, wait for a thread, compute, merge; npm run bench:jobs reads it).
 */
export async function runRobustnessChunk(
  ctx: AppContext, compute: Pick<ChunkPool, 'run'>, job: RobustnessChunkJob,
  opts: { signal?: AbortSignal; attempt: number; retryLimit: number; checkEveryMs?: number; receivedAt?: number },
): Promise<void> {
  const { db } = ctx;
  const fetchedAt = opts.receivedAt ?? Date.now();
  const t0 = performance.now();
  const { rows: [claimed] } = await db.execute<{ chunk_index: number; from_sample: number; to_sample: number }>(claimSql(job.runId, job.chunk));
  if (!claimed) return;
  const chunk = { chunkIndex: claimed.chunk_index, fromSample: claimed.from_sample, toSample: claimed.to_sample };
  let inputs: RobustnessInputs | null;
  try {
    inputs = await inputsOf(db, job.runId);
  } catch (err) {
    if (!(err instanceof StoredDataError)) throw err;
    // Unreadable stored inputs: a retry would read the same row, so the run fails now, naming the field.
    await failRobustnessRun(ctx, job.runId, `samples ${chunk.fromSample}–${chunk.toSample - 1} failed: ${err.message}`, chunk.chunkIndex);
    return;
  }
  if (!inputs) return;
  const claimMs = performance.now() - t0;

  // Stop when the run is cancelled (checked here) or the queue takes the job away (its signal).
  const stop = new AbortController();
  const onJobAbort = () => stop.abort();
  opts.signal?.addEventListener('abort', onJobAbort, { once: true });
  const watch = setInterval(() => {
    void db.select({ state: robustnessRuns.state }).from(robustnessRuns).where(eq(robustnessRuns.id, job.runId))
      .then(([r]) => { if (!r || CLOSED_STATES.includes(r.state)) stop.abort(); })
      .catch(() => undefined);
  }, opts.checkEveryMs ?? 1000);
  watch.unref();

  let result: ChunkResult;
  const t1 = performance.now();
  try {
    result = await compute.run(job.runId, inputs, chunk.fromSample, chunk.toSample, stop.signal);
  } catch (err) {
    if (err instanceof ChunkAbortedError) {
      if (opts.signal?.aborted) throw new Error('the queue took this chunk back (its run was cancelled or its claim expired)');
      return; // the run was cancelled or failed meanwhile
    }
    const message = err instanceof Error ? err.message : String(err);
    if (/pool is closed/.test(message)) throw err; // shutting down: another worker retries it
    // The model failed on these inputs: a retry would fail the same way, so the run fails now.
    await failRobustnessRun(ctx, job.runId, `samples ${chunk.fromSample}–${chunk.toSample - 1} failed: ${message}`, chunk.chunkIndex);
    return;
  } finally {
    clearInterval(watch);
    opts.signal?.removeEventListener('abort', onJobAbort);
  }
  const t2 = performance.now();
  await mergeChunk(ctx, job.runId, chunk.chunkIndex, result.samples);
  const t3 = performance.now();
  ctx.logger.debug({
    chunkTiming: {
      runId: job.runId, chunk: chunk.chunkIndex, fetchedAt, claimMs: round(claimMs), waitMs: round(t2 - t1 - result.computeMs),
      computeMs: round(result.computeMs), mergeMs: round(t3 - t2), doneAt: Date.now(),
    },
  }, 'robustness chunk timing');
}

const round = (ms: number) => Math.round(ms * 100) / 100;

function chunkOpen() {
  return notInArray(robustnessChunks.state, ['done', 'cancelled']);
}

/**
 * Claims a chunk while it and its run are open (state running, one more attempt) and marks a queued
 * run running, in one statement; returns the chunk's range, no row when it is not open.
 */
const claimSql = (runId: string, chunk: number) => sql`
with claimed as (
  update robustness_chunks set state = 'running', attempts = attempts + 1, error = null
  where run_id = ${runId} and chunk_index = ${chunk} and state not in ('done', 'cancelled')
    and exists (select 1 from robustness_runs where id = ${runId} and state in ('queued', 'running'))
  returning chunk_index, from_sample, to_sample
), started as (
  update robustness_runs set state = 'running', started_at = coalesce(started_at, now())
  where id = ${runId} and state = 'queued' and exists (select 1 from claimed)
)
select chunk_index, from_sample, to_sample from claimed`;

/**
 * Stores a chunk's samples while it and its run are open and adds its size to the run's done
 * samples, in one statement (one transaction); returns the run's count after it, no row when nothing
 * was stored (a duplicate, or the run closed). Concurrent merges of one run queue on the run row only
 * for this statement, and each adds to the count the one before left (READ COMMITTED re-reads it).
 */
const mergeSql = (runId: string, chunk: number, samples: RobustnessSample[]) => sql`
with stored as (
  update robustness_chunks set state = 'done', results = ${JSON.stringify(samples)}::jsonb, finished_at = now(), error = null
  where run_id = ${runId} and chunk_index = ${chunk} and state not in ('done', 'cancelled')
    and exists (select 1 from robustness_runs where id = ${runId} and state in ('queued', 'running'))
  returning to_sample - from_sample as n
)
update robustness_runs set done_samples = done_samples + (select n from stored), state = 'running'
where id = ${runId} and state in ('queued', 'running') and exists (select 1 from stored)
returning done_samples, samples`;

/** Stores one chunk's samples and, when they complete the run, its figures. Idempotent. */
export async function mergeChunk(ctx: AppContext, runId: string, chunkIndex: number, samples: RobustnessSample[]): Promise<void> {
  const { rows: [run] } = await ctx.db.execute<{ done_samples: number; samples: number }>(mergeSql(runId, chunkIndex, samples));
  if (run && run.done_samples >= run.samples) await finishRobustnessRun(ctx, runId);
}

/**
 * Computes and stores the figures of an open run whose samples are all in; true when this call
 * finished it (false when it was not open, not complete, or finished by another call).
 */
export async function finishRobustnessRun(ctx: AppContext, runId: string): Promise<boolean> {
  return ctx.db.transaction(async (tx) => {
    // Only the columns needed here (the stored inputs are large), locked so that one call finishes it.
    const [run] = await tx.select({
      state: robustnessRuns.state, doneSamples: robustnessRuns.doneSamples, samples: robustnessRuns.samples, toleranceDeg: robustnessRuns.toleranceDeg,
      seed: robustnessRuns.seed, sequenceVersionId: robustnessRuns.sequenceVersionId, planId: robustnessRuns.planId,
    }).from(robustnessRuns).where(eq(robustnessRuns.id, runId)).for('update');
    if (!run || CLOSED_STATES.includes(run.state) || run.doneSamples < run.samples) return false;
    const all = await tx.select({ results: robustnessChunks.results }).from(robustnessChunks).where(eq(robustnessChunks.runId, runId));
    const figures = summariseRobustness(all.flatMap((c) => storedSamples(c.results)), run.toleranceDeg);
    await tx.update(robustnessRuns).set({ state: 'done', figures, finishedAt: new Date() }).where(eq(robustnessRuns.id, runId));
    await recordAudit(tx, {
      actorId: null, action: 'robustness.done', objectType: run.sequenceVersionId ? 'sequence_version' : 'plan', objectId: run.sequenceVersionId ?? run.planId ?? runId,
      detail: { runId, samples: figures.samples, seed: run.seed, openLoopP95Deg: figures.openLoopP95Deg, feedbackP95Deg: figures.feedbackP95Deg },
    });
    return true;
  });
}

/** Marks an open run failed with a reason the UI shows; its other chunks stop. */
export async function failRobustnessRun(ctx: AppContext, runId: string, reason: string, chunkIndex?: number): Promise<boolean> {
  return closeRun(ctx, runId, 'failed', reason, chunkIndex);
}

/** Cancels an open run: no chunk takes further work, running chunks stop within about a second. */
export async function cancelRobustnessRun(ctx: AppContext, boss: PgBoss | null, runId: string, reason: string): Promise<boolean> {
  const closed = await closeRun(ctx, runId, 'cancelled', reason);
  if (closed && boss) {
      const jobs = await boss.findJobs<RobustnessChunkJob>(ROBUSTNESS_CHUNK_QUEUE, { data: { runId }, queued: true });
    if (jobs.length) await boss.cancel(ROBUSTNESS_CHUNK_QUEUE, jobs.map((j) => j.id));
  }
  return closed;
}

async function closeRun(ctx: AppContext, runId: string, state: 'failed' | 'cancelled', reason: string, chunkIndex?: number): Promise<boolean> {
  return ctx.db.transaction(async (tx) => {
    // The run's chunk rows first, then the run row: the order in which a claim and a merge take them
    // (each updates its chunk, then the run), so closing while chunks merge waits instead of deadlocking.
    await tx.select({ chunk: robustnessChunks.chunkIndex }).from(robustnessChunks).where(eq(robustnessChunks.runId, runId))
      .orderBy(asc(robustnessChunks.chunkIndex)).for('update');
    const [run] = await tx.update(robustnessRuns).set({ state, error: reason, finishedAt: new Date() })
      .where(and(eq(robustnessRuns.id, runId), inArray(robustnessRuns.state, [...OPEN_STATES]))).returning();
    if (!run) return false;
    if (chunkIndex !== undefined) {
      await tx.update(robustnessChunks).set({ state: 'failed', error: reason, finishedAt: new Date() })
        .where(and(eq(robustnessChunks.runId, runId), eq(robustnessChunks.chunkIndex, chunkIndex), chunkOpen()));
    }
    await tx.update(robustnessChunks).set({ state: 'cancelled', finishedAt: new Date() })
      .where(and(eq(robustnessChunks.runId, runId), inArray(robustnessChunks.state, [...OPEN_STATES])));
    await recordAudit(tx, {
      actorId: null, action: `robustness.${state}`, objectType: run.sequenceVersionId ? 'sequence_version' : 'plan', objectId: run.sequenceVersionId ?? run.planId ?? run.id,
      detail: { runId, reason },
    });
    return true;
  });
}

/** The API view of a run. */
export async function robustnessRunView(db: Database, run: RobustnessRunRow): Promise<RobustnessRun> {
  const counts = await db.select({ state: robustnessChunks.state, n: sql<number>`count(*)::int` }).from(robustnessChunks)
    .where(eq(robustnessChunks.runId, run.id)).groupBy(robustnessChunks.state);
  const chunks = counts.reduce((s, c) => s + c.n, 0);
  const chunksDone = counts.find((c) => c.state === 'done')?.n ?? 0;
  const f = runFigures(run);
  return {
    id: run.id,
    sequenceVersionId: run.sequenceVersionId,
    planId: run.planId,
    candidateIndex: run.candidateIndex,
    state: run.state,
    progress: run.state === 'done' ? 1 : run.doneSamples / Math.max(1, run.samples),
    samples: run.samples,
    seed: run.seed,
    model: runModel(run),
    toleranceDeg: run.toleranceDeg,
    openLoopP95Deg: f?.openLoopP95Deg ?? null,
    feedbackP95Deg: f?.feedbackP95Deg ?? null,
    p50Deg: f?.p50Deg ?? null,
    withinToleranceShare: f?.withinToleranceShare ?? null,
    feedbackErrorsDeg: f?.feedbackErrorsDeg ?? null,
    error: run.error,
    chunks,
    chunksDone,
    createdAt: run.createdAt.toISOString(),
    startedAt: run.startedAt?.toISOString() ?? null,
    finishedAt: run.finishedAt?.toISOString() ?? null,
  };
}
