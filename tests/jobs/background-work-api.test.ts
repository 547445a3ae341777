/**
 * The admin view of background work: queued work is listed with its label and state, a cancel ends it
 * with the admin's name as the reason, a retry puts it back in the queue; only admins may use it.
 * No worker runs here, so nothing moves on its own.
 */
import { eq } from 'drizzle-orm';
import { beforeAll, describe, expect, it } from 'vitest';

import { robustnessChunks } from '../../db/schema/index.ts';
import { ROBUSTNESS_CHUNK_QUEUE } from '../../server/jobs/queue-names.ts';
import type { BackgroundWork } from '../../shared/contracts/background-work.ts';
import type { RobustnessRun } from '../../shared/contracts/robustness-run.ts';
import { as, crewOf, draftedVersion, PEOPLE } from '../maneuvers/maneuver-api.ts';
import { apiError, bodyOf } from '../support/response-body.ts';
import { testAppForFile } from '../support/test-app.ts';

const t = testAppForFile({ env: { ROBUSTNESS_SAMPLES: '30', ROBUSTNESS_CHUNK_SIZE: '10' }, jobQueue: { worker: false, reconcile: false } });
let versionId: string;
beforeAll(async () => {
  versionId = await draftedVersion(t, await crewOf(t, PEOPLE.trainee), 'Admin view test');
});

const list = async (filter: string) => {
  const res = await as(t, PEOPLE.admin).get(`/jobs?filter=${filter}`);
  if (res.status !== 200) throw new Error(`GET /jobs: ${res.status} ${JSON.stringify(res.body)}`);
  return res.body as BackgroundWork;
};

describe('GET/POST /api/jobs', () => {
  it('lists, cancels and retries a robustness run', async () => {
    const open = await list('open');
    const run = open.items.find((i) => i.kind === 'robustness');
    expect(run).toMatchObject({ state: 'queued', progress: 0, canCancel: true, canRetry: false });
    expect(run!.label).toMatch(/^Robustness of Admin view test v1 \(30 samples, seed 1\)$/);
    expect(open.queues.find((q) => q.queue === ROBUSTNESS_CHUNK_QUEUE)!.queued).toBe(3);

    expect(apiError(await as(t, PEOPLE.admin).post(`/jobs/robustness/${run!.id}/retry`)).code).toBe('not_failed');
    expect((await as(t, PEOPLE.admin).post(`/jobs/robustness/${run!.id}/cancel`)).status).toBe(200);
    const failed = await list('failed');
    const cancelled = failed.items.find((i) => i.id === run!.id);
    expect(cancelled).toMatchObject({ state: 'cancelled', canRetry: true, canCancel: false });
    expect(cancelled!.error).toMatch(/^Cancelled by /);
    expect((await list('failed')).queues.find((q) => q.queue === ROBUSTNESS_CHUNK_QUEUE)!.cancelled).toBe(3);

    expect((await as(t, PEOPLE.admin).post(`/jobs/robustness/${run!.id}/retry`)).status).toBe(202);
    const again = (await list('open')).items.find((i) => i.id === run!.id);
    expect(again).toMatchObject({ state: 'queued', error: null });
    const chunks = await t.ctx.db.select().from(robustnessChunks).where(eq(robustnessChunks.runId, run!.id));
    expect(chunks.map((c) => c.state)).toEqual(['queued', 'queued', 'queued']);
    expect((await list('open')).queues.find((q) => q.queue === ROBUSTNESS_CHUNK_QUEUE)!.queued).toBe(3);
    // The version's own robustness endpoint agrees.
    expect(bodyOf<RobustnessRun>(await as(t, PEOPLE.planner).get(`/sequences/versions/${versionId}/robustness`)).state).toBe('queued');
  });

  it('is for admins only and names bad parameters', async () => {
    expect((await as(t, PEOPLE.planner).get('/jobs')).status).toBe(403);
    expect((await as(t, PEOPLE.reviewer).post('/jobs/plan/00000000-0000-4000-8000-000000000000/cancel')).status).toBe(403);
    const badKind = await as(t, PEOPLE.admin).post('/jobs/nonsense/00000000-0000-4000-8000-000000000000/cancel');
    expect(badKind.status).toBe(400);
    expect(JSON.stringify(badKind.body)).toMatch(/kind/);
    expect((await as(t, PEOPLE.admin).get('/jobs?filter=everything')).status).toBe(400);
    expect((await as(t, PEOPLE.admin).post('/jobs/plan/00000000-0000-4000-8000-000000000000/cancel')).status).toBe(404);
  });
});
