/**
 * Robustness runs as chunked background work: saving a version queues its run; chunks run as jobs
 * and merge to exactly the figures of one thread computing every sample (sample i is seeded by
 * (seed, i)); a run reports progress; a cancelled run stops its chunks; the API guards who may
 * start, read and cancel.
 */
import { and, eq, sql } from 'drizzle-orm';
import { beforeAll, describe, expect, it } from 'vitest';

import { auditEvents, robustnessChunks, robustnessRuns } from '../../db/schema/index.ts';
import { ROBUSTNESS_CHUNK_QUEUE } from '../../server/jobs/queue-names.ts';
import { reconcileWork } from '../../server/jobs/reconcile-work.ts';
import {
  cancelRobustnessRun, createRobustnessRun, finishRobustnessRun, mergeChunk, robustnessRunView, runFigures, storedRunInputs, versionRunInputs,
} from '../../server/jobs/robustness/robustness-runs.ts';
import { loadStoredVersion } from '../../server/maneuvers/stored-version.ts';
import { robustnessSamples, summariseRobustness } from '../../server/planning/robustness.ts';
import { robustnessModelSchema } from '../../shared/contracts/robustness.ts';
import type { RobustnessRun } from '../../shared/contracts/robustness-run.ts';
import { as, crewOf, draftedVersion, PEOPLE } from '../maneuvers/maneuver-api.ts';
import { eventually } from '../support/eventually.ts';
import { apiError, bodyOf } from '../support/response-body.ts';
import { testAppForFile } from '../support/test-app.ts';

// Small runs so the suite stays quick: 40 samples in chunks of 7 (6 chunks, the last one short).
const t = testAppForFile({
  env: { ROBUSTNESS_SAMPLES: '40', ROBUSTNESS_CHUNK_SIZE: '7', WORKER_CONCURRENCY: '2' },
  jobQueue: { pollingIntervalS: 0.5, superviseS: 1 },
});
let versionId: string;

beforeAll(async () => {
  versionId = await draftedVersion(t, await crewOf(t, PEOPLE.trainee), 'Robustness run test');
});

