/**
 * Cancelling background work ends it `cancelled` and stops it: a running plan's planner thread is
 * terminated (the job returns long before the plan could have finished, and nothing is stored
 * afterwards); a cancelled re-verification's job leaves the record cancelled. No queue worker runs
 * here: the jobs' functions are called directly, as a worker would.
 */
import { and, eq } from 'drizzle-orm';
import { describe, expect, it } from 'vitest';

import { auditEvents, crewMembers, plans, reverifications } from '../../db/schema/index.ts';
import { reverifyVersion } from '../../server/jobs/reverify-version.ts';
import { runPlan } from '../../server/jobs/run-plan.ts';
import type { VersionDetail } from '../../shared/contracts/maneuver.ts';
import type { Plan } from '../../shared/contracts/plan.ts';
import { as, createSequence, crewOf, PEOPLE, saveVersion } from '../maneuvers/maneuver-api.ts';
import { createQuarterTurnSequence } from '../planning/quarter-turn-sequence.ts';
import { eventually } from '../support/eventually.ts';
import { apiError, bodyOf } from '../support/response-body.ts';
import { testAppForFile } from '../support/test-app.ts';

const t = testAppForFile();

describe('cancelling background work', () => {
  it('a running plan cancelled by its planner ends `cancelled` and its thread stops within seconds', async () => {
    const sequenceId = await createQuarterTurnSequence(t, 'Quarter turn (cancel)');
    // The largest plan the API accepts: several candidates with 1,000 robustness samples each (many seconds of work).
    const res = await as(t, PEOPLE.planner).post(`/sequences/${sequenceId}/plans`, { samples: 1000, maxCandidates: 8 });
    expect(res.status).toBe(202);
    const { planId } = res.body as { planId: string };
    const job = runPlan(t.ctx, { planId }, { checkEveryMs: 100 });
    const running = await eventually(async () => {
      const [p] = await t.ctx.db.select().from(plans).where(eq(plans.id, planId));
      return p.state === 'running' ? p : undefined;
    }, 60_000, 20);
    expect(running.state).toBe('running');

    const cancel = await as(t, PEOPLE.planner).post(`/sequences/${sequenceId}/plans/${planId}/cancel`);
    expect(cancel.status).toBe(200);
    expect(cancel.body).toMatchObject({ state: 'cancelled', candidates: [] });
    expect(bodyOf<Plan>(cancel).error).toMatch(/^Cancelled by /);
    const cancelledAt = Date.now();
    await job;
    const stoppedAfterMs = Date.now() - cancelledAt;
    // The planner thread only ends on its own with a result: returning with none means it was terminated.
    expect(stoppedAfterMs).toBeLessThan(3000);
    const [after] = await t.ctx.db.select().from(plans).where(eq(plans.id, planId));
    expect(after.state).toBe('cancelled');
    expect(after.progress).toBeLessThan(1);
    expect(after.candidates).toBeNull();
    const done = await t.ctx.db.select().from(auditEvents).where(and(eq(auditEvents.objectId, planId), eq(auditEvents.action, 'plan.done')));
    expect(done).toHaveLength(0);
    // A second cancel: nothing open.
    const again = await as(t, PEOPLE.planner).post(`/sequences/${sequenceId}/plans/${planId}/cancel`);
    expect(again.status).toBe(409);
    expect(apiError(again).code).toBe('not_open');
    // A retried job of a cancelled plan does nothing.
    await runPlan(t.ctx, { planId });
    const [still] = await t.ctx.db.select({ state: plans.state }).from(plans).where(eq(plans.id, planId));
    expect(still.state).toBe('cancelled');
  }, 120_000);

  it('only planners and admins cancel plans; unknown plans answer 404', async () => {
    const sequenceId = await createQuarterTurnSequence(t, 'Quarter turn (cancel rights)');
    const { planId } = (await as(t, PEOPLE.planner).post(`/sequences/${sequenceId}/plans`, {})).body as { planId: string };
    expect((await as(t, PEOPLE.reviewer).post(`/sequences/${sequenceId}/plans/${planId}/cancel`)).status).toBe(403);
    expect((await as(t, PEOPLE.trainee).post(`/sequences/${sequenceId}/plans/${planId}/cancel`)).status).toBe(403);
    expect((await as(t, PEOPLE.planner).post(`/sequences/${sequenceId}/plans/00000000-0000-4000-8000-000000000000/cancel`)).status).toBe(404);
    expect((await as(t, PEOPLE.admin).post(`/jobs/plan/${planId}/cancel`)).status).toBe(200);
    const [p] = await t.ctx.db.select().from(plans).where(eq(plans.id, planId));
    expect(p.state).toBe('cancelled');
  });

  it('a cancelled re-verification stays cancelled when its job runs', async () => {
    const crew = await crewOf(t, PEOPLE.trainee);
    const sequenceId = await createSequence(t, crew, 'Re-verification cancel');
    const versionId = bodyOf<VersionDetail>(await saveVersion(t, sequenceId, 0)).id;
    const [m] = await t.ctx.db.select().from(crewMembers).where(eq(crewMembers.id, crew));
    const changed = await as(t, PEOPLE.planner).post(`/crew/${crew}/versions`, {
      baseVersion: m.currentVersion, note: 'mass drift (test)', inputs: { sex: 'female', stature: 1.67, mass: 61, suitId: null },
    });
    expect(changed.status).toBe(201);
    // A draft is not re-verified; make the record a cleared version would get, then cancel it as the admin.
    const toProfileVersionId = (changed.body as { version: { id: string } }).version.id;
    const [record] = await t.ctx.db.insert(reverifications).values({
      sequenceVersionId: versionId, fromProfileVersionId: bodyOf<VersionDetail>(await as(t, PEOPLE.planner).get(`/sequences/versions/${versionId}`)).profileVersionId, toProfileVersionId,
    }).returning();
    expect((await as(t, PEOPLE.admin).post(`/jobs/reverification/${record.id}/cancel`)).status).toBe(200);
    await reverifyVersion(t.ctx, { sequenceVersionId: versionId, toProfileVersionId }, { attempt: 0, retryLimit: 3 });
    const [after] = await t.ctx.db.select().from(reverifications).where(eq(reverifications.id, record.id));
    expect(after.state).toBe('cancelled');
    expect(after.report).toBeNull();
    expect(after.error).toMatch(/^Cancelled by /);
  });
});
