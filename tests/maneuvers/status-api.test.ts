/**
 * The version status machine through the API: every allowed and refused transition, separation of
 * duties, immutability of cleared versions (API and database trigger), 409 on stale writes, e-mails,
 * trainee visibility and the audit trail.
 */
import { and, eq, sql } from 'drizzle-orm';
import { beforeAll, describe, expect, it } from 'vitest';

import { auditEvents, reviews, sequenceVersions } from '../../db/schema/index.ts';
import { ENGINE_VERSION } from '../../server/engine/version.ts';
import type { CompareResponse, ReviewQueueItem, SequenceDetail, SequenceListItem, VersionDetail } from '../../shared/contracts/maneuver.ts';
import { apiError, bodyOf } from '../support/response-body.ts';
import { testAppForFile } from '../support/test-app.ts';
import { as, createSequence, crewOf, PEOPLE, saveVersion, THREE_STEPS } from './maneuver-api.ts';

// Response bodies as the web client reads them.
type ItemsBody = { items: ReviewQueueItem[] };
type SequencesBody = { sequences: SequenceListItem[] };

const t = testAppForFile();
let crew: string;
beforeAll(async () => {
  crew = await crewOf(t, PEOPLE.trainee);
});

/** A fresh sequence with one saved (drafting) version; returns ids. */
async function drafted(by: string = PEOPLE.planner) {
  const sequenceId = await createSequence(t, crew, `Trim ${Math.random().toString(36).slice(2, 7)}`, by);
  const res = await saveVersion(t, sequenceId, 0, by);
  expect(res.status).toBe(201);
  return { sequenceId, versionId: bodyOf<VersionDetail>(res).id };
}

// The status machine, not the checks, is under test here: every submission acknowledges whatever the
// version fails (no robustness run finishes without a worker), with a note (tests/maneuvers/guarded-submit.test.ts covers the checks).
const submit = (id: string, by: string = PEOPLE.planner) => as(t, by).post(`/sequences/versions/${id}/submit`, { acknowledgeFailures: true, note: 'status test' });
const decide = (id: string, decision: 'clear' | 'send_back', comment = '', by: string = PEOPLE.reviewer) =>
  as(t, by).post(`/reviews/${id}/decision`, { decision, comment });
const statusOf = async (id: string) => (await t.ctx.db.select({ s: sequenceVersions.status }).from(sequenceVersions).where(eq(sequenceVersions.id, id)))[0].s;

describe('saving versions', () => {
  it('a planner creates a sequence; a reviewer or trainee cannot (403)', async () => {
    await createSequence(t, crew);
    for (const who of [PEOPLE.reviewer, PEOPLE.trainee]) {
      const res = await as(t, who).post('/sequences', { crewMemberId: crew, name: 'x', target: { mode: 'ypr', yprDeg: { yaw: 0, pitch: 0, roll: 0 } } });
      expect(res.status).toBe(403);
    }
  });

  it('a saved version is drafting, bound to the current profile, with a report, engine version and inputs hash', async () => {
    const { versionId } = await drafted();
    const res = await as(t, PEOPLE.planner).get(`/sequences/versions/${versionId}`);
    expect(res.status).toBe(200);
    expect(bodyOf<VersionDetail>(res).status).toBe('drafting');
    expect(bodyOf<VersionDetail>(res).profileIsCurrent).toBe(true);
    expect(bodyOf<VersionDetail>(res).engineVersion).toBe(ENGINE_VERSION);
    expect(bodyOf<VersionDetail>(res).inputsHash).toMatch(/^[0-9a-f]{64}$/);
    expect(bodyOf<VersionDetail>(res).report!.inputsHash).toBe(bodyOf<VersionDetail>(res).inputsHash);
    expect(bodyOf<VersionDetail>(res).cues).toHaveLength(THREE_STEPS.length);
    expect(bodyOf<VersionDetail>(res).allowed).toEqual({ submit: true, decide: false, comment: false });
  });

  it('a save from an outdated base version gets 409 stale_version and writes nothing', async () => {
    const { sequenceId } = await drafted();
    const res = await saveVersion(t, sequenceId, 0);
    expect(res.status).toBe(409);
    expect(apiError(res).code).toBe('stale_version');
    const rows = await t.ctx.db.select().from(sequenceVersions).where(eq(sequenceVersions.sequenceId, sequenceId));
    expect(rows).toHaveLength(1);
  });

  it('a bad primitive is a 400 naming the field', async () => {
    const sequenceId = await createSequence(t, crew);
    const res = await as(t, PEOPLE.planner).post(`/sequences/${sequenceId}/versions`, {
      baseVersion: 0, primitives: [{ kind: 'arm_orbit', arms: 'both', centre: 'forward', halfAngleDeg: 90, travel: 'outward', cycles: 2, periodS: 1 }],
    });
    expect(res.status).toBe(400);
    expect(apiError(res).field).toBe('primitives.0.halfAngleDeg');
  });

  it('a custom posture naming a dof the body lacks is a 400 naming that dof', async () => {
    const sequenceId = await createSequence(t, crew);
    const res = await as(t, PEOPLE.planner).post(`/sequences/${sequenceId}/versions`, {
      baseVersion: 0, primitives: [{ kind: 'pose_shift', posture: 'custom', custom: { l_wrist_flex: 20 }, durationS: 1 }],
    });
    expect(res.status).toBe(400);
    expect(apiError(res).field).toBe('primitives[0].custom.l_wrist_flex');
  });
});

