/**
 * The demo data shows the whole truth (issue 12, item 6): every demo version that was ever cleared
 * returns its robustness (done, 1,000 samples, seed 1), its path and one rotation per composer step
 * from GET /api/sequences/versions/:id, and every demo version lists its robustness. The demo runs
 * were computed ahead (db/seed/demo-robustness.ts); re-computing the first chunk of every run here
 * with the worker's code must give the stored samples (reproducible by seed: sample i draws from
 * the stream seeded by (seed, i)).
 */
import { eq, isNotNull, or } from 'drizzle-orm';
import { describe, expect, it } from 'vitest';

import { reverifications, robustnessChunks, robustnessRuns, sequenceVersions } from '../../db/schema/index.ts';
import { DEMO_ERROR_DIGITS } from '../../db/seed/demo-robustness.ts';
import { runFigures, storedRunInputs, storedSamples } from '../../server/jobs/robustness/robustness-runs.ts';
import { robustnessSamples, summariseRobustness } from '../../server/planning/robustness.ts';
import type { ReviewQueueItem, VersionDetail } from '../../shared/contracts/maneuver.ts';
import { bodyOf } from '../support/response-body.ts';
import { testAppForFile } from '../support/test-app.ts';
import { as,PEOPLE } from './maneuver-api.ts';

/** The stored errors are rounded to 1e-6°. */
const STORED_TOL_DEG = 10 ** -DEMO_ERROR_DIGITS;

const t = testAppForFile();

describe('demo data', () => {
  it('computes every demo version\'s robustness ahead (none left queued: otherwise run npx tsx db/seed/precompute-demo-robustness.ts)', async () => {
    const runs = await t.ctx.db.select({ state: robustnessRuns.state, version: robustnessRuns.sequenceVersionId }).from(robustnessRuns);
    const versions = await t.ctx.db.select({ id: sequenceVersions.id }).from(sequenceVersions);
    expect(runs.length).toBe(versions.length);
    expect(runs.filter((r) => r.state !== 'done')).toEqual([]);
  });

  it('returns robustness, path and per-step rotations on every cleared (or once cleared) demo version', async () => {
    const cleared = await t.ctx.db.select({ id: sequenceVersions.id }).from(sequenceVersions)
      .where(or(eq(sequenceVersions.status, 'cleared'), isNotNull(sequenceVersions.clearedAt)));
    expect(cleared.length).toBeGreaterThanOrEqual(3);
    for (const { id } of cleared) {
      const res = await as(t, PEOPLE.reviewer).get(`/sequences/versions/${id}`);
      expect(res.status).toBe(200);
      const v = res.body as VersionDetail;
      const r = v.report!.robustness!;
      expect(r).toMatchObject({ state: 'done', progress: 1, samples: 1000, seed: 1 });
      for (const f of [r.openLoopP95Deg, r.feedbackP95Deg, r.p50Deg]) expect(f).toBeGreaterThan(0);
      expect(r.withinToleranceShare).toBeGreaterThanOrEqual(0);
      expect(r.withinToleranceShare).toBeLessThanOrEqual(1);
      expect(r.p50Deg!).toBeLessThanOrEqual(r.feedbackP95Deg!);
      expect(r.level).toMatch(/^(robust|marginal|not_robust)$/);
      expect(r.model.perceptionErrorDeg).toBeGreaterThanOrEqual(2);
      expect(r.model.reactionDelayS).toBeGreaterThanOrEqual(0.3);
      expect(v.report!.pathDeg).toBeGreaterThan(0);
      expect(v.report!.stepRotations!.map((s) => s.step)).toEqual(v.primitives.map((_p, i) => i));
      // The list view carries the same level.
      expect(v.robustness).toMatchObject({ state: 'done', feedbackP95Deg: r.feedbackP95Deg, level: r.level });
    }
  });

  it('has a maneuver in the reviewer\'s re-check queue: the automatic re-check version of a drill cleared on an older profile', async () => {
    const items = bodyOf<{ items: ReviewQueueItem[] }>(await as(t, PEOPLE.reviewer).get('/reviews/queue')).items;
    const recheck = items.filter((i) => i.version.recheckOfId !== null);
    expect(recheck.length).toBeGreaterThanOrEqual(1);
    const next = recheck[0].version;
    expect(next).toMatchObject({ status: 'under_review', authorId: null });
    const stale = bodyOf<VersionDetail>(await as(t, PEOPLE.reviewer).get(`/sequences/versions/${next.recheckOfId}`));
    expect(stale.status).toBe('recheck');
    expect(stale.clearedAt).not.toBeNull();
    // Bound to the current profile, with its re-verification's report and a robustness run computed ahead.
    const detail = bodyOf<VersionDetail>(await as(t, PEOPLE.reviewer).get(`/sequences/versions/${next.id}`));
    expect(detail.profileIsCurrent).toBe(true);
    const [rev] = await t.ctx.db.select().from(reverifications).where(eq(reverifications.resultVersionId, next.id));
    expect(rev).toMatchObject({ sequenceVersionId: stale.id, state: 'done' });
    expect(detail.report!.final).toEqual(rev.report!.final);
    expect(detail.report!.robustness).toMatchObject({ state: 'done', samples: 1000 });
    // The trainee reads the truth: it waits for the reviewer after a profile change.
    expect(stale.recheck?.successor).toEqual({ version: next.version, status: 'under_review', automatic: true });
  });

  it('stores samples that the worker\'s code reproduces from the seed (first chunk of every run re-computed)', async () => {
    const runs = await t.ctx.db.select().from(robustnessRuns);
    for (const run of runs) {
      const inputs = storedRunInputs(run);
      // The reader keeps the stored snapshot whole (the schema drops no field of body or target).
      expect(inputs.body).toEqual(run.inputs.body);
      expect(inputs.target).toEqual(run.inputs.target);
      const [chunk] = await t.ctx.db.select().from(robustnessChunks).where(eq(robustnessChunks.runId, run.id)).orderBy(robustnessChunks.chunkIndex).limit(1);
      const again = robustnessSamples(inputs, chunk.fromSample, chunk.toSample);
      const kept = storedSamples(chunk.results);
      expect(kept.map((s) => s.index)).toEqual(again.map((s) => s.index));
      again.forEach((s, k) => {
        expect(Math.abs(s.openLoopErrorDeg - kept[k].openLoopErrorDeg)).toBeLessThanOrEqual(STORED_TOL_DEG);
        expect(Math.abs(s.feedbackErrorDeg - kept[k].feedbackErrorDeg)).toBeLessThanOrEqual(STORED_TOL_DEG);
      });
      // The run's figures are those of its stored samples.
      const all = await t.ctx.db.select({ results: robustnessChunks.results }).from(robustnessChunks).where(eq(robustnessChunks.runId, run.id));
      const figures = summariseRobustness(all.flatMap((c) => storedSamples(c.results)), run.toleranceDeg);
      expect(runFigures(run)).toEqual(figures);
    }
  }, 120_000);
});
