/**
 * Background re-verification: a profile change flags cleared and under-review versions `recheck`
 * without making the request wait, and the pg-boss worker recomputes each on the new body, storing
 * how far the final attitude moved. The recomputation is checked against the engine run directly
 * on the same compiled steps and the new body; a failing job is retried and finally marked failed.
 */
import { and, eq } from 'drizzle-orm';
import { beforeAll, describe, expect, it } from 'vitest';

import { crewMembers, profileVersions, reverifications, sequences, sequenceVersions } from '../../db/schema/index.ts';
import { simulate } from '../../server/engine/simulate.ts';
import { REVERIFY_RETRY_LIMIT } from '../../server/jobs/job-queue.ts';
import { readStoredCompiled } from '../../server/maneuvers/stored-version.ts';
import type { VersionDetail } from '../../shared/contracts/maneuver.ts';
import { quatAngleBetween } from '../../shared/math/quaternion.ts';
import { eventually } from '../support/eventually.ts';
import { bodyOf } from '../support/response-body.ts';
import { testAppForFile } from '../support/test-app.ts';
import { as, createSequence, crewOf, PEOPLE, saveVersion } from './maneuver-api.ts';

const t = testAppForFile({ jobQueue: { retryDelayS: 1, pollingIntervalS: 1 } });
let crew: string;
beforeAll(async () => {
  crew = await crewOf(t, PEOPLE.trainee);
});

const DEG = 180 / Math.PI;
const quat = (a: { w: number; x: number; y: number; z: number }) => [a.w, a.x, a.y, a.z];


async function versionIn(status: 'cleared' | 'under_review' | 'drafting'): Promise<string> {
  const sequenceId = await createSequence(t, crew, `Recheck ${status}`);
  const v = bodyOf<VersionDetail>(await saveVersion(t, sequenceId, 0)).id;
  if (status === 'drafting') return v;
  await as(t, PEOPLE.planner).post(`/sequences/versions/${v}/submit`, { acknowledgeFailures: true, note: 're-check test' });
  if (status === 'cleared') await as(t, PEOPLE.reviewer).post(`/reviews/${v}/decision`, { decision: 'clear', comment: '' });
  return v;
}

async function changeProfile(massKg: number) {
  const [m] = await t.ctx.db.select().from(crewMembers).where(eq(crewMembers.id, crew));
  return as(t, PEOPLE.planner).post(`/crew/${crew}/versions`, {
    baseVersion: m.currentVersion, note: 'mass drift (test)', inputs: { sex: 'female', stature: 1.67, mass: massKg, suitId: null },
  });
}

describe('re-verification after a profile change', () => {
  it('flags cleared and under-review versions, recomputes them on the new body, and leaves drafts alone', async () => {
    const cleared = await versionIn('cleared');
    const reviewing = await versionIn('under_review');
    const draft = await versionIn('drafting');

    const res = await changeProfile(68);
    expect(res.status).toBe(201);
    // Flagged by the time the save answers; the recomputation happens later, in the worker.
    const rows = await t.ctx.db.select().from(sequenceVersions).where(eq(sequenceVersions.id, cleared));
    expect(rows[0].status).toBe('recheck');
    expect(rows[0].staleSince).not.toBeNull();
    const [flagged] = await t.ctx.db.select({ s: sequenceVersions.status }).from(sequenceVersions).where(eq(sequenceVersions.id, reviewing));
    expect(flagged.s).toBe('recheck');
    const [kept] = await t.ctx.db.select({ s: sequenceVersions.status }).from(sequenceVersions).where(eq(sequenceVersions.id, draft));
    expect(kept.s).toBe('drafting');

    const done = await eventually(async () => {
      const [r] = await t.ctx.db.select().from(reverifications).where(and(eq(reverifications.sequenceVersionId, cleared), eq(reverifications.state, 'done')));
      return r;
    });
    // The same compiled steps on the new body, run by the engine directly.
    const [pv] = await t.ctx.db.select().from(profileVersions).where(eq(profileVersions.id, done.toProfileVersionId));
    const [v] = await t.ctx.db.select().from(sequenceVersions).where(eq(sequenceVersions.id, cleared));
    const direct = simulate(pv.body, readStoredCompiled(v.id, v.compiled).sequence, { rateHz: 20 });
    const old = (v.report as { final: { attitude: { w: number; x: number; y: number; z: number } } }).final.attitude;
    const expectedShift = quatAngleBetween(quat(old), quat(direct.final.attitude)) * DEG;
    expect(done.attitudeShiftDeg).toBeCloseTo(expectedShift, 6);
    // A heavier body turns less for the same limb motion: the attitude really moved.
    expect(done.attitudeShiftDeg).toBeGreaterThan(1e-4);

    // The API shows the difference; a recheck version cannot be submitted again.
    const detail = await as(t, PEOPLE.planner).get(`/sequences/versions/${cleared}`);
    expect(bodyOf<VersionDetail>(detail).status).toBe('recheck');
    expect(bodyOf<VersionDetail>(detail).profileIsCurrent).toBe(false);
    expect(bodyOf<VersionDetail>(detail).reverification).toMatchObject({ state: 'done' });
    expect(bodyOf<VersionDetail>(detail).reverification!.attitudeShiftDeg).toBeCloseTo(expectedShift, 6);
    expect((await as(t, PEOPLE.planner).post(`/sequences/versions/${reviewing}/submit`)).status).toBe(409);

    // The trainee still sees the once-cleared version, flagged.
    const trainee = await as(t, PEOPLE.trainee).get(`/sequences/versions/${cleared}`);
    expect(trainee.status).toBe(200);
    expect(bodyOf<VersionDetail>(trainee).status).toBe('recheck');
  }, 90_000);

  it('retries a failing recomputation and marks it failed after the last attempt', async () => {
    // A version whose stored steps no longer fit the contract (written behind the API's back).
    const [pv] = await t.ctx.db.select().from(profileVersions).where(eq(profileVersions.crewMemberId, crew));
    const [seq] = await t.ctx.db.insert(sequences).values({ crewMemberId: crew, name: 'Broken (test)', target: { mode: 'ypr', yprDeg: { yaw: 0, pitch: 0, roll: 0 } } }).returning();
    const [bad] = await t.ctx.db.insert(sequenceVersions).values({
      sequenceId: seq.id, version: 1, primitives: [], target: seq.target, compiled: { sequence: { start: {}, steps: [{ kind: 'twirl' }] }, cues: [], stepMap: [] },
      profileVersionId: pv.id, status: 'under_review',
    }).returning();
    expect((await changeProfile(70)).status).toBe(201);
    const failed = await eventually(async () => {
      const [r] = await t.ctx.db.select().from(reverifications).where(and(eq(reverifications.sequenceVersionId, bad.id), eq(reverifications.state, 'failed')));
      return r;
    }, 60_000);
    expect(failed.attempts).toBe(REVERIFY_RETRY_LIMIT + 1);
    expect(failed.error).toMatch(/kind|twirl|step/i);
  }, 90_000);
});
