/**
 * The planning API end to end: a planner's request is validated and queued (202 with a plan id),
 * the pg-boss worker runs the planner in a thread, and GET returns ranked candidates whose best
 * meets the sequence's tolerance; refusals name the field; every request leaves an audit event.
 */
import { and, eq } from 'drizzle-orm';
import { beforeAll, describe, expect, it } from 'vitest';

import { auditEvents } from '../../db/schema/index.ts';
import type { CandidateMotionResponse } from '../../shared/contracts/motion.ts';
import { CANDIDATE_TRACK_POINTS, type Plan } from '../../shared/contracts/plan.ts';
import { as, PEOPLE } from '../maneuvers/maneuver-api.ts';
import { eventually } from '../support/eventually.ts';
import { apiError, bodyOf } from '../support/response-body.ts';
import { testAppForFile } from '../support/test-app.ts';
import { createQuarterTurnSequence } from './quarter-turn-sequence.ts';

const t = testAppForFile({ jobQueue: { pollingIntervalS: 1 } });
let sequenceId: string;
/** The finished plan of the first test (the motion test previews its candidates). */
let donePlan: Plan | undefined;
beforeAll(async () => {
  sequenceId = await createQuarterTurnSequence(t, 'Quarter turn (plan test)');
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
    donePlan = plan;

    const events = await t.ctx.db.select().from(auditEvents).where(and(eq(auditEvents.objectType, 'plan'), eq(auditEvents.objectId, planId)));
    expect(events.map((e) => e.action).sort()).toEqual(['plan.done', 'plan.request']);
    // The reviewer may read it; a trainee may not.
    expect((await as(t, PEOPLE.reviewer).get(`/sequences/${sequenceId}/plans/${planId}`)).status).toBe(200);
    expect((await as(t, PEOPLE.trainee).get(`/sequences/${sequenceId}/plans/${planId}`)).status).toBe(403);
  }, 90_000);

  it('stores an attitude track per candidate and previews a candidate\'s motion on the plan\'s body', async () => {
    expect(donePlan, 'the first test finished a plan').toBeTruthy();
    const plan = donePlan!;
    for (const c of plan.candidates) {
      const tr = c.track!;
      expect(tr.t.length).toBeLessThanOrEqual(CANDIDATE_TRACK_POINTS);
      for (const k of ['yawDeg', 'pitchDeg', 'rollDeg'] as const) expect(tr[k]).toHaveLength(tr.t.length);
      expect(tr.t[0]).toBe(0);
      // Ends at the candidate's duration and its verified final yaw/pitch/roll (unwrapped, so up to whole turns; stored to 0.01°).
      expect(tr.t.at(-1)).toBeCloseTo(c.durationS, 2);
      const turns = (a: number, b: number) => Math.abs(((a - b + 540) % 360) - 180);
      expect(turns(tr.yawDeg.at(-1)!, c.yprDeg.yaw)).toBeLessThan(0.01);
      expect(turns(tr.pitchDeg.at(-1)!, c.yprDeg.pitch)).toBeLessThan(0.01);
      expect(turns(tr.rollDeg.at(-1)!, c.yprDeg.roll)).toBeLessThan(0.01);
    }
    const best = plan.candidates[0];
    const url = `/sequences/${sequenceId}/plans/${plan.id}/candidates/1/motion`;
    const res = await as(t, PEOPLE.planner).get(url);
    expect(res.status).toBe(200);
    const m = bodyOf<CandidateMotionResponse>(res);
    expect(m.planId).toBe(plan.id);
    expect(m.rank).toBe(1);
    // One timeline entry per composer step (DECISIONS.md "Steps"), covering the candidate's duration.
    expect(m.steps).toHaveLength(best.primitives.length);
    expect(m.duration).toBeCloseTo(best.durationS, 9);
    expect(m.samples.frames.at(-1)!.t).toBeCloseTo(best.durationS, 9);
    // The same engine on the same body and steps ends where the plan's verification ended (independent runs, 1e-6 rad).
    const a = m.final.attitude;
    const b = best.final.attitude;
    expect(Math.abs(a.w * b.w + a.x * b.x + a.y * b.y + a.z * b.z)).toBeGreaterThan(Math.cos(1e-6 / 2));
    expect(m.engineVersion).toBe(t.ctx.engineVersion);
    // A second request is served from memory: the same text.
    expect((await as(t, PEOPLE.planner).get(url)).text).toBe(res.text);
    expect((await as(t, PEOPLE.reviewer).get(url)).status).toBe(200);
    expect((await as(t, PEOPLE.trainee).get(url)).status).toBe(403);
    const noRank = await as(t, PEOPLE.planner).get(`/sequences/${sequenceId}/plans/${plan.id}/candidates/8/motion`);
    expect(noRank.status).toBe(404);
    expect(apiError(noRank).message).toContain('Suggestion 8');
    const badRank = await as(t, PEOPLE.planner).get(`/sequences/${sequenceId}/plans/${plan.id}/candidates/first/motion`);
    expect(badRank.status).toBe(400);
    expect(apiError(badRank).field).toBe('rank');
    expect((await as(t, PEOPLE.planner).get(`/sequences/${sequenceId}/plans/00000000-0000-4000-8000-000000000000/candidates/1/motion`)).status).toBe(404);
  }, 60_000);

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
