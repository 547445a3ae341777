/**
 * Keeping lists to what is in use: maneuvers and crew members are archived and restored (nothing is
 * lost; archived ones leave default lists, trainees' sight and editing), and a maneuver that never
 * went to review can be deleted with its drafts in one transaction.
 */
import { eq, inArray } from 'drizzle-orm';
import { beforeAll, describe, expect, it } from 'vitest';

import { auditEvents, crewMembers, robustnessRuns, sequences, sequenceVersions } from '../../db/schema/index.ts';
import type { CrewMemberView } from '../../shared/contracts/crew.ts';
import type { SequenceDetail, SequenceListItem, VersionDetail } from '../../shared/contracts/maneuver.ts';
import { apiError, bodyOf } from '../support/response-body.ts';
import { testAppForFile } from '../support/test-app.ts';
import { as, createSequence, crewOf, PEOPLE, saveVersion } from './maneuver-api.ts';

// Response bodies as the web client reads them.
type SequencesBody = { sequences: SequenceListItem[] };
type MemberBody = { member: CrewMemberView };
type MembersBody = { members: CrewMemberView[] };

const t = testAppForFile();
let crew: string;
beforeAll(async () => {
  crew = await crewOf(t, PEOPLE.trainee);
});

const names = (res: { body: unknown }) => bodyOf<SequencesBody>(res).sequences.map((s) => s.name);

describe('archiving a maneuver', () => {
  it('takes it out of the default list, out of the trainee\'s sight and out of editing; restoring brings all back', async () => {
    const id = await createSequence(t, crew, 'Archive test A');
    const v1 = await saveVersion(t, id, 0);
    expect((await as(t, PEOPLE.planner).post(`/sequences/versions/${bodyOf<VersionDetail>(v1).id}/submit`, { acknowledgeFailures: true, note: 'archive test' })).status).toBe(200);

    // Pending review: archiving would hide a reviewer's work.
    const pending = await as(t, PEOPLE.planner).post(`/sequences/${id}/archive`);
    expect(pending.status).toBe(409);
    expect(apiError(pending).code).toBe('under_review');
    expect((await as(t, PEOPLE.reviewer).post(`/reviews/${bodyOf<VersionDetail>(v1).id}/decision`, { decision: 'clear', comment: 'ok' })).status).toBe(200);
    expect(names(await as(t, PEOPLE.trainee).get('/sequences'))).toContain('Archive test A');

    // Only authors archive.
    expect((await as(t, PEOPLE.trainee).post(`/sequences/${id}/archive`)).status).toBe(403);
    expect((await as(t, PEOPLE.planner).post(`/sequences/${id}/archive`)).status).toBe(204);
    expect(apiError(await as(t, PEOPLE.planner).post(`/sequences/${id}/archive`)).code).toBe('already_archived');

    expect(names(await as(t, PEOPLE.planner).get('/sequences'))).not.toContain('Archive test A');
    const archivedList = await as(t, PEOPLE.planner).get('/sequences?archived=true');
    expect(names(archivedList)).toContain('Archive test A');
    // The lean list does not carry archivedAt (the screen does not show it); the maneuver's own read does.
    expect(bodyOf<SequencesBody>(archivedList).sequences.map((s) => s.id)).toContain(id);
    expect(bodyOf<SequenceDetail>(await as(t, PEOPLE.planner).get(`/sequences/${id}`)).archivedAt).toEqual(expect.any(String));
    expect(names(await as(t, PEOPLE.trainee).get('/sequences'))).not.toContain('Archive test A');
    expect((await as(t, PEOPLE.trainee).get(`/sequences/versions/${bodyOf<VersionDetail>(v1).id}`)).status).toBe(404);

    // Nothing changes while archived; the cleared version stays as it was.
    const save = await saveVersion(t, id, 1);
    expect(save.status).toBe(409);
    expect(apiError(save).code).toBe('archived');
    expect(apiError(await as(t, PEOPLE.planner).patch(`/sequences/${id}`, { name: 'Renamed' })).code).toBe('archived');
    expect(bodyOf<VersionDetail>(await as(t, PEOPLE.planner).get(`/sequences/versions/${bodyOf<VersionDetail>(v1).id}`)).status).toBe('cleared');
    expect(apiError(await as(t, PEOPLE.planner).delete(`/sequences/${id}`)).code).toBe('submitted');

    expect((await as(t, PEOPLE.planner).post(`/sequences/${id}/restore`)).status).toBe(204);
    expect(names(await as(t, PEOPLE.trainee).get('/sequences'))).toContain('Archive test A');
    expect((await saveVersion(t, id, 1)).status).toBe(201);

    const actions = (await t.ctx.db.select({ action: auditEvents.action }).from(auditEvents).where(eq(auditEvents.objectId, id))).map((e) => e.action);
    expect(actions).toEqual(expect.arrayContaining(['sequence.archive', 'sequence.restore']));
  }, 90_000);

  it('answers a malformed id with 400 naming it, and writes nothing', async () => {
    const before = await t.ctx.db.select().from(auditEvents);
    for (const res of [
      await as(t, PEOPLE.planner).post('/sequences/not-an-id/archive'),
      await as(t, PEOPLE.planner).delete('/sequences/not-an-id'),
      await as(t, PEOPLE.planner).post('/crew/not-an-id/restore'),
    ]) {
      expect(res.status).toBe(400);
      expect(['sequenceId', 'id']).toContain(apiError(res).field);
    }
    expect(await t.ctx.db.select().from(auditEvents)).toHaveLength(before.length);
  });

  it('rejects a bad archived filter by name', async () => {
    const res = await as(t, PEOPLE.planner).get('/sequences?archived=maybe');
    expect(res.status).toBe(400);
    expect(JSON.stringify(res.body)).toContain('archived');
  });
});