describe('transitions from drafting', () => {
  it('cannot be cleared or sent back before submission (409 invalid_transition)', async () => {
    const { versionId } = await drafted();
    expect(apiError(await decide(versionId, 'clear')).code).toBe('invalid_transition');
    expect((await decide(versionId, 'send_back', 'no')).status).toBe(409);
    expect(await statusOf(versionId)).toBe('drafting');
  });

  it('only the author (or an admin) submits: another planner, a reviewer and a trainee are refused', async () => {
    const { versionId } = await drafted();
    expect((await submit(versionId, PEOPLE.otherPlanner)).status).toBe(403);
    expect((await submit(versionId, PEOPLE.reviewer)).status).toBe(403);
    expect((await submit(versionId, PEOPLE.trainee)).status).toBe(403);
    expect(await statusOf(versionId)).toBe('drafting');
  });

  it('submit → under_review, e-mails every reviewer a /reviews/<id> link, and a second submit is refused', async () => {
    const { versionId } = await drafted();
    const mailed = t.mail.waitFor(PEOPLE.reviewer, (m) => m.text.includes(versionId));
    const res = await submit(versionId);
    expect(res.status).toBe(200);
    expect(bodyOf<VersionDetail>(res).status).toBe('under_review');
    expect(bodyOf<VersionDetail>(res).submittedAt).not.toBeNull();
    const mail = await mailed;
    expect(mail.text).toContain(`/reviews/${versionId}`);
    expect(apiError(await submit(versionId)).code).toBe('invalid_transition');
    const queue = await as(t, PEOPLE.reviewer).get('/reviews/queue');
    expect(bodyOf<ItemsBody>(queue).items.map((i: { version: { id: string } }) => i.version.id)).toContain(versionId);
  });

  it('the review queue is closed to planners and trainees (403)', async () => {
    expect((await as(t, PEOPLE.planner).get('/reviews/queue')).status).toBe(403);
    expect((await as(t, PEOPLE.trainee).get('/reviews/queue')).status).toBe(403);
  });
});

