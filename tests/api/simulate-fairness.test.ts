/**
 * Fair simulation: the response-size cap, per-user concurrency and rate limits and the shared
 * queue bound on POST /api/simulate, and trainee motion served on its own pool while ad-hoc
 * simulations saturate theirs.
 */
import request from 'supertest';
import { describe, expect, it } from 'vitest';

import { DEMO_PEOPLE } from '../../db/seed/demo-people.ts';
import { deriveBody } from '../../server/model/derive-body.ts';
import type { SequenceListItem } from '../../shared/contracts/maneuver.ts';
import type { SimulationResult } from '../../shared/contracts/result.ts';
import { loadBody } from '../engine/fixtures.ts';
import { apiError, bodyOf } from '../support/response-body.ts';
import { startTestApp, testAppForFile } from '../support/test-app.ts';

// Response bodies as the web client reads them.
type SequencesBody = { sequences: SequenceListItem[] };

const t = testAppForFile({ env: { SIMULATE_POOL_SIZE: '1', SIMULATE_QUEUE_MAX: '2', SIMULATE_RATE_LIMIT: '1000', SIMULATION_TIMEOUT_MS: '120000' } });
const staff = (role: string, i = 0) => DEMO_PEOPLE.filter((p) => p.role === role)[i].email;
const auth = async (email: string) => `Bearer ${await t.tokenForEmail(email)}`;

// A small body (3 dofs) and a workload of seconds: twelve steps of 50 s of fast arm circles (the
// 600 s limit) at rtol 1e-13, each step within the integrator's step limit (seconds of work even for
// the Magnus engine), one sample per second so the response stays tiny.
const arm = loadBody('arm-on-trunk');
const circles = { kind: 'harmonic', period: 0.15, cycles: 333, joints: { r_sh_abd: { offset: 0, amplitude: 60, phase: 0 } } };
const SLOW = { body: arm, sequence: { steps: Array.from({ length: 12 }, () => circles) }, options: { rtol: 1e-13, rateHz: 1 } };
const QUICK = { body: arm, sequence: { steps: [{ kind: 'hold', duration: 0.5 }] }, options: { rateHz: 10 } };


describe('response-size cap', () => {
  it('refuses 600 s at 240 Hz of the 18-dof standard human with 422 too_many_samples naming the rate to ask for; that rate runs', async () => {
    const human = deriveBody({ sex: 'female', stature: 1.65, mass: 60 }).body;
    const sequence = { steps: [{ kind: 'hold', duration: 600 }] };
    const token = await auth(staff('planner'));
    const big = await request(t.app).post('/api/simulate').set('Authorization', token).send({ body: human, sequence, options: { rateHz: 240 } });
    expect(big.status).toBe(422);
    expect(apiError(big).code).toBe('too_many_samples');
    expect(apiError(big).field).toBe('options.rateHz');
    // 600 s × 240 Hz + 1 = 144,001 samples × 18 dofs; the default limit is 1,000,000 values.
    expect(apiError(big).message).toContain('144,001 samples × 18 dofs = 2,592,018 values; the limit is 1,000,000');
    const hz = Number(/at most (\d+) Hz/.exec(apiError(big).message)![1]);
    expect(hz).toBe(Math.floor((1_000_000 / 18 - 1) / 600));
    const fits = await request(t.app).post('/api/simulate').set('Authorization', token).send({ body: human, sequence, options: { rateHz: hz } });
    expect(fits.status).toBe(200);
    expect(bodyOf<SimulationResult>(fits).samples.frames.length * bodyOf<SimulationResult>(fits).samples.dofs.length).toBeLessThanOrEqual(1_000_000);
    // ≈ 12 bytes of JSON per value, so the cap holds a response near 12 MB.
    expect(JSON.stringify(fits.body).length).toBeLessThan(14e6);
  }, 120_000);
});

