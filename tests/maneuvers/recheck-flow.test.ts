/**
 * The honest re-check (DECISIONS.md "Re-check creates the next version"): a profile save answers with
 * the versions it made stale; the re-verification of a once-cleared version saves the next version
 * (same steps, new profile, system author, under review) that reaches the reviewer's queue; a person
 * re-clears it or sends it back; what the trainee reads about the stale version is true at each step.
 */
import { and, desc, eq } from 'drizzle-orm';
import { beforeAll, describe, expect, it } from 'vitest';

import { crewMembers, reverifications, sequenceVersions } from '../../db/schema/index.ts';
import type { ReviewQueueItem, VersionDetail } from '../../shared/contracts/maneuver.ts';
import type { SaveProfileResponse } from '../../shared/contracts/profile-version.ts';
import type { RehearsableVersion } from '../../shared/contracts/rehearsal.ts';
import { type RecheckInfo,recheckMessage } from '../../shared/product/recheck-status.ts';
import { eventually } from '../support/eventually.ts';
import { bodyOf } from '../support/response-body.ts';
import { testAppForFile } from '../support/test-app.ts';
import { as, createSequence, crewOf, PEOPLE, saveVersion } from './maneuver-api.ts';

describe('what the trainee reads (pure)', () => {
  const base: RecheckInfo = { staleSince: '2031-03-03T10:00:00Z', reverification: { state: 'queued', attitudeShiftDeg: null, error: null }, successor: null };
  it('queued or running: being re-verified, not rehearsable', () => {
    expect(recheckMessage(base)).toBe('Your profile changed; this maneuver is being re-verified on the new profile. A reviewer then decides on it again. Until then it cannot be rehearsed.');
  });
  it('re-verified and the automatic version under review: waiting for the reviewer with the shift', () => {
    const r: RecheckInfo = { ...base, reverification: { state: 'done', attitudeShiftDeg: 0.0123, error: null }, successor: { version: 4, status: 'under_review', automatic: true } };
    expect(recheckMessage(r)).toBe('Waiting for your reviewer after a profile change; re-verified, attitude moved 0.01°. Until then it cannot be rehearsed.');
    expect(recheckMessage(r, 'staff')).toBe('Waiting for a reviewer after a profile change; re-verified, attitude moved 0.01°. Until then the crew member cannot rehearse it.');
  });
  it('sent back, failed and cancelled each say so', () => {
    expect(recheckMessage({ ...base, successor: { version: 4, status: 'sent_back', automatic: true } })).toMatch(/sent the re-checked version 4 back/);
    expect(recheckMessage({ ...base, reverification: { state: 'failed', attitudeShiftDeg: null, error: 'step limit' } })).toMatch(/failed \(step limit\); a planner/);
    expect(recheckMessage({ ...base, reverification: { state: 'cancelled', attitudeShiftDeg: null, error: null } })).toMatch(/was stopped/);
  });
});

const t = testAppForFile({ env: { ROBUSTNESS_SAMPLES: '20', ROBUSTNESS_CHUNK_SIZE: '10' } });
let crew: string;
beforeAll(async () => {
  crew = await crewOf(t, PEOPLE.trainee);
});

async function clearedVersion(name: string): Promise<{ sequenceId: string; id: string }> {
  const sequenceId = await createSequence(t, crew, name);
  const id = bodyOf<VersionDetail>(await saveVersion(t, sequenceId, 0)).id;
  expect((await as(t, PEOPLE.planner).post(`/sequences/versions/${id}/submit`, { acknowledgeFailures: true, note: 're-check test' })).status).toBe(200);
  expect((await as(t, PEOPLE.reviewer).post(`/reviews/${id}/decision`, { decision: 'clear', comment: '' })).status).toBe(200);
  return { sequenceId, id };
}

async function changeProfile(massKg: number) {
  const [m] = await t.ctx.db.select().from(crewMembers).where(eq(crewMembers.id, crew));
  return as(t, PEOPLE.planner).post(`/crew/${crew}/versions`, {
    baseVersion: m.currentVersion, note: 'mass drift (test)', inputs: { sex: 'female', stature: 1.67, mass: massKg, suitId: null },
  });
}

const available = async () => bodyOf<{ versions: RehearsableVersion[] }>(await as(t, PEOPLE.trainee).get('/rehearsals/available')).versions;

