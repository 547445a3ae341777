/**
 * The planning API end to end: a planner's request is validated and queued (202 with a plan id),
 * the pg-boss worker runs the planner in a thread, and GET returns ranked candidates whose best
 * meets the sequence's tolerance; refusals name the field; every request leaves an audit event.
 */
import { and, eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';

import { auditEvents } from '../../db/schema/index.ts';
import { type RunningJobQueue, startJobQueue } from '../../server/jobs/job-queue.ts';
import type { Plan } from '../../shared/contracts/plan.ts';
import { as, PEOPLE } from '../maneuvers/maneuver-api.ts';
import { eventually } from '../support/eventually.ts';
import { apiError, bodyOf } from '../support/response-body.ts';
import { startTestApp, type TestApp } from '../support/test-app.ts';
import { createQuarterTurnSequence } from './quarter-turn-sequence.ts';

let t: TestApp;
let jobs: RunningJobQueue;
let sequenceId: string;
beforeAll(async () => {
  t = await startTestApp();
  jobs = await startJobQueue(t.ctx, { pollingIntervalS: 1 });
  t.ctx.jobs = jobs;
  sequenceId = await createQuarterTurnSequence(t, 'Quarter turn (plan test)');
}, 120_000);
afterAll(async () => {
  await jobs?.stop();
  await t?.close();
});


describe('POST /api/sequences/:id/plans', () => {
  it('queues a plan that the worker completes with ranked candidates', async () => {
    const res = await as(t, PEOPLE.planner).post(`/sequences/${sequenceId}/plans`, { samples: 20, maxCandidates: 3 });
    expect(res.status).toBe(202);
    const { planId } = res.body as { planId: string };
    const plan = await eventually(async () => {
      const r = await as(t, PEOPLE.planner).get(`/sequences/${sequenceId}/plans/${planId}`);
      expect(r.status).toBe(200);
      const body = bodyOf<Plan>(r);
      return body.state === 'done' || body.state === 'failed' ? body : undefined;
    });
    expect(plan.error).toBeNull();
    expect(plan.state).toBe('done');
    expect(plan.candidates.length).toBeGreaterThan(0);
    // The planner's notes travel with the plan (empty or plain sentences).
    expect(Array.isArray(plan.notes)).toBe(true);
    for (const n of plan.notes as unknown[]) expect(typeof n).toBe('string');
    expect(plan.candidates.map((c: { rank: number }) => c.rank)).toEqual(plan.candidates.map((_: unknown, i: number) => i + 1));
    const best = plan.candidates[0];
    expect(best.withinTolerance).toBe(true);
    expect(best.errorDeg).toBeLessThan(2);
    expect(best.cues.length).toBe(best.primitives.length);
    expect(best.robustness.samples).toBe(20);
    expect(best.robustness.openLoopP95Deg).toBeGreaterThanOrEqual(best.robustness.p50Deg * 0);
    expect(best.robustness.feedbackP95Deg).toBeGreaterThanOrEqual(best.robustness.p50Deg);
    expect(best.pathDeg).toBeGreaterThan(0);
    expect(best.sequence.steps.length).toBeGreaterThan(0);
    expect(plan.elapsedS).toBeGreaterThan(0);

    const events = await t.ctx.db.select().from(auditEvents).where(and(eq(auditEvents.objectType, 'plan'), eq(auditEvents.objectId, planId)));
    expect(events.map((e) => e.action).sort()).toEqual(['plan.done', 'plan.request']);
    // The reviewer may read it; a trainee may not.
    expect((await as(t, PEOPLE.reviewer).get(`/sequences/${sequenceId}/plans/${planId}`)).status).toBe(200);
    expect((await as(t, PEOPLE.trainee).get(`/sequences/${sequenceId}/plans/${planId}`)).status).toBe(403);
  }, 90_000);

  it('refuses bad settings naming the field, other roles, and unknown sequences', async () => {
    const bad = await as(t, PEOPLE.planner).post(`/sequences/${sequenceId}/plans`, { samples: 5 });
    expect(bad.status).toBe(400);
    expect(apiError(bad).field).toBe('samples');
    const perception = await as(t, PEOPLE.planner).post(`/sequences/${sequenceId}/plans`, { perceptionErrorDeg: 1 });
    expect(perception.status).toBe(400);
    expect(apiError(perception).field).toBe('perceptionErrorDeg');
    const spread = await as(t, PEOPLE.planner).post(`/sequences/${sequenceId}/plans`, { spreads: { massPct: -1 } });
    expect(spread.status).toBe(400);
    expect(apiError(spread).field).toBe('spreads.massPct');
    expect((await as(t, PEOPLE.reviewer).post(`/sequences/${sequenceId}/plans`, {})).status).toBe(403);
    expect((await as(t, PEOPLE.trainee).post(`/sequences/${sequenceId}/plans`, {})).status).toBe(403);
    const missing = await as(t, PEOPLE.planner).post('/sequences/00000000-0000-4000-8000-000000000000/plans', {});
    expect(missing.status).toBe(404);
    expect((await as(t, PEOPLE.planner).get(`/sequences/${sequenceId}/plans/00000000-0000-4000-8000-000000000000`)).status).toBe(404);
    expect((await as(t, PEOPLE.planner).get(`/sequences/${sequenceId}/plans/not-an-id`)).status).toBe(400);
  });
});
