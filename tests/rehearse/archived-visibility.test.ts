/**
 * One visibility rule for a trainee (server/maneuvers/maneuver-access.ts): an archived maneuver is
 * retired from rehearsal, so each route that opens a version for a trainee (player motion, cue card,
 * version detail, rehearsal log, the rehearsable list, the maneuver list) stops showing it, and shows
 * it again once the maneuver is restored; staff still open it.
 */
import { eq } from 'drizzle-orm';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';

import { sequences, sequenceVersions } from '../../db/schema/index.ts';
import type { RehearsableVersion } from '../../shared/contracts/rehearsal.ts';
import { bodyOf } from '../support/response-body.ts';
import { startTestApp, type TestApp } from '../support/test-app.ts';
import { crewMemberOf, insertProfileVersion, insertVersion } from './rehearsal-fixture.ts';

const TAMSIN = 'tamsin.reed@lumen.example.test';
const PLANNER = 'orrin.vale@lumen.example.test';
const REVIEWER = 'juno.brack@lumen.example.test';

let t: TestApp;
let versionId: string, sequenceId: string;
beforeAll(async () => {
  t = await startTestApp();
  const reed = await crewMemberOf(t.ctx.db, TAMSIN);
  const pv = await insertProfileVersion(t.ctx.db, reed);
  versionId = await insertVersion(t.ctx.db, { crewMemberId: reed, profileVersionId: pv, status: 'cleared', name: 'Retired sweep (test)' });
  [{ sequenceId }] = await t.ctx.db.select({ sequenceId: sequenceVersions.sequenceId }).from(sequenceVersions).where(eq(sequenceVersions.id, versionId));
}, 60_000);
afterAll(async () => {
  await t?.close();
});

const token = (email: string) => t.tokenForEmail(email);
const get = async (email: string, path: string) => request(t.app).get(path).set('Authorization', `Bearer ${await token(email)}`);
const post = async (email: string, path: string, body: object) => request(t.app).post(path).set('Authorization', `Bearer ${await token(email)}`).send(body);
const logRun = () => post(TAMSIN, '/api/rehearsals', { sequenceVersionId: versionId, playbackSpeed: 1, completedSteps: 1, selfRating: 3 });
const available = async () => bodyOf<{ versions: RehearsableVersion[] }>(await get(TAMSIN, '/api/rehearsals/available')).versions.map((v) => v.versionId);
const listed = async () => bodyOf<{ sequences: { id: string }[] }>(await get(TAMSIN, '/api/sequences')).sequences.map((s) => s.id);

describe('an archived maneuver, for its own trainee', () => {
  it('is rehearsable while active: player, cue card, version detail, log, lists', async () => {
    expect((await get(TAMSIN, `/api/motion/${versionId}`)).status).toBe(200);
    expect((await get(TAMSIN, `/api/sequences/versions/${versionId}/cue-card.pdf`)).status).toBe(200);
    expect((await get(TAMSIN, `/api/sequences/versions/${versionId}`)).status).toBe(200);
    expect((await logRun()).status).toBe(201);
    expect(await available()).toContain(versionId);
    expect(await listed()).toContain(sequenceId);
  });

  it('is 404 on every route once archived, and gone from both lists; staff still open it', async () => {
    expect((await post(PLANNER, `/api/sequences/${sequenceId}/archive`, {})).status).toBe(204);
    const [seq] = await t.ctx.db.select({ archivedAt: sequences.archivedAt }).from(sequences).where(eq(sequences.id, sequenceId));
    expect(seq.archivedAt).not.toBeNull();
    expect((await get(TAMSIN, `/api/motion/${versionId}`)).status).toBe(404);
    expect((await get(TAMSIN, `/api/motion/${versionId}?rate=30`)).status).toBe(404);
    expect((await get(TAMSIN, `/api/sequences/versions/${versionId}/cue-card.pdf`)).status).toBe(404);
    expect((await get(TAMSIN, `/api/sequences/versions/${versionId}`)).status).toBe(404);
    expect((await logRun()).status).toBe(404);
    expect(await available()).not.toContain(versionId);
    expect(await listed()).not.toContain(sequenceId);
    expect((await get(REVIEWER, `/api/motion/${versionId}`)).status).toBe(200);
    expect((await get(REVIEWER, `/api/sequences/versions/${versionId}`)).status).toBe(200);
  });

  it('is rehearsable again once restored', async () => {
    expect((await post(PLANNER, `/api/sequences/${sequenceId}/restore`, {})).status).toBe(204);
    expect((await get(TAMSIN, `/api/motion/${versionId}`)).status).toBe(200);
    expect((await logRun()).status).toBe(201);
    expect(await available()).toContain(versionId);
  });
});