describe('deleting a maneuver', () => {
  it('deletes one that never went to review with its drafts and robustness runs, in one go', async () => {
    const id = await createSequence(t, crew, 'Delete test A');
    const v1 = await saveVersion(t, id, 0);
    const v2 = await saveVersion(t, id, 1);
    expect(v2.status).toBe(201);
    const versionIds = [bodyOf<VersionDetail>(v1).id, bodyOf<VersionDetail>(v2).id];

    expect((await as(t, PEOPLE.trainee).delete(`/sequences/${id}`)).status).toBe(403);
    expect((await as(t, PEOPLE.planner).delete(`/sequences/${id}`)).status).toBe(204);
    expect((await as(t, PEOPLE.planner).get(`/sequences/${id}`)).status).toBe(404);
    expect(await t.ctx.db.select().from(sequences).where(eq(sequences.id, id))).toHaveLength(0);
    expect(await t.ctx.db.select().from(sequenceVersions).where(inArray(sequenceVersions.id, versionIds))).toHaveLength(0);
    expect(await t.ctx.db.select().from(robustnessRuns).where(inArray(robustnessRuns.sequenceVersionId, versionIds))).toHaveLength(0);
    const [audit] = await t.ctx.db.select().from(auditEvents).where(eq(auditEvents.objectId, id)).then((rows) => rows.filter((r) => r.action === 'sequence.delete'));
    expect(audit.detail).toMatchObject({ name: 'Delete test A', versions: 2 });
    expect((await as(t, PEOPLE.planner).delete(`/sequences/${id}`)).status).toBe(404);
  }, 90_000);

  it('keeps one that went to review (sent back counts) and leaves it whole', async () => {
    const id = await createSequence(t, crew, 'Delete test B');
    const v1 = await saveVersion(t, id, 0);
    await as(t, PEOPLE.planner).post(`/sequences/versions/${bodyOf<VersionDetail>(v1).id}/submit`, { acknowledgeFailures: true, note: 'delete test' });
    expect((await as(t, PEOPLE.reviewer).post(`/reviews/${bodyOf<VersionDetail>(v1).id}/decision`, { decision: 'send_back', comment: 'no' })).status).toBe(200);
    await saveVersion(t, id, 1);
    const res = await as(t, PEOPLE.planner).delete(`/sequences/${id}`);
    expect(res.status).toBe(409);
    expect(apiError(res).code).toBe('submitted');
    expect(await t.ctx.db.select().from(sequenceVersions).where(eq(sequenceVersions.sequenceId, id))).toHaveLength(2);
  }, 90_000);
});

describe('archiving a crew member', () => {
  it('takes the member and their maneuvers out of default lists and refuses new profiles and maneuvers until restored', async () => {
    const created = await as(t, PEOPLE.planner).post('/crew', { name: 'Archive Testperson', callSign: 'ARCH' });
    expect(created.status).toBe(201);
    const memberId = bodyOf<MemberBody>(created).member.id;
    const seqId = await createSequence(t, crew, 'Crew archive neighbour');

    expect((await as(t, PEOPLE.reviewer).post(`/crew/${memberId}/archive`)).status).toBe(403);
    expect((await as(t, PEOPLE.planner).post(`/crew/${memberId}/archive`)).status).toBe(204);
    const active = await as(t, PEOPLE.planner).get('/crew');
    expect(bodyOf<MembersBody>(active).members.map((m: { id: string }) => m.id)).not.toContain(memberId);
    const archived = await as(t, PEOPLE.planner).get('/crew?archived=true');
    expect(bodyOf<MembersBody>(archived).members.find((m) => m.id === memberId)?.archivedAt).toEqual(expect.any(String));

    const newSeq = await as(t, PEOPLE.planner).post('/sequences', { crewMemberId: memberId, name: 'Nope', target: { mode: 'ypr', yprDeg: { yaw: 90, pitch: 0, roll: 0 }, toleranceDeg: 3 } });
    expect(newSeq.status).toBe(400);
    expect(apiError(newSeq).field).toBe('crewMemberId');
    const [row] = await t.ctx.db.select().from(crewMembers).where(eq(crewMembers.id, memberId));
    expect(row.archivedBy).not.toBeNull();

    // The demo trainee's maneuvers are untouched by someone else's archive.
    expect(names(await as(t, PEOPLE.planner).get('/sequences'))).toContain('Crew archive neighbour');
    expect(seqId).toBeTruthy();

    expect((await as(t, PEOPLE.planner).post(`/crew/${memberId}/restore`)).status).toBe(204);
    expect(bodyOf<MembersBody>(await as(t, PEOPLE.planner).get('/crew')).members.map((m: { id: string }) => m.id)).toContain(memberId);
  }, 60_000);
});
