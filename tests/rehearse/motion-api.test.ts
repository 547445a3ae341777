import { eq } from 'drizzle-orm';
import request from 'supertest';
import { beforeAll, describe, expect, it } from 'vitest';

import { profileVersions, sequenceVersions } from '../../db/schema/index.ts';
import { simulate } from '../../server/engine/simulate.ts';
import { validateBody } from '../../shared/contracts/body.ts';
import { sequenceTargetSchema, type VerificationReport } from '../../shared/contracts/maneuver.ts';
import type { MotionResponse } from '../../shared/contracts/motion.ts';
import type { RehearsableVersion, Rehearsal } from '../../shared/contracts/rehearsal.ts';
import { validateSequence } from '../../shared/contracts/sequence.ts';
import { quatAngleBetween } from '../../shared/math/quaternion.ts';
import { compilePrimitives, dofInfoFromBody } from '../../shared/primitives/compile-primitives.ts';
import { cueFor, leadInCue } from '../../shared/primitives/primitive-cues.ts';
import { defaultPrimitive } from '../../shared/primitives/primitive-schemas.ts';
import { apiError, bodyOf } from '../support/response-body.ts';
import { testAppForFile } from '../support/test-app.ts';
import { ARM_SWEEP, crewMemberOf, insertProfileVersion, insertVersion } from './rehearsal-fixture.ts';

// Response bodies as the web client reads them.
type VersionsBody = { versions: RehearsableVersion[] };
type RehearsalBody = { rehearsal: Rehearsal };
type RehearsalsBody = { rehearsals: Rehearsal[] };

const TAMSIN = 'tamsin.reed@lumen.example.test';
const BRAM = 'bram.kettle@lumen.example.test';

const t = testAppForFile();
let cleared: string, drafting: string, others: string, recheck: string;
beforeAll(async () => {
  const reed = await crewMemberOf(t.ctx.db, TAMSIN);
  const kettle = await crewMemberOf(t.ctx.db, BRAM);
  const pv = await insertProfileVersion(t.ctx.db, reed);
  const pvK = await insertProfileVersion(t.ctx.db, kettle);
  cleared = await insertVersion(t.ctx.db, { crewMemberId: reed, profileVersionId: pv, status: 'cleared', target: sequenceTargetSchema.parse({ mode: 'ypr', yprDeg: { yaw: 0, pitch: -20, roll: 0 } }) });
  drafting = await insertVersion(t.ctx.db, { crewMemberId: reed, profileVersionId: pv, status: 'drafting', name: 'Draft sweep' });
  recheck = await insertVersion(t.ctx.db, { crewMemberId: reed, profileVersionId: pv, status: 'cleared', name: 'Old sweep' });
  await t.ctx.db.update(sequenceVersions).set({ status: 'recheck' }).where(eq(sequenceVersions.id, recheck));
  others = await insertVersion(t.ctx.db, { crewMemberId: kettle, profileVersionId: pvK, status: 'cleared', name: 'Kettle sweep' });
}, 60_000);

const quat = (a: { w: number; x: number; y: number; z: number }) => [a.w, a.x, a.y, a.z];
const get = async (email: string, path: string) => request(t.app).get(path).set('Authorization', `Bearer ${await t.tokenForEmail(email)}`);