describe('decisions on a version under review', () => {
  it('send back needs a comment (400), then → sent_back with an e-mail to the author; it cannot be re-submitted or cleared', async () => {
    const { versionId } = await drafted();
    await submit(versionId);
    const empty = await decide(versionId, 'send_back', '');
    expect(empty.status).toBe(400);
    expect(apiError(empty).field).toBe('comment');
    const mailed = t.mail.waitFor(PEOPLE.planner, (m) => m.text.includes(versionId));
    const res = await decide(versionId, 'send_back', 'Shoulder rates too high in step 2.');
    expect(res.status).toBe(200);
    expect(bodyOf<VersionDetail>(res).status).toBe('sent_back');
    expect(bodyOf<VersionDetail>(res).reviews.at(-1)).toMatchObject({ decision: 'send_back', comment: 'Shoulder rates too high in step 2.' });
    const mail = await mailed;
    expect(mail.text).toContain('Shoulder rates too high');
    expect(mail.subject).toContain('sent back');
    expect((await submit(versionId)).status).toBe(409);
    expect((await decide(versionId, 'clear')).status).toBe(409);
  });

  it('clear → cleared, recording reviewer, time, profile version and engine version', async () => {
    const { versionId } = await drafted();
    await submit(versionId);
    const res = await decide(versionId, 'clear', 'Looks good.');
    expect(res.status).toBe(200);
    expect(bodyOf<VersionDetail>(res).status).toBe('cleared');
    expect(bodyOf<VersionDetail>(res).clearedByName).toBe('Dr. Juno Brack');
    expect(bodyOf<VersionDetail>(res).clearedAt).not.toBeNull();
    const [review] = await t.ctx.db.select().from(reviews).where(eq(reviews.sequenceVersionId, versionId));
    expect(review).toMatchObject({ decision: 'clear', profileVersionId: bodyOf<VersionDetail>(res).profileVersionId, engineVersion: ENGINE_VERSION });
  });

  // No self-review: whoever wrote the version or sent it for review cannot also clear it.
  it.each([
    { part: 'authored', author: PEOPLE.admin, reason: /authored/ },
    { part: 'submitted (a planner\'s draft)', author: PEOPLE.planner, reason: /submitted/ },
  ])('a reviewing admin cannot clear a version they $part (403); another reviewer can', async ({ author, reason }) => {
    const { versionId } = await drafted(author);
    expect((await submit(versionId, PEOPLE.admin)).status).toBe(200);
    const own = await decide(versionId, 'clear', '', PEOPLE.admin);
    expect(own.status).toBe(403);
    expect(apiError(own).message).toMatch(reason);
    expect(await statusOf(versionId)).toBe('under_review');
    expect((await decide(versionId, 'clear', '', PEOPLE.reviewer)).status).toBe(200);
  });

  it('planners and trainees cannot decide (403 from the reviews area)', async () => {
    const { versionId } = await drafted();
    await submit(versionId);
    expect((await decide(versionId, 'clear', '', PEOPLE.otherPlanner)).status).toBe(403);
    expect((await decide(versionId, 'clear', '', PEOPLE.trainee)).status).toBe(403);
  });
});

describe('superseding', () => {
  it('a new save replaces drafting, under-review and sent-back versions', async () => {
    const { sequenceId, versionId: v1 } = await drafted();
    const v2 = bodyOf<VersionDetail>(await saveVersion(t, sequenceId, 1)).id;
    expect(await statusOf(v1)).toBe('replaced');
    await submit(v2);
    const v3 = bodyOf<VersionDetail>(await saveVersion(t, sequenceId, 2)).id;
    expect(await statusOf(v2)).toBe('replaced');
    await submit(v3);
    await decide(v3, 'send_back', 'redo');
    await saveVersion(t, sequenceId, 3);
    expect(await statusOf(v3)).toBe('replaced');
    // Replaced is final.
    expect((await submit(v1)).status).toBe(409);
    expect((await decide(v2, 'clear')).status).toBe(409);
  });

  it('a cleared version stays cleared after a new save, and is replaced when the newer one is cleared', async () => {
    const { sequenceId, versionId: v1 } = await drafted();
    await submit(v1);
    await decide(v1, 'clear');
    const v2 = bodyOf<VersionDetail>(await saveVersion(t, sequenceId, 1)).id;
    expect(await statusOf(v1)).toBe('cleared');
    await submit(v2);
    await decide(v2, 'clear');
    expect(await statusOf(v1)).toBe('replaced');
    expect(await statusOf(v2)).toBe('cleared');
  });
});