describe('robustness run of a saved version', () => {
  it('is queued by the save and merges its chunks to the figures of one thread', async () => {
    const run = await eventually(async () => {
      const r = await as(t, PEOPLE.planner).get(`/sequences/versions/${versionId}/robustness`);
      expect(r.status).toBe(200);
      const body = bodyOf<RobustnessRun>(r);
      expect(body.progress).toBeGreaterThanOrEqual(0);
      expect(body.progress).toBeLessThanOrEqual(1);
      return ['done', 'failed', 'cancelled'].includes(body.state) ? body : undefined;
    }, 90_000);
    expect(run).toMatchObject({ state: 'done', progress: 1, samples: 40, seed: 1, chunks: 6, chunksDone: 6, error: null });

    // The same samples computed in one thread, in one call.
    const v = (await loadStoredVersion(t.ctx.db, versionId))!;
    const inputs = { ...versionRunInputs(v), seed: 1, model: robustnessModelSchema.parse(run.model) };
    const single = summariseRobustness(robustnessSamples(inputs, 0, 40), inputs.toleranceDeg);
    expect(run.openLoopP95Deg).toBe(single.openLoopP95Deg);
    expect(run.feedbackP95Deg).toBe(single.feedbackP95Deg);
    expect(run.p50Deg).toBe(single.p50Deg);
    expect(run.withinToleranceShare).toBe(single.withinToleranceShare);
    expect(run.feedbackErrorsDeg).toEqual(single.feedbackErrorsDeg);
    expect(run.feedbackP95Deg).toBeGreaterThan(0);

    // Exactly one result: one 'done' audit event for the run.
    const done = await t.ctx.db.select().from(auditEvents).where(and(eq(auditEvents.action, 'robustness.done'), eq(auditEvents.objectId, versionId)));
    expect(done).toHaveLength(1);

    // A trainee does not see a draft version's run; a reviewer does.
    expect((await as(t, PEOPLE.reviewer).get(`/sequences/versions/${versionId}/robustness`)).status).toBe(200);
    expect((await as(t, PEOPLE.trainee).get(`/sequences/versions/${versionId}/robustness`)).status).toBe(404);
  }, 120_000);

  it('merging a chunk twice (a retried job) changes nothing', async () => {
    const [run] = await t.ctx.db.select().from(robustnessRuns).where(eq(robustnessRuns.sequenceVersionId, versionId));
    const before = await robustnessRunView(t.ctx.db, run);
    await mergeChunk(t.ctx, run.id, 0, [{ index: 0, openLoopErrorDeg: 99, feedbackErrorDeg: 99 }]);
    const [again] = await t.ctx.db.select().from(robustnessRuns).where(eq(robustnessRuns.id, run.id));
    expect(await robustnessRunView(t.ctx.db, again)).toEqual(before);
  });

  it('a run whose samples are all in but whose last merger died before the figures is finished by the reconciliation pass, once', async () => {
    const v = (await loadStoredVersion(t.ctx.db, versionId))!;
    const runId = await createRobustnessRun(t.ctx.db, { ...versionRunInputs(v), samples: 6, chunkSize: 3, seed: 5 });
    const [row] = await t.ctx.db.select().from(robustnessRuns).where(eq(robustnessRuns.id, runId));
    const samples = robustnessSamples(storedRunInputs(row), 0, 6);
    // What the merges leave when the worker that completed the count stops before computing the figures.
    await t.ctx.db.update(robustnessChunks).set({ state: 'done', results: samples.slice(0, 3) }).where(and(eq(robustnessChunks.runId, runId), eq(robustnessChunks.chunkIndex, 0)));
    await t.ctx.db.update(robustnessChunks).set({ state: 'done', results: samples.slice(3) }).where(and(eq(robustnessChunks.runId, runId), eq(robustnessChunks.chunkIndex, 1)));
    await t.ctx.db.update(robustnessRuns).set({ state: 'running', doneSamples: 6 }).where(eq(robustnessRuns.id, runId));
    await reconcileWork(t.ctx, t.jobs);
    const [done] = await t.ctx.db.select().from(robustnessRuns).where(eq(robustnessRuns.id, runId));
    expect(done.state).toBe('done');
    expect(runFigures(done)).toEqual(summariseRobustness(samples, done.toleranceDeg));
    // Finishing again (another worker's pass) changes nothing: one 'done' audit event.
    expect(await finishRobustnessRun(t.ctx, runId)).toBe(false);
    const events = await t.ctx.db.select().from(auditEvents).where(eq(auditEvents.action, 'robustness.done'));
    expect(events.filter((e) => (e.detail as { runId?: string }).runId === runId)).toHaveLength(1);
  }, 60_000);

  it('closing a run while its chunks merge neither deadlocks nor fails either side (chunk rows are locked before the run row everywhere)', async () => {
    const v = (await loadStoredVersion(t.ctx.db, versionId))!;
    for (let round = 0; round < 10; round++) {
      const runId = await createRobustnessRun(t.ctx.db, { ...versionRunInputs(v), samples: 200, chunkSize: 5 });
      const merges = Array.from({ length: 40 }, (_, i) => mergeChunk(t.ctx, runId, i, Array.from({ length: 5 }, (_, k) => ({ index: i * 5 + k, openLoopErrorDeg: 1, feedbackErrorDeg: 1 }))));
      await new Promise((r) => setTimeout(r, round));
      const outcomes = await Promise.allSettled([...merges, cancelRobustnessRun(t.ctx, null, runId, 'stopped by the test')]);
      expect(outcomes.filter((o) => o.status === 'rejected')).toEqual([]);
      const [row] = await t.ctx.db.select().from(robustnessRuns).where(eq(robustnessRuns.id, runId));
      expect(['cancelled', 'done']).toContain(row.state);
    }
  }, 60_000);

  it('a cancelled run stops its chunks: no chunk finishes after the cancel and no job stays queued', async () => {
    // A long run: 2,000 samples in chunks of 5.
    const started = await as(t, PEOPLE.planner).post(`/sequences/versions/${versionId}/robustness`, { samples: 2000, seed: 7 });
    expect(started.status).toBe(202);
    // Queued, or already running: a worker may claim the first chunk (which marks the run running)
    // before the answer is built.
    expect(started.body).toMatchObject({ samples: 2000, seed: 7 });
    expect(['queued', 'running']).toContain(bodyOf<RobustnessRun>(started).state);
    const runId = bodyOf<RobustnessRun>(started).id;
    // A second start while it runs is refused.
    const twice = await as(t, PEOPLE.planner).post(`/sequences/versions/${versionId}/robustness`, {});
    expect(twice.status).toBe(409);
    expect(apiError(twice).code).toBe('run_open');

    await eventually(async () => {
      const r = await as(t, PEOPLE.planner).get(`/sequences/versions/${versionId}/robustness`);
      return bodyOf<RobustnessRun>(r).id === runId && bodyOf<RobustnessRun>(r).progress > 0 ? true : undefined;
    }, 60_000, 100);
    // Trainees and reviewers may not cancel.
    expect((await as(t, PEOPLE.reviewer).post(`/sequences/versions/${versionId}/robustness/cancel`)).status).toBe(403);
    const cancelled = await as(t, PEOPLE.planner).post(`/sequences/versions/${versionId}/robustness/cancel`);
    expect(cancelled.status).toBe(200);
    expect(bodyOf<RobustnessRun>(cancelled).state).toBe('cancelled');
    expect(bodyOf<RobustnessRun>(cancelled).error).toMatch(/Cancelled by/);
    const doneAtCancel = bodyOf<RobustnessRun>(cancelled).chunksDone;
    expect(doneAtCancel).toBeLessThan(400);

    // Give running chunks time to notice (they check every second), then nothing more completes.
    await new Promise((r) => setTimeout(r, 2500));
    const chunks = await t.ctx.db.select().from(robustnessChunks).where(eq(robustnessChunks.runId, runId));
    const done = chunks.filter((c) => c.state === 'done').length;
    expect(done).toBe(doneAtCancel);
    expect(chunks.filter((c) => c.state === 'queued' || c.state === 'running')).toHaveLength(0);
    const live = (await t.jobs.boss.findJobs(ROBUSTNESS_CHUNK_QUEUE, { data: { runId } })).filter((j) => ['created', 'retry', 'active'].includes(j.state));
    expect(live).toHaveLength(0);
    const [row] = await t.ctx.db.select().from(robustnessRuns).where(eq(robustnessRuns.id, runId));
    expect(row.state).toBe('cancelled');
    expect(row.figures).toBeNull();

    // Cancelling again: nothing open.
    expect(apiError(await as(t, PEOPLE.planner).post(`/sequences/versions/${versionId}/robustness/cancel`)).code).toBe('no_open_run');
  }, 120_000);

  it('a run whose stored inputs were damaged fails at once with the column and field, instead of computing from a default', async () => {
    const v = (await loadStoredVersion(t.ctx.db, versionId))!;
    const runId = await createRobustnessRun(t.ctx.db, { ...versionRunInputs(v), samples: 10, chunkSize: 10 });
    await t.ctx.db.update(robustnessRuns).set({ inputs: sql`jsonb_set(${robustnessRuns.inputs}, '{body,segments,0,mass}', '"heavy"')` }).where(eq(robustnessRuns.id, runId));
    await t.jobs.enqueueRobustness!(runId);
    const row = await eventually(async () => {
      const [r] = await t.ctx.db.select().from(robustnessRuns).where(eq(robustnessRuns.id, runId));
      return r.state === 'queued' || r.state === 'running' ? undefined : r;
    }, 60_000);
    expect(row.state).toBe('failed');
    expect(row.error).toContain('robustness_runs.inputs.body.segments.0.mass');
    expect(row.figures).toBeNull();
    const [chunk] = await t.ctx.db.select().from(robustnessChunks).where(eq(robustnessChunks.runId, runId));
    expect(chunk).toMatchObject({ state: 'failed', attempts: 1 });
  }, 90_000);

  it('refuses bad requests naming the field', async () => {
    const bad = await as(t, PEOPLE.planner).post(`/sequences/versions/${versionId}/robustness`, { samples: 5 });
    expect(bad.status).toBe(400);
    expect(JSON.stringify(bad.body)).toMatch(/samples/);
    expect((await as(t, PEOPLE.planner).post(`/sequences/versions/${versionId}/robustness`, { seed: -1 })).status).toBe(400);
    expect((await as(t, PEOPLE.planner).get('/sequences/versions/not-an-id/robustness')).status).toBe(400);
    expect((await as(t, PEOPLE.planner).get('/sequences/versions/00000000-0000-4000-8000-000000000000/robustness')).status).toBe(404);
  });
});