describe('GET /api/motion/:versionId', () => {
  it('returns the verified samples stored with the version, the body and step boundaries summing to the duration', async () => {
    const res = await get(TAMSIN, `/api/motion/${cleared}`);
    expect(res.status).toBe(200);
    const m = res.body as MotionResponse;
    // The stored verification was a 20 Hz engine run of these steps on this body; run it again directly
    // and compare: the served samples are that run (attitudes kept as yaw/pitch/roll to 1e-6°).
    const body = validateBody(m.body);
    if (!body.ok) throw new Error('body');
    const seq = validateSequence(ARM_SWEEP, body.value);
    if (!seq.ok) throw new Error('sequence');
    const direct = simulate(body.value, seq.value, { rateHz: 20 });
    expect(m.samples.rateHz).toBe(20);
    expect(m.samples.dofs).toEqual(direct.samples.dofs);
    expect(m.samples.frames).toHaveLength(direct.samples.frames.length);
    let worstAttitudeDeg = 0, worstJointDeg = 0;
    m.samples.frames.forEach((f, k) => {
      const d = direct.samples.frames[k];
      expect(f.t).toBeCloseTo(d.t, 6);
      worstAttitudeDeg = Math.max(worstAttitudeDeg, (quatAngleBetween(quat(f.attitude), quat(d.attitude)) * 180) / Math.PI);
      f.jointsDeg.forEach((v, j) => (worstJointDeg = Math.max(worstJointDeg, Math.abs(v - d.jointsDeg[j]))));
    });
    expect(worstAttitudeDeg).toBeLessThan(1e-5);
    expect(worstJointDeg).toBeLessThan(1e-5);
    expect(m.engineVersion).toBe(direct.engineVersion);
    expect(m.verifiedByOtherEngine).toBe(false);
    // 1 + 3·1.5 + 0.5 + 1 = 7 s (sum of the step durations in ARM_SWEEP).
    expect(m.duration).toBeCloseTo(7, 12);
    // the opening move only joins into the sweep: it is the sweep's lead-in, not a numbered step
    expect(m.steps.map((s) => [s.kind, s.start, s.end])).toEqual([
      ['harmonic', 0, 5.5], ['hold', 5.5, 6], ['move', 6, 7],
    ]);
    expect(m.steps[0]).toMatchObject({ cycles: 3, period: 1.5, cycleStart: 1, leadIn: { end: 1, cue: 'Get ready: move into position' } });
    expect(m.steps[0].cue).toMatch(/3 cycles of 1\.5 s/);
    expect(m.steps.map((s) => s.index)).toEqual([0, 1, 2]);
    expect(m.samples.frames.at(-1)!.t).toBeCloseTo(7, 12);
  });

  it('derives another rate from the verified samples (no new run): the verified ones where the times meet, close to the engine between', async () => {
    const verified = (await get(TAMSIN, `/api/motion/${cleared}`)).body as MotionResponse;
    const m = (await get(TAMSIN, `/api/motion/${cleared}?rate=60`)).body as MotionResponse;
    expect(m.samples.rateHz).toBe(60);
    expect(m.samples.frames).toHaveLength(7 * 60 + 1);
    // every third 60 Hz sample is a 20 Hz verified sample, unchanged
    verified.samples.frames.forEach((f, k) => expect(m.samples.frames[3 * k]).toEqual({ ...f, t: m.samples.frames[3 * k].t }));
    const body = validateBody(m.body);
    const seq = body.ok ? validateSequence(ARM_SWEEP, body.value) : null;
    if (!body.ok || !seq?.ok) throw new Error('fixture');
    const direct = simulate(body.value, seq.value, { rateHz: 60 });
    // Between them, slerp of the 20 Hz attitudes stays within 0.05° of the engine's own 60 Hz samples
    // (the interpolation error of a 50 ms chord; the view itself interpolates the same way).
    const worst = Math.max(...m.samples.frames.map((f, k) => quatAngleBetween(quat(f.attitude), quat(direct.samples.frames[k].attitude)) * 180 / Math.PI));
    expect(worst).toBeLessThan(0.05);
  });

  it('reads a yaw/pitch/roll target as the ghost attitude: pitch −20° is a rotation of 20° about −y', async () => {
    const m = (await get(TAMSIN, `/api/motion/${cleared}`)).body as MotionResponse;
    // q = (cos 10°, 0, −sin 10°, 0) for a right-handed rotation of −20° about y (closed form).
    expect(m.targetAttitude.w).toBeCloseTo(Math.cos((10 * Math.PI) / 180), 12);
    expect(m.targetAttitude.y).toBeCloseTo(-Math.sin((10 * Math.PI) / 180), 12);
    expect(m.samples.rateHz).toBe(20);
  });

  it('serves a second request from the cache with identical samples', async () => {
    const a = (await get(TAMSIN, `/api/motion/${cleared}?rate=25`)).body as MotionResponse;
    const b = (await get(TAMSIN, `/api/motion/${cleared}?rate=25`)).body as MotionResponse;
    expect(b.samples).toEqual(a.samples);
  });

  it('hides another crew member’s version from a trainee (404)', async () => {
    expect((await get(TAMSIN, `/api/motion/${others}`)).status).toBe(404);
  });

  it('hides a trainee’s own draft (404, as everywhere a trainee looks) and refuses one that needs a re-check (403)', async () => {
    expect((await get(TAMSIN, `/api/motion/${drafting}`)).status).toBe(404);
    const res = await get(TAMSIN, `/api/motion/${recheck}`);
    expect(res.status).toBe(403);
    expect(apiError(res).message).toMatch(/re-check/);
  });

  it('words each step with its primitive’s cue when the version was composed from primitives', async () => {
    const reed = await crewMemberOf(t.ctx.db, TAMSIN);
    const [pv] = await t.ctx.db.select().from(profileVersions).where(eq(profileVersions.crewMemberId, reed));
    const body = validateBody(pv.body);
    if (!body.ok) throw new Error('body');
    const primitives = [defaultPrimitive('arm_orbit'), defaultPrimitive('pause')];
    const compiled = compilePrimitives(primitives, dofInfoFromBody(body.value));
    const id = await insertVersion(t.ctx.db, { crewMemberId: reed, profileVersionId: pv.id, status: 'cleared', name: 'Composed', compiled: compiled.sequence, primitives });
    const m = (await get('juno.brack@lumen.example.test', `/api/motion/${id}`)).body as MotionResponse;
    // one step per composer step (DECISIONS.md "Steps"); the joining blend is the orbit's lead-in
    expect(m.steps).toHaveLength(primitives.length);
    expect(m.steps[0].cue.toLowerCase()).toBe(cueFor(primitives[0]).toLowerCase());
    expect(m.steps[1].cue.toLowerCase()).toBe(cueFor(primitives[1]).toLowerCase());
    if (compiled.stepMap[0].role === 'blend') {
      expect(m.steps[0].leadIn?.cue.toLowerCase()).toBe(leadInCue(primitives[0]));
      expect(m.steps[0].leadIn!.cue.split(' ').length).toBeLessThanOrEqual(6);
    }
  });

  it('lets a reviewer preview any version', async () => {
    const res = await get('juno.brack@lumen.example.test', `/api/motion/${drafting}`);
    expect(res.status).toBe(200);
  });

  it('names the bad query field: rate above 120 Hz (400)', async () => {
    const res = await get(TAMSIN, `/api/motion/${cleared}?rate=500`);
    expect(res.status).toBe(400);
    expect(apiError(res).field).toBe('rate');
  });

  it('answers 401 without a session', async () => {
    expect((await request(t.app).get(`/api/motion/${cleared}`)).status).toBe(401);
  });
});