describe('a cleared version is immutable', () => {
  it('through the API: no submit, no decision', async () => {
    const { versionId } = await drafted();
    await submit(versionId);
    await decide(versionId, 'clear');
    expect(apiError(await submit(versionId)).code).toBe('invalid_transition');
    expect(apiError(await decide(versionId, 'send_back', 'late change')).code).toBe('invalid_transition');
    expect(await statusOf(versionId)).toBe('cleared');
  });

  it('in the database: the trigger refuses content and status edits but lets it move to recheck', async () => {
    const { versionId } = await drafted();
    await submit(versionId);
    await decide(versionId, 'clear');
    const db = t.ctx.db;
    // drizzle wraps the database error; the trigger's message is in its cause.
    const refused = async (q: PromiseLike<unknown>) => {
      try { await q; } catch (err) { return String((err as { cause?: Error }).cause?.message ?? err); }
      return 'accepted';
    };
    expect(await refused(db.update(sequenceVersions).set({ primitives: [] }).where(eq(sequenceVersions.id, versionId)))).toMatch(/immutable/);
    expect(await refused(db.update(sequenceVersions).set({ status: 'drafting' }).where(eq(sequenceVersions.id, versionId)))).toMatch(/immutable/);
    expect(await refused(db.execute(sql`UPDATE sequence_versions SET report = '{}'::jsonb WHERE id = ${versionId}`))).toMatch(/immutable/);
    expect(await refused(db.delete(sequenceVersions).where(eq(sequenceVersions.id, versionId)))).toMatch(/cannot be deleted/);
    await db.update(sequenceVersions).set({ status: 'recheck', staleSince: new Date() }).where(eq(sequenceVersions.id, versionId));
    expect(await statusOf(versionId)).toBe('recheck');
  });
});

describe('trainee visibility', () => {
  it('a trainee sees only cleared versions of their own crew member; drafts and others are 404', async () => {
    const { sequenceId, versionId: cleared } = await drafted();
    await submit(cleared);
    await decide(cleared, 'clear');
    const draft = bodyOf<VersionDetail>(await saveVersion(t, sequenceId, 1)).id;
    const me = as(t, PEOPLE.trainee);
    expect((await me.get(`/sequences/versions/${cleared}`)).status).toBe(200);
    expect((await me.get(`/sequences/versions/${draft}`)).status).toBe(404);
    const detail = await me.get(`/sequences/${sequenceId}`);
    expect(bodyOf<SequenceDetail>(detail).versions.map((v: { id: string }) => v.id)).toEqual([cleared]);
    expect((await as(t, PEOPLE.otherTrainee).get(`/sequences/versions/${cleared}`)).status).toBe(404);
    const list = await as(t, PEOPLE.otherTrainee).get('/sequences');
    expect(bodyOf<SequencesBody>(list).sequences.map((s: { id: string }) => s.id)).not.toContain(sequenceId);
  });
});

describe('comparison and audit', () => {
  it('compares two versions step by step and by result', async () => {
    const { sequenceId, versionId: v1 } = await drafted();
    const changed = [...THREE_STEPS.slice(0, 2), { kind: 'pause' as const, durationS: 2 }];
    const v2 = bodyOf<VersionDetail>(await saveVersion(t, sequenceId, 1, PEOPLE.planner, changed)).id;
    const res = await as(t, PEOPLE.planner).get(`/sequences/versions/${v1}/compare/${v2}`);
    expect(res.status).toBe(200);
    expect(bodyOf<CompareResponse>(res).primitives.map((p: { change: string }) => p.change)).toEqual(['same', 'same', 'changed']);
    expect(bodyOf<CompareResponse>(res).result.durationS.delta).toBeCloseTo(1.5, 9);
    // Only a pause changed after the motion, so the final attitude is the same.
    expect(bodyOf<CompareResponse>(res).result.finalAttitudeShiftDeg).toBeLessThan(1e-9);
  });

  it('every action writes an audit event', async () => {
    const { versionId } = await drafted();
    await submit(versionId);
    await as(t, PEOPLE.reviewer).post(`/reviews/${versionId}/comments`, { comment: 'Checking the rates.' });
    await decide(versionId, 'clear');
    const rows = await t.ctx.db.select({ action: auditEvents.action }).from(auditEvents)
      .where(and(eq(auditEvents.objectType, 'sequence_version'), eq(auditEvents.objectId, versionId)));
    expect(rows.map((r) => r.action).sort()).toEqual(['robustness.queued', 'sequence_version.clear', 'sequence_version.comment', 'sequence_version.save', 'sequence_version.submit']);
    const created = await t.ctx.db.select().from(auditEvents).where(eq(auditEvents.action, 'sequence.create'));
    expect(created.length).toBeGreaterThan(0);
  });
});