describe('a profile change on cleared maneuvers', () => {
  it('lists the stale versions at save time; two quick changes give one re-check version on the newest profile; the reviewer re-clears or sends back; the trainee reads the truth and rehearses again', async () => {
    const a = await clearedVersion('Re-check A');
    const b = await clearedVersion('Re-check B');

    // No worker yet: the save answers at once with what went stale.
    const first = await changeProfile(61.5);
    expect(first.status).toBe(201);
    const body = first.body as SaveProfileResponse;
    const mine = body.staleVersions.filter((s) => s.versionId === a.id || s.versionId === b.id);
    expect(mine).toEqual([
      { versionId: a.id, sequenceId: a.sequenceId, sequenceName: 'Re-check A', version: 1, was: 'cleared', onceCleared: true },
      { versionId: b.id, sequenceId: b.sequenceId, sequenceName: 'Re-check B', version: 1, was: 'cleared', onceCleared: true },
    ]);
    let listed = (await available()).find((v) => v.versionId === a.id)!;
    expect(listed.status).toBe('recheck');
    expect(recheckMessage(listed.recheck!)).toMatch(/is being re-verified/);

    // A second change before any worker ran: the waiting versions are re-checked on the newest profile.
    const second = await changeProfile(62.2);
    expect((second.body as SaveProfileResponse).staleVersions.find((s) => s.versionId === a.id)).toMatchObject({ was: 'recheck', onceCleared: true });

    await t.startJobQueue({ pollingIntervalS: 0.5, superviseS: 1 });
    const [member] = await t.ctx.db.select().from(crewMembers).where(eq(crewMembers.id, crew));
    const successorOf = async (old: string) => {
      const rows = await t.ctx.db.select().from(sequenceVersions).where(eq(sequenceVersions.recheckOfId, old));
      return rows.length ? rows : undefined;
    };
    const [nextA] = await eventually(() => successorOf(a.id), 90_000);
    const [nextB] = await eventually(() => successorOf(b.id), 90_000);
    // Let every open re-verification finish, then: exactly one re-check version each, on the newest profile.
    await eventually(async () => {
      const open = await t.ctx.db.select().from(reverifications).where(eq(reverifications.sequenceVersionId, a.id));
      return open.every((r) => r.state === 'done') ? true : undefined;
    }, 90_000);
    expect(await successorOf(a.id)).toHaveLength(1);
    const [oldA] = await t.ctx.db.select().from(sequenceVersions).where(eq(sequenceVersions.id, a.id));
    expect(nextA).toMatchObject({ version: 2, status: 'under_review', authorId: null, recheckOfId: a.id });
    expect(nextA.primitives).toEqual(oldA.primitives);
    expect(nextA.compiled).toEqual(oldA.compiled);
    expect(nextA.target).toEqual(oldA.target);
    const [pv] = await t.ctx.db.select({ id: sequenceVersions.profileVersionId }).from(sequenceVersions).where(eq(sequenceVersions.id, nextA.id));
    const [rec] = await t.ctx.db.select().from(reverifications)
      .where(and(eq(reverifications.sequenceVersionId, a.id), eq(reverifications.resultVersionId, nextA.id))).orderBy(desc(reverifications.createdAt));
    expect(rec.toProfileVersionId).toBe(pv.id);
    expect(member.currentVersion).toBeGreaterThan(0);
    // The new version's report is the re-verification's own result.
    expect((nextA.report as { final: unknown }).final).toEqual((rec.report as { final: unknown }).final);

    // The reviewer's queue holds it as a re-check; the trainee reads that it waits for the reviewer.
    const queue = await as(t, PEOPLE.reviewer).get('/reviews/queue');
    const item = bodyOf<{ items: ReviewQueueItem[] }>(queue).items.find((i) => i.version.id === nextA.id)!;
    expect(item.version.recheckOfId).toBe(a.id);
    listed = (await available()).find((v) => v.versionId === a.id)!;
    expect(listed.recheck!.successor).toEqual({ version: 2, status: 'under_review', automatic: true });
    expect(recheckMessage(listed.recheck!)).toMatch(new RegExp(`^Waiting for your reviewer after a profile change; re-verified, attitude moved ${(rec.attitudeShiftDeg! < 0.1 ? rec.attitudeShiftDeg!.toFixed(2) : rec.attitudeShiftDeg!.toFixed(1)).replace('.', '\\.')}°\\.`));
    // Not playable until a person decides: the flagged version is refused (403), the one under review is not shown to a trainee at all (404).
    expect((await as(t, PEOPLE.trainee).get(`/motion/${a.id}`)).status).toBe(403);
    expect((await as(t, PEOPLE.trainee).get(`/motion/${nextA.id}`)).status).toBe(404);

    // One decision re-clears it: the old version is replaced, the trainee rehearses the new one.
    expect((await as(t, PEOPLE.reviewer).post(`/reviews/${nextA.id}/decision`, { decision: 'clear', comment: 'Shift is tiny.' })).status).toBe(200);
    const afterClear = await available();
    expect(afterClear.find((v) => v.versionId === a.id)).toBeUndefined();
    expect(afterClear.find((v) => v.versionId === nextA.id)).toMatchObject({ status: 'cleared', recheck: null });
    expect((await as(t, PEOPLE.trainee).get(`/motion/${nextA.id}`)).status).toBe(200);
    expect((await as(t, PEOPLE.trainee).post('/rehearsals', { sequenceVersionId: nextA.id, playbackSpeed: 1, completedSteps: 1, selfRating: 4 })).status).toBe(201);

    // Sent back instead: the trainee is told, and the old version stays not rehearsable.
    expect((await as(t, PEOPLE.reviewer).post(`/reviews/${nextB.id}/decision`, { decision: 'send_back', comment: 'Re-plan for the new mass.' })).status).toBe(200);
    const sent = (await available()).find((v) => v.versionId === b.id)!;
    expect(sent.status).toBe('recheck');
    expect(recheckMessage(sent.recheck!)).toMatch(/reviewer sent the re-checked version 2 back/);
  }, 240_000);
});
