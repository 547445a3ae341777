/**
 * Re-verifying many versions after a profile change as one piece of work: the crew member's
 * progress counts every record toward the new profile version by state, and "stop" cancels the open
 * ones together — a job that runs later for a cancelled record stores nothing. No queue worker runs
 * here: records stay queued until the job function is called directly, as a worker would.
 */
import { eq } from 'drizzle-orm';
import { beforeAll, describe, expect, it } from 'vitest';

import { crewMembers, reverifications } from '../../db/schema/index.ts';
import { reverifyVersion } from '../../server/jobs/reverify-version.ts';
import type { ReverificationProgress } from '../../shared/contracts/maneuver.ts';
import { as, clearedVersion, crewOf, PEOPLE } from '../maneuvers/maneuver-api.ts';
import { apiError } from '../support/response-body.ts';
import { testAppForFile } from '../support/test-app.ts';

const t = testAppForFile();
let crew: string;
beforeAll(async () => {
  crew = await crewOf(t, PEOPLE.trainee);
});


const progress = async (who: string = PEOPLE.planner) => {
  const res = await as(t, who).get(`/crew/${crew}/reverifications`);
  expect(res.status).toBe(200);
  return res.body as ReverificationProgress;
};

describe('re-verification progress and stop', () => {
  it('counts the versions of one profile change, advances as they are recomputed, and stops the rest together', async () => {
    const a = await clearedVersion(t, crew, 'Progress A');
    const b = await clearedVersion(t, crew, 'Progress B');
    const c = await clearedVersion(t, crew, 'Progress C');
    const [m] = await t.ctx.db.select().from(crewMembers).where(eq(crewMembers.id, crew));
    const saved = await as(t, PEOPLE.planner).post(`/crew/${crew}/versions`, {
      baseVersion: m.currentVersion, note: 'mass drift (test)', inputs: { sex: 'female', stature: 1.67, mass: 63, suitId: null },
    });
    expect(saved.status).toBe(201);
    const to = (saved.body as { version: { id: string; version: number } }).version;

    // The three cleared here and the demo's own cleared maneuvers of this crew member.
    const before = await progress();
    const n = before.total;
    expect(n).toBeGreaterThanOrEqual(3);
    expect(before).toMatchObject({ toProfileVersionId: to.id, toProfileVersion: to.version, queued: n, done: 0, progress: 0 });
    expect(before.items.filter((i) => i.sequenceName.startsWith('Progress ')).map((i) => i.sequenceName)).toEqual(['Progress A', 'Progress B', 'Progress C']);
    // The trainee whose profile it is may watch it too.
    expect((await progress(PEOPLE.trainee)).total).toBe(n);

    await reverifyVersion(t.ctx, { sequenceVersionId: a, toProfileVersionId: to.id }, { attempt: 0, retryLimit: 3 });
    const one = await progress();
    expect(one).toMatchObject({ total: n, done: 1, queued: n - 1 });
    expect(one.progress).toBeCloseTo(1 / n, 12);
    expect(one.items.find((i) => i.sequenceName === 'Progress A')!.attitudeShiftDeg).toBeGreaterThan(0);

    // Only planners and admins stop it.
    expect((await as(t, PEOPLE.trainee).post(`/crew/${crew}/reverifications/cancel`)).status).toBe(403);
    expect((await as(t, PEOPLE.reviewer).post(`/crew/${crew}/reverifications/cancel`)).status).toBe(403);
    const stopped = await as(t, PEOPLE.planner).post(`/crew/${crew}/reverifications/cancel`);
    expect(stopped.status).toBe(200);
    expect(stopped.body).toMatchObject({ total: n, done: 1, cancelled: n - 1, queued: 0, running: 0, progress: 1 });

    // A job that runs afterwards for a stopped version changes nothing.
    await reverifyVersion(t.ctx, { sequenceVersionId: b, toProfileVersionId: to.id }, { attempt: 0, retryLimit: 3 });
    const rows = await t.ctx.db.select().from(reverifications).where(eq(reverifications.toProfileVersionId, to.id));
    expect(rows.map((r) => r.state).sort()).toEqual([...Array<string>(n - 1).fill('cancelled'), 'done']);
    expect(rows.find((r) => r.sequenceVersionId === c)!.error).toMatch(/^Cancelled by /);
    // Nothing left to stop.
    const again = await as(t, PEOPLE.planner).post(`/crew/${crew}/reverifications/cancel`);
    expect(again.status).toBe(409);
    expect(apiError(again).code).toBe('not_open');
  }, 120_000);
});
