/**
 * The target belongs to the version (DECISIONS.md "Versions, targets and approvals"): a save stores
 * its own target, the sequence's target is only the next version's default, and a sequence whose
 * latest version is under review or cleared cannot be retargeted (409 cleared_version).
 */
import { eq } from 'drizzle-orm';
import { beforeAll, describe, expect, it } from 'vitest';

import { sequences, sequenceVersions } from '../../db/schema/index.ts';
import type { SequenceDetail, SequenceTarget, VersionDetail } from '../../shared/contracts/maneuver.ts';
import { apiError, bodyOf } from '../support/response-body.ts';
import { testAppForFile } from '../support/test-app.ts';
import { as, createSequence, crewOf, PEOPLE, saveVersion, THREE_STEPS } from './maneuver-api.ts';

const t = testAppForFile();
let crew: string;
beforeAll(async () => {
  crew = await crewOf(t, PEOPLE.trainee);
});

const ypr = (yaw: number, pitch = 0, roll = 0) => ({ mode: 'ypr' as const, yprDeg: { yaw, pitch, roll }, toleranceDeg: 3 });

/** The yaw/pitch/roll of a target these tests set in that form. */
function yprOf(target: SequenceTarget) {
  if (target.mode !== 'ypr') throw new Error(`expected a yaw/pitch/roll target, got ${target.mode}`);
  return target.yprDeg;
}

describe('a version keeps its own target', () => {
  it('saving stores the sequence target as the version target; an under-review or cleared latest version blocks retargeting (409 cleared_version)', async () => {
    const id = await createSequence(t, crew, 'Target test A');
    const v1 = await saveVersion(t, id, 0);
    expect(v1.status).toBe(201);
    expect(bodyOf<VersionDetail>(v1).target).toMatchObject({ mode: 'ypr', yprDeg: { yaw: 0, pitch: 5, roll: 0 }, toleranceDeg: 3 });

    // Drafting: the default target may still change (it does not touch version 1).
    expect((await as(t, PEOPLE.planner).patch(`/sequences/${id}`, { target: ypr(10) })).status).toBe(200);
    expect(yprOf(bodyOf<VersionDetail>(await as(t, PEOPLE.planner).get(`/sequences/versions/${bodyOf<VersionDetail>(v1).id}`)).target).yaw).toBe(0);

    // Under review: no retargeting; renaming is still fine.
    const v2 = await saveVersion(t, id, 1);
    expect(yprOf(bodyOf<VersionDetail>(v2).target).yaw).toBe(10);
    expect((await as(t, PEOPLE.planner).post(`/sequences/versions/${bodyOf<VersionDetail>(v2).id}/submit`, { acknowledgeFailures: true, note: 'target test' })).status).toBe(200);
    const blocked = await as(t, PEOPLE.planner).patch(`/sequences/${id}`, { target: ypr(45) });
    expect(blocked.status).toBe(409);
    expect(apiError(blocked).code).toBe('cleared_version');
    expect((await as(t, PEOPLE.planner).patch(`/sequences/${id}`, { name: 'Target test A (renamed)' })).status).toBe(200);

    // Cleared: still no retargeting, and the version's target and report are what was reviewed.
    const cleared = await as(t, PEOPLE.reviewer).post(`/reviews/${bodyOf<VersionDetail>(v2).id}/decision`, { decision: 'clear', comment: 'ok' });
    expect(cleared.status).toBe(200);
    const again = await as(t, PEOPLE.admin).patch(`/sequences/${id}`, { target: ypr(45) });
    expect(again.status).toBe(409);
    expect(apiError(again).code).toBe('cleared_version');
    const shown = await as(t, PEOPLE.trainee).get(`/sequences/versions/${bodyOf<VersionDetail>(v2).id}`);
    expect(bodyOf<VersionDetail>(shown).status).toBe('cleared');
    expect(yprOf(bodyOf<VersionDetail>(shown).target).yaw).toBe(10);
    const [seq] = await t.ctx.db.select().from(sequences).where(eq(sequences.id, id));
    expect((seq.target as { yprDeg: { yaw: number } }).yprDeg.yaw).toBe(10);
  }, 60_000);

  it('a save with a new target stores it on the new version and makes it the default; older versions keep theirs', async () => {
    const id = await createSequence(t, crew, 'Target test B');
    const v1 = await saveVersion(t, id, 0);
    const v2 = await as(t, PEOPLE.planner).post(`/sequences/${id}/versions`, { primitives: THREE_STEPS, baseVersion: 1, target: ypr(-20, 0, 5) });
    expect(v2.status).toBe(201);
    expect(yprOf(bodyOf<VersionDetail>(v2).target)).toEqual({ yaw: -20, pitch: 0, roll: 5 });
    // The report is verified against the version's own target.
    expect(bodyOf<VersionDetail>(v2).report!.target.toleranceDeg).toBe(3);
    expect(yprOf(bodyOf<VersionDetail>(await as(t, PEOPLE.planner).get(`/sequences/versions/${bodyOf<VersionDetail>(v1).id}`)).target)).toEqual({ yaw: 0, pitch: 5, roll: 0 });
    expect(yprOf(bodyOf<SequenceDetail>(await as(t, PEOPLE.planner).get(`/sequences/${id}`)).target)).toEqual({ yaw: -20, pitch: 0, roll: 5 });
  }, 60_000);

  it('the database refuses to change a saved version\'s target', async () => {
    const id = await createSequence(t, crew, 'Target test C');
    const v1 = await saveVersion(t, id, 0);
    await expect(t.ctx.db.update(sequenceVersions).set({ target: ypr(90) }).where(eq(sequenceVersions.id, bodyOf<VersionDetail>(v1).id))).rejects.toThrow();
  }, 60_000);
});
