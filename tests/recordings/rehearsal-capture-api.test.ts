/**
 * Rehearsal capture through the API: a trainee attaches a recording (the plan's own joint angles,
 * 0.1 s late and at 90 % amplitude) to a rehearsal log; the server simulates it on the plan's profile
 * version and on the trainee's newer current profile, reports the reached attitude, the step timing
 * and the overlay; a reviewer signs it off; the trend lists it.
 */
import { eq, sql } from 'drizzle-orm';
import request from 'supertest';
import { beforeAll, describe, expect, it } from 'vitest';

import { profileVersions, rehearsalCaptures } from '../../db/schema/index.ts';
import { anglesAt, compileMotion } from '../../server/engine/joint-motion.ts';
import { validateBody } from '../../shared/contracts/body.ts';
import type { CaptureTrendPoint, RehearsalCapture } from '../../shared/contracts/recording.ts';
import type { Rehearsal } from '../../shared/contracts/rehearsal.ts';
import { validateSequence } from '../../shared/contracts/sequence.ts';
import type { UploadResult } from '../../shared/contracts/uploads.ts';
import { compileBody } from '../../shared/kinematics/body-model.ts';
import { ARM_SWEEP, crewMemberOf, insertProfileVersion, insertVersion } from '../rehearse/rehearsal-fixture.ts';
import { apiError, bodyOf } from '../support/response-body.ts';
import { testAppForFile } from '../support/test-app.ts';

// Response bodies as the web client reads them.
type RehearsalBody = { rehearsal: Rehearsal };
type CaptureBody = { capture: RehearsalCapture };
type PointsBody = { points: CaptureTrendPoint[] };

const TAMSIN = 'tamsin.reed@lumen.example.test';
const t = testAppForFile();
let version: string;
let csv: string;
beforeAll(async () => {
  const member = await crewMemberOf(t.ctx.db, TAMSIN);
  const pv = await insertProfileVersion(t.ctx.db, member);
  version = await insertVersion(t.ctx.db, { crewMemberId: member, profileVersionId: pv, status: 'cleared', name: 'Recorded cone' });
  // The recording: the plan's arm angles at t − 0.1 s, scaled 0.9 about the sweep's offsets, 100 Hz.
  const [row] = await t.ctx.db.select().from(profileVersions).where(eq(profileVersions.id, pv));
  const body = validateBody(row.body);
  if (!body.ok) throw new Error('body');
  const seq = validateSequence(ARM_SWEEP, body.value);
  if (!seq.ok) throw new Error('sequence');
  const model = compileBody(body.value);
  const motion = compileMotion(model, seq.value);
  const dofs = ['r_sh_flex', 'r_sh_abd', 'l_sh_flex', 'l_sh_abd'];
  const offsets = [60, 0, 60, 0];
  const q = new Float64Array(model.dofCount);
  const lines = [`time_s,${dofs.join(',')}`];
  for (let k = 0; k <= 700; k++) {
    anglesAt(motion, Math.max(0, k / 100 - 0.1), q);
    lines.push([(k / 100).toFixed(2), ...dofs.map((d, j) => (offsets[j] + 0.9 * ((q[model.dofIndex.get(d)!] * 180) / Math.PI - offsets[j])).toFixed(6))].join(','));
  }
  csv = lines.join('\n');
});

const as = async (email: string) => `Bearer ${await t.tokenForEmail(email)}`;
const logRehearsal = async () => {
  const res = await request(t.app).post('/api/rehearsals').set('Authorization', await as(TAMSIN))
    .send({ sequenceVersionId: version, playbackSpeed: 1, completedSteps: 1, selfRating: 3, notes: 'with sensors' });
  expect(res.status).toBe(201);
  return bodyOf<RehearsalBody>(res).rehearsal.id;
};

