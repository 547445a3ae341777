/**
 * Listing a sequence's plans (GET /api/sequences/:id/plans), which the composer uses to find its
 * latest run again after a reload: newest first, each with state, progress, candidate count and
 * the best candidate's error as the plan itself reports them; refusals name the field.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';

import { type RunningJobQueue, startJobQueue } from '../../server/jobs/job-queue.ts';
import type { Plan, PlanCreated, PlanList } from '../../shared/contracts/plan.ts';
import { as, PEOPLE } from '../maneuvers/maneuver-api.ts';
import { eventually } from '../support/eventually.ts';
import { apiError, bodyOf } from '../support/response-body.ts';
import { testAppForFile } from '../support/test-app.ts';
import { createQuarterTurnSequence } from './quarter-turn-sequence.ts';

const t = testAppForFile();
let jobs: RunningJobQueue | undefined;
let sequenceId: string;
beforeAll(async () => {
  // No job queue yet: a requested plan stays queued until one starts.
  sequenceId = await createQuarterTurnSequence(t, 'Quarter turn (plan list test)');
});
afterAll(async () => {
  await jobs?.stop();
});


async function list(query = ''): Promise<PlanList> {
  const res = await as(t, PEOPLE.planner).get(`/sequences/${sequenceId}/plans${query}`);
  expect(res.status).toBe(200);
  return res.body as PlanList;
}

describe('GET /api/sequences/:id/plans', () => {
  it('lists the plans newest first with their state, candidate count and best error', async () => {
    expect((await list()).plans).toEqual([]);

    const first = await as(t, PEOPLE.planner).post(`/sequences/${sequenceId}/plans`, { samples: 10, maxCandidates: 2 });
    expect(first.status).toBe(202);
    const firstId = bodyOf<PlanCreated>(first).planId;
    const queued = (await list()).plans;
    expect(queued).toHaveLength(1);
    expect(queued[0]).toMatchObject({ id: firstId, state: 'queued', progress: 0, candidateCount: 0, bestErrorDeg: null });
    expect(Number.isNaN(Date.parse(queued[0].createdAt))).toBe(false);

    // A queue started now picks up the waiting plan.
    jobs = await startJobQueue(t.ctx, { pollingIntervalS: 1 });
    const plan = await eventually(async () => {
      const r = await as(t, PEOPLE.planner).get(`/sequences/${sequenceId}/plans/${firstId}`);
      const p = r.body as Plan;
      return p.state === 'done' || p.state === 'failed' ? p : undefined;
    });
    expect(plan.state).toBe('done');
    expect(plan.candidates.length).toBeGreaterThan(0);

    // A second request while no queue is attached to the API stays queued: it is the newest.
    const second = await as(t, PEOPLE.admin).post(`/sequences/${sequenceId}/plans`, { samples: 10 });
    expect(second.status).toBe(202);
    const secondId = bodyOf<PlanCreated>(second).planId;

    const both = (await list()).plans;
    expect(both.map((p) => p.id)).toEqual([secondId, firstId]);
    expect(both[0]).toMatchObject({ state: 'queued', candidateCount: 0, bestErrorDeg: null });
    expect(both[1]).toMatchObject({ state: 'done', progress: 1, candidateCount: plan.candidates.length, bestErrorDeg: plan.candidates[0].errorDeg, createdAt: plan.createdAt });
    expect(Date.parse(both[0].createdAt)).toBeGreaterThanOrEqual(Date.parse(both[1].createdAt));

    // The latest only, as the composer asks for it; the admin sees the same list.
    expect((await list('?limit=1')).plans.map((p) => p.id)).toEqual([secondId]);
    const asAdmin = await as(t, PEOPLE.admin).get(`/sequences/${sequenceId}/plans`);
    expect(asAdmin.status).toBe(200);
    expect((asAdmin.body as PlanList).plans.map((p) => p.id)).toEqual([secondId, firstId]);
  }, 120_000);

  it('refuses other roles, bad limits and ids naming the field, and unknown sequences', async () => {
    expect((await as(t, PEOPLE.reviewer).get(`/sequences/${sequenceId}/plans`)).status).toBe(403);
    expect((await as(t, PEOPLE.trainee).get(`/sequences/${sequenceId}/plans`)).status).toBe(403);
    for (const limit of ['0', '101', '1.5', 'many']) {
      const bad = await as(t, PEOPLE.planner).get(`/sequences/${sequenceId}/plans?limit=${limit}`);
      expect(bad.status, `limit=${limit}`).toBe(400);
      expect(apiError(bad).field).toBe('limit');
    }
    const badId = await as(t, PEOPLE.planner).get('/sequences/not-an-id/plans');
    expect(badId.status).toBe(400);
    expect(apiError(badId).field).toBe('sequenceId');
    expect((await as(t, PEOPLE.planner).get('/sequences/00000000-0000-4000-8000-000000000000/plans')).status).toBe(404);
  });
});
