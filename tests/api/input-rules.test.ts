/**
 * Bad input answers 4xx naming the field, never a 500: NUL characters and unpaired surrogates in any
 * text (checked once, in validate()), empty and no-op patches, malformed multipart, and a simulation
 * the integrator cannot finish (422 naming the step).
 */
import { readFileSync } from 'node:fs';

import express from 'express';
import request from 'supertest';
import { beforeAll, describe, expect, it } from 'vitest';

import { SimulationPool } from '../../server/engine/pool/simulation-pool.ts';
import { errorHandler } from '../../server/http/error-handler.ts';
import { createSimulateRouter } from '../../server/routes/simulate.ts';
import type { TeamMember } from '../../shared/contracts/team.ts';
import { as, createSequence, crewOf, PEOPLE } from '../maneuvers/maneuver-api.ts';
import { apiError, bodyOf } from '../support/response-body.ts';
import { testAppForFile } from '../support/test-app.ts';

const t = testAppForFile();

const LONE_HIGH = '\ud800';

describe('NUL and unpaired surrogates in text', () => {
  it('a NUL in a crew member name is a 400 naming "name"', async () => {
    const res = await as(t, PEOPLE.planner).post('/crew', { name: 'Ada\u0000Quill' });
    expect(res.status).toBe(400);
    expect(apiError(res).field).toBe('name');
    expect(apiError(res).message).toMatch(/NUL/);
  });

  it('GET /api/crew?q=%00 is a 400 naming "q"', async () => {
    const res = await request(t.app).get('/api/crew?q=%00').set('Authorization', `Bearer ${await t.tokenFor('planner')}`);
    expect(res.status).toBe(400);
    expect(apiError(res).field).toBe('q');
  });

  it('a lone surrogate in a nested JSON field is a 400 naming its path', async () => {
    const crew = await crewOf(t, PEOPLE.trainee);
    const res = await as(t, PEOPLE.planner).post('/sequences', { crewMemberId: crew, name: `turn ${LONE_HIGH}`, target: { mode: 'ypr', yprDeg: { yaw: 1, pitch: 0, roll: 0 } } });
    expect(res.status).toBe(400);
    expect(apiError(res).field).toBe('name');
    expect(apiError(res).message).toMatch(/surrogate/);
  });

  it('a NUL in an object key is refused too (keys reach jsonb)', async () => {
    const res = await as(t, PEOPLE.planner).post('/sequences/compile', { primitives: [{ kind: 'pause', durationS: 1, ['x\u0000']: 1 }] });
    expect(res.status).toBe(400);
    expect(apiError(res).field).toMatch(/^primitives\.0\./);
  });

  it('a well-formed surrogate pair (an emoji) is fine', async () => {
    const res = await as(t, PEOPLE.planner).post('/crew', { name: 'Test member \ud83d\ude80' });
    expect(res.status).toBe(201);
  });

  it('a NUL in a multipart text field is a 400 naming it', async () => {
    const crew = await crewOf(t, PEOPLE.trainee);
    const res = await request(t.app).post('/api/uploads/segment-table').set('Authorization', `Bearer ${await t.tokenFor('planner')}`)
      .field('crewMemberId', crew).field('baseVersion', '1').field('note', 'a\u0000b').attach('file', Buffer.from('{}'), 'body.json');
    expect(res.status).toBe(400);
    expect(apiError(res).field).toBe('note');
  });
});

describe('empty and no-op patches', () => {
  it('PATCH /api/sequences/:id with {} is a 400', async () => {
    const id = await createSequence(t, await crewOf(t, PEOPLE.trainee), 'Patch me');
    const res = await as(t, PEOPLE.planner).patch(`/sequences/${id}`, {});
    expect(res.status).toBe(400);
    const same = await as(t, PEOPLE.planner).patch(`/sequences/${id}`, { name: 'Patch me' });
    expect(same.status).toBe(400);
    expect(apiError(same).field).toBe('name');
    expect((await as(t, PEOPLE.planner).patch(`/sequences/${id}`, { name: 'Patched' })).status).toBe(200);
  });

  it('PATCH /api/team/users/:id that changes nothing is a 400', async () => {
    const { users } = bodyOf<{ users: TeamMember[] }>(await as(t, PEOPLE.admin).get('/team/users'));
    const reviewer = users.find((u) => u.email === PEOPLE.reviewer)!;
    expect((await as(t, PEOPLE.admin).patch(`/team/users/${reviewer.id}`, {})).status).toBe(400);
    const same = await as(t, PEOPLE.admin).patch(`/team/users/${reviewer.id}`, { role: reviewer.role });
    expect(same.status).toBe(400);
    expect(apiError(same).field).toBe('role');
  });
});

describe('malformed multipart uploads', () => {
  let auth = '';
  beforeAll(async () => {
    auth = `Bearer ${await t.tokenFor('planner')}`;
  });
  const post = () => request(t.app).post('/api/uploads/measurements').set('Authorization', auth);

  it('a body cut off before its closing boundary is a 400', async () => {
    const res = await post().set('Content-Type', 'multipart/form-data; boundary=XyZ')
      .send('--XyZ\r\nContent-Disposition: form-data; name="file"; filename="a.csv"\r\nContent-Type: text/csv\r\n\r\nname,sex\r\nA,fem');
    expect(res.status).toBe(400);
    expect(apiError(res).code).toBe('malformed_upload');
  });

  it('multipart without a boundary is a 400', async () => {
    const res = await post().set('Content-Type', 'multipart/form-data').send('name,sex\r\n');
    expect(res.status).toBe(400);
    expect(apiError(res).field).toBe('file');
  });

  it('garbage part headers are a 400', async () => {
    const res = await post().set('Content-Type', 'multipart/form-data; boundary=b').send('--b\r\n\u0000\u0001garbage\r\n\r\n--b--\r\n');
    expect(res.status).toBeGreaterThanOrEqual(400);
    expect(res.status).toBeLessThan(500);
  });
});

describe('a simulation the integrator cannot finish', () => {
  it('answers 422 naming the step (the integrator stops at its step limit: an in-limit 595 s, 20 Hz sweep at rtol 1e-13)', async () => {
    // Its own pool with a long budget: the integrator gives up after 100,000 steps (a few CPU seconds).
    const pool = new SimulationPool({ size: 1, timeoutMs: 120_000 });
    const app = express().use(express.json({ limit: '2mb' })).use('/api/simulate', createSimulateRouter({ pool })).use(errorHandler);
    const body: unknown = JSON.parse(readFileSync('tests/fixtures/bodies/arm-on-trunk.json', 'utf8'));
    const sequence = {
      start: { r_sh_flex: 60, r_sh_abd: 30 },
      steps: [
        { kind: 'hold', duration: 0.5 },
        { kind: 'harmonic', period: 0.05, cycles: 11_900, joints: { r_sh_flex: { offset: 60, amplitude: 30, phase: 0 }, r_sh_abd: { offset: 0, amplitude: 30, phase: 90 } } },
      ],
    };
    const res = await request(app).post('/api/simulate').send({ body, sequence, options: { rtol: 1e-13, rateHz: 1 } });
    await pool.close();
    expect(res.status).toBe(422);
    expect(apiError(res).code).toBe('simulation_unfinished');
    expect(apiError(res).field).toBe('sequence.steps.1');
    expect(apiError(res).message).toMatch(/step 1/);
  }, 120_000);
});