describe('rehearsal capture', () => {
  it('a trainee attaches a recording and gets the reached attitude, the step timing (lag 0.1 s, amplitude 0.9) and the overlay', async () => {
    const id = await logRehearsal();
    const res = await request(t.app).post(`/api/rehearsals/${id}/recording`).set('Authorization', await as(TAMSIN)).attach('file', Buffer.from(csv), 'run-1.csv');
    expect(res.status, JSON.stringify(res.body).slice(0, 500)).toBe(201);
    const c = bodyOf<CaptureBody>(res).capture;
    expect(c.outcomes).toHaveLength(1);
    expect(c.outcomes[0].role).toBe('plan');
    expect(c.outcomes[0].errorToPlanDeg).toBeGreaterThan(0.01);
    expect(c.targetYprDeg!.pitch).toBeCloseTo(-20, 6);
    expect(c.steps).toHaveLength(1);
    expect(c.steps[0]).toMatchObject({ step: 1 });
    expect(c.steps[0].phaseLagS).toBeCloseTo(0.1, 2);
    expect(c.steps[0].amplitudeRatio).toBeCloseTo(0.9, 2);
    expect(c.steps[0].periodRatio).toBeCloseTo(1, 3);
    expect(c.overlay.t.length).toBeGreaterThan(100);
    expect(Object.keys(c.overlay.planned)).toEqual(['r_sh_flex', 'r_sh_abd', 'l_sh_flex', 'l_sh_abd']);
    expect(c.signedOff).toBeNull();
    const again = await request(t.app).get(`/api/rehearsals/${id}/recording`).set('Authorization', await as(TAMSIN));
    expect(bodyOf<CaptureBody>(again).capture.steps[0].phaseLagS).toBeCloseTo(c.steps[0].phaseLagS, 12);

    // Sign-off: not by the trainee; by a reviewer.
    const no = await request(t.app).post(`/api/rehearsals/${id}/recording/sign-off`).set('Authorization', await as(TAMSIN)).send({ note: 'mine' });
    expect(no.status).toBe(403);
    const ok = await request(t.app).post(`/api/rehearsals/${id}/recording/sign-off`).set('Authorization', `Bearer ${await t.tokenFor('reviewer')}`).send({ note: 'Lag acceptable' });
    expect(ok.status).toBe(200);
    expect(bodyOf<CaptureBody>(ok).capture.signedOff).toMatchObject({ note: 'Lag acceptable' });
  });

  it('after a profile change the recording is simulated on both the plan\'s and the current profile version', async () => {
    const member = await crewMemberOf(t.ctx.db, TAMSIN);
    await insertProfileVersion(t.ctx.db, member);
    const id = await logRehearsal();
    const res = await request(t.app).post(`/api/rehearsals/${id}/recording`).set('Authorization', await as(TAMSIN)).attach('file', Buffer.from(csv), 'run-2.csv');
    expect(res.status).toBe(201);
    expect(bodyOf<CaptureBody>(res).capture.outcomes.map((o: { role: string }) => o.role)).toEqual(['plan', 'current']);
    const trend = await request(t.app).get('/api/rehearsals/captures/trend').set('Authorization', await as(TAMSIN));
    expect(bodyOf<PointsBody>(trend).points).toHaveLength(2);
    expect(bodyOf<PointsBody>(trend).points.map((p: { signedOff: boolean }) => p.signedOff).sort()).toEqual([false, true]);
    expect(bodyOf<PointsBody>(trend).points[0].meanPhaseLagS).toBeCloseTo(0.1, 2);
  });

  it('a recording with a bad row is rejected by row and column and stores no capture', async () => {
    const id = await logRehearsal();
    const bad = csv.replace(/\n0\.05,[^\n]*/, '\n0.05,1,2,x,4');
    const res = await request(t.app).post(`/api/rehearsals/${id}/recording`).set('Authorization', await as(TAMSIN)).attach('file', Buffer.from(bad), 'bad.csv');
    expect(res.status).toBe(422);
    expect(bodyOf<UploadResult>(res).upload.errors[0]).toMatchObject({ row: 7, column: 'l_sh_flex' });
    expect(await t.ctx.db.select().from(rehearsalCaptures).where(eq(rehearsalCaptures.rehearsalId, id))).toEqual([]);
  });

  it('another trainee cannot attach to or read Tamsin\'s rehearsal (404)', async () => {
    const id = await logRehearsal();
    const bram = await as('bram.kettle@lumen.example.test');
    expect((await request(t.app).get(`/api/rehearsals/${id}/recording`).set('Authorization', bram)).status).toBe(404);
    expect((await request(t.app).post(`/api/rehearsals/${id}/recording`).set('Authorization', bram).attach('file', Buffer.from(csv), 'x.csv')).status).toBe(404);
  });

  it('a stored capture no schema reads answers a 500 naming the capture row (last: it breaks the trend too)', async () => {
    const id = await logRehearsal();
    const res = await request(t.app).post(`/api/rehearsals/${id}/recording`).set('Authorization', await as(TAMSIN)).attach('file', Buffer.from(csv), 'run-3.csv');
    expect(res.status).toBe(201);
    const [row] = await t.ctx.db.update(rehearsalCaptures).set({ capture: sql`capture - 'overlay'` }).where(eq(rehearsalCaptures.rehearsalId, id)).returning({ id: rehearsalCaptures.id });
    for (const path of [`/api/rehearsals/${id}/recording`, '/api/rehearsals/captures/trend']) {
      const read = await request(t.app).get(path).set('Authorization', await as(TAMSIN));
      expect(read.status, path).toBe(500);
      expect(apiError(read)).toMatchObject({ code: 'stored_value_unreadable' });
      expect(apiError(read).message, path).toContain(`rehearsal_captures.capture.overlay of rehearsal capture ${row.id}`);
    }
  });
});