describe('fair use of the ad-hoc pool', () => {
  it('while three people saturate the pool, a fourth is told to retry, one person cannot run two, and a trainee\'s motion is served at once', async () => {
    const [admin, planner, planner2, reviewer] = await Promise.all([auth(staff('admin')), auth(staff('planner')), auth(staff('planner', 1)), auth(staff('reviewer'))]);
    const trainee = DEMO_PEOPLE.find((p) => p.role === 'trainee')!.email;
    const traineeToken = await auth(trainee);
    const list = await request(t.app).get('/api/sequences').set('Authorization', traineeToken);
    const version = (bodyOf<SequencesBody>(list).sequences as { cleared: { id: string } | null }[]).find((s) => s.cleared)!.cleared!.id;

    // The trainee's motion on an idle server (a rate nobody asked for yet, so nothing is cached).
    let t0 = performance.now();
    expect((await request(t.app).get(`/api/motion/${version}?rate=23`).set('Authorization', traineeToken)).status).toBe(200);
    const idleMs = performance.now() - t0;

    // Saturate: one runs, two wait (the queue bound is 2).
    const started = performance.now();
    const finished: number[] = [];
    const adhoc = [admin, planner, planner2].map((token) =>
      request(t.app).post('/api/simulate').set('Authorization', token).send(SLOW).then((r) => {
        finished.push(performance.now() - started);
        return r;
      }));
    await new Promise((r) => setTimeout(r, 500)); // the three requests reach the pool and its queue

    const busy = await request(t.app).post('/api/simulate').set('Authorization', reviewer).send(QUICK);
    expect(busy.status).toBe(429);
    expect(apiError(busy).code).toBe('simulations_busy');
    expect(Number(busy.headers['retry-after'])).toBeGreaterThan(0);
    const twice = await request(t.app).post('/api/simulate').set('Authorization', planner).send(QUICK);
    expect(twice.status).toBe(429);
    expect(apiError(twice).code).toBe('simulation_in_progress');
    expect(Number(twice.headers['retry-after'])).toBeGreaterThan(0);

    // The trainee's motion (another uncached rate) does not wait behind them.
    t0 = performance.now();
    const motion = await request(t.app).get(`/api/motion/${version}?rate=27`).set('Authorization', traineeToken);
    const busyMs = performance.now() - t0;
    const servedAt = performance.now() - started;
    expect(motion.status).toBe(200);
    expect(finished, 'no ad-hoc simulation had finished when the motion arrived').toEqual([]);

    const results = await Promise.all(adhoc);
    expect(results.map((r) => r.status)).toEqual([200, 200, 200]);
    // The saturation lasted well beyond the motion request.
    expect(Math.max(...finished)).toBeGreaterThan(servedAt);
    console.log(`trainee motion: ${idleMs.toFixed(0)} ms idle, ${busyMs.toFixed(0)} ms with the ad-hoc pool saturated; ad-hoc simulations finished at ${finished.map((f) => (f / 1000).toFixed(1)).join(', ')} s`);

    // Once the pool drains, the refused people get through.
    expect((await request(t.app).post('/api/simulate').set('Authorization', reviewer).send(QUICK)).status).toBe(200);
  }, 240_000);
});

describe('per-user rate limit', () => {
  it('answers 429 rate_limited with Retry-After after the configured number of simulations per window', async () => {
    const limited = await startTestApp({ seed: true, env: { SIMULATE_RATE_LIMIT: '2', SIMULATE_RATE_WINDOW_MS: '60000' } });
    try {
      const token = `Bearer ${await limited.tokenForEmail(staff('planner'))}`;
      const other = `Bearer ${await limited.tokenForEmail(staff('reviewer'))}`;
      const statuses = [];
      for (let i = 0; i < 3; i++) statuses.push((await request(limited.app).post('/api/simulate').set('Authorization', token).send(QUICK)).status);
      expect(statuses).toEqual([200, 200, 429]);
      const res = await request(limited.app).post('/api/simulate').set('Authorization', token).send(QUICK);
      expect(apiError(res).code).toBe('rate_limited');
      expect(Number(res.headers['retry-after'])).toBeGreaterThan(0);
      // Another person is unaffected.
      expect((await request(limited.app).post('/api/simulate').set('Authorization', other).send(QUICK)).status).toBe(200);
    } finally {
      await limited.close();
    }
  }, 120_000);
});