describe('the player plays what was approved', () => {
  it('serves the verified samples of the cleared version, unchanged when the server runs another engine version, and says so', async () => {
    const [row] = await t.ctx.db.select({ report: sequenceVersions.report, engineVersion: sequenceVersions.engineVersion }).from(sequenceVersions).where(eq(sequenceVersions.id, cleared));
    const report = row.report as VerificationReport;
    const first = await get(TAMSIN, `/api/motion/${cleared}`);
    const before = first.body as MotionResponse;
    const running = t.ctx.engineVersion;
    t.ctx.engineVersion = '99.0.0+another-engine';
    try {
      const res = await get(TAMSIN, `/api/motion/${cleared}`);
      expect(res.status).toBe(200);
      const after = res.body as MotionResponse;
      expect(after.samples).toEqual(before.samples);
      expect(after.final).toEqual(report.final);
      expect(after.engineVersion).toBe(row.engineVersion);
      expect(after.engineVersion).toBe(report.engineVersion);
      expect(after.runningEngineVersion).toBe('99.0.0+another-engine');
      expect(after.verifiedByOtherEngine).toBe(true);
      // the served samples are the stored report's: its yaw/pitch/roll and joint series, sample by sample
      expect(after.samples.frames.map((f) => f.t)).toEqual(report.series.t);
      const dof = Object.keys(report.series.jointsDeg)[0];
      const k = after.samples.dofs.indexOf(dof);
      expect(after.samples.frames.map((f) => f.jointsDeg[k])).toEqual(report.series.jointsDeg[dof]);
      // a new ETag: the running engine is part of what the response says
      expect(res.headers.etag).not.toBe(first.headers.etag);
      // first built under the other engine (a rate no request asked for yet, so no cached motion): still the stored samples
      const cold = (await get(TAMSIN, `/api/motion/${cleared}?rate=${report.series.rateHz}`)).body as MotionResponse;
      expect(cold.samples.frames.map((f) => f.t)).toEqual(report.series.t);
      expect(cold.samples.frames.map((f) => f.jointsDeg[k])).toEqual(report.series.jointsDeg[dof]);
      expect(cold.verifiedByOtherEngine).toBe(true);
      // the rehearsable list and the rehearsal log name the engine the approval binds to, and say it is not the running one
      const listed = bodyOf<VersionsBody>(await get(TAMSIN, '/api/rehearsals/available')).versions.find((v) => v.versionId === cleared)!;
      expect(listed).toMatchObject({ engineVersion: report.engineVersion, verifiedByOtherEngine: true });
    } finally {
      t.ctx.engineVersion = running;
    }
  });
});

describe('rehearsals', () => {
  it('lists the trainee’s cleared versions with duration and step count, and a formerly cleared one in re-check', async () => {
    const res = await get(TAMSIN, '/api/rehearsals/available');
    expect(res.status).toBe(200);
    const names = bodyOf<VersionsBody>(res).versions.map((v: { sequenceName: string }) => v.sequenceName);
    // Her own crew member's cleared versions, plus the formerly cleared one now in re-check; no draft, nothing of Bram's.
    // (The demo seed adds Tamsin's own maneuvers too.)
    expect(names).toEqual(expect.arrayContaining(['Arm cone, both sides', 'Composed', 'Old sweep']));
    expect(names).not.toContain('Draft sweep');
    expect(names).not.toContain('Kettle sweep');
    expect(bodyOf<VersionsBody>(res).versions.find((v: { sequenceName: string }) => v.sequenceName === 'Old sweep')?.status).toBe('recheck');
    expect(bodyOf<VersionsBody>(res).versions.find((v: { sequenceName: string }) => v.sequenceName === 'Arm cone, both sides')).toMatchObject({ duration: 7, stepCount: 3, lastRehearsal: null, rehearsalCount: 0, targetLabel: 'yaw 0°, pitch -20°, roll 0°' });
  });

  it('logs a rehearsal, shows it in the history and as the last rehearsal, and audits it', async () => {
    const token = await t.tokenForEmail(TAMSIN);
    const res = await request(t.app).post('/api/rehearsals').set('Authorization', `Bearer ${token}`)
      .send({ sequenceVersionId: cleared, playbackSpeed: 0.5, completedSteps: 3, selfRating: 4, notes: 'Smooth cones' });
    expect(res.status).toBe(201);
    expect(bodyOf<RehearsalBody>(res).rehearsal).toMatchObject({ completedSteps: 3, totalSteps: 3, playbackSpeed: 0.5, selfRating: 4, notes: 'Smooth cones', traineeName: 'Tamsin Reed' });
    const list = await get(TAMSIN, `/api/rehearsals?versionId=${cleared}`);
    expect(bodyOf<RehearsalsBody>(list).rehearsals).toHaveLength(1);
    const avail = await get(TAMSIN, '/api/rehearsals/available');
    expect(bodyOf<VersionsBody>(avail).versions.find((v: { versionId: string }) => v.versionId === cleared)?.lastRehearsal).toMatchObject({ selfRating: 4, completedSteps: 3 });
    const audit = await get('ada.quill@lumen.example.test', '/api/audit');
    expect(JSON.stringify(audit.body)).toContain('rehearsal.log');
  });

  it('shows a rehearsed version that later needs a re-check with status recheck', async () => {
    const token = await t.tokenForEmail(TAMSIN);
    const extra = await insertVersion(t.ctx.db, { crewMemberId: await crewMemberOf(t.ctx.db, TAMSIN), profileVersionId: (await t.ctx.db.select().from(sequenceVersions).where(eq(sequenceVersions.id, cleared)))[0].profileVersionId, status: 'cleared', name: 'Leg sweep' });
    await request(t.app).post('/api/rehearsals').set('Authorization', `Bearer ${token}`)
      .send({ sequenceVersionId: extra, playbackSpeed: 1, completedSteps: 2, selfRating: 3 });
    await t.ctx.db.update(sequenceVersions).set({ status: 'recheck' }).where(eq(sequenceVersions.id, extra));
    const avail = await get(TAMSIN, '/api/rehearsals/available');
    const leg = bodyOf<VersionsBody>(avail).versions.find((v: { versionId: string }) => v.versionId === extra);
    expect(leg).toMatchObject({ status: 'recheck', rehearsalCount: 1 });
  });

  it('names the field: completedSteps beyond the version’s 3 steps (400; the opening move is the sweep’s lead-in)', async () => {
    const res = await request(t.app).post('/api/rehearsals').set('Authorization', `Bearer ${await t.tokenForEmail(TAMSIN)}`)
      .send({ sequenceVersionId: cleared, playbackSpeed: 1, completedSteps: 4, selfRating: 3 });
    expect(res.status).toBe(400);
    expect(apiError(res).field).toBe('completedSteps');
  });

  it('names the field: playbackSpeed 3× is above the 2× limit (400)', async () => {
    const res = await request(t.app).post('/api/rehearsals').set('Authorization', `Bearer ${await t.tokenForEmail(TAMSIN)}`)
      .send({ sequenceVersionId: cleared, playbackSpeed: 3, completedSteps: 1, selfRating: 3 });
    expect(res.status).toBe(400);
    expect(apiError(res).field).toBe('playbackSpeed');
  });

  it('refuses a log for another crew member’s version (404) and from a planner (403)', async () => {
    const res = await request(t.app).post('/api/rehearsals').set('Authorization', `Bearer ${await t.tokenForEmail(TAMSIN)}`)
      .send({ sequenceVersionId: others, playbackSpeed: 1, completedSteps: 1, selfRating: 3 });
    expect(res.status).toBe(404);
    const planner = await request(t.app).post('/api/rehearsals').set('Authorization', `Bearer ${await t.tokenFor('planner')}`)
      .send({ sequenceVersionId: cleared, playbackSpeed: 1, completedSteps: 1, selfRating: 3 });
    expect(planner.status).toBe(403);
  });

  it('lets a reviewer read every trainee’s history, and another trainee none of Tamsin’s', async () => {
    const staff = await get('juno.brack@lumen.example.test', `/api/rehearsals?versionId=${cleared}`);
    expect(bodyOf<RehearsalsBody>(staff).rehearsals.length).toBeGreaterThanOrEqual(1);
    const bram = await get(BRAM, '/api/rehearsals');
    expect(bram.status).toBe(200);
    expect(bodyOf<RehearsalsBody>(bram).rehearsals.filter((r: { traineeName: string }) => r.traineeName !== 'Bram Kettle')).toEqual([]);
  });
});
