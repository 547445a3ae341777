/** POST /api/simulate router on a bare Express app (auth is added where the lead mounts it). */
import express from 'express';
import request from 'supertest';
import { afterAll, describe, expect, it } from 'vitest';

import { SimulationPool } from '../../server/engine/pool/simulation-pool.ts';
import { errorHandler } from '../../server/http/error-handler.ts';
import { createSimulateRouter } from '../../server/routes/simulate.ts';
import { apiErrorSchema } from '../../shared/contracts/api-error.ts';
import { simulationResultSchema } from '../../shared/contracts/result.ts';
import { apiError } from '../support/response-body.ts';
import { loadBody, loadSequence } from './fixtures.ts';

const pool = new SimulationPool({ size: 1, timeoutMs: 15_000 });
const app = express().use(express.json({ limit: '5mb' })).use('/api/simulate', createSimulateRouter({ pool })).use(errorHandler);
afterAll(() => pool.close());

const body = loadBody('arm-on-trunk');
const sequence = loadSequence('arm-cone', body);

describe('POST /api/simulate', () => {
  it('returns the result contract', async () => {
    const res = await request(app).post('/api/simulate').send({ body, sequence, options: { rateHz: 10 } });
    expect(res.status).toBe(200);
    const r = simulationResultSchema.parse(res.body);
    expect(r.final.rotation.angleDeg).toBeGreaterThan(1);
    expect(r.momentumResidual.relative).toBeLessThan(1e-9);
  });

  const bad: [string, () => object, string, string, RegExp][] = [
    ['missing sequence', () => ({ body }), 'invalid_request', 'sequence', /sequence is required/],
    ['rate above 240 Hz', () => ({ body, sequence, options: { rateHz: 1000 } }), 'invalid_request', 'options.rateHz', /at most 240 Hz/],
    ['rtol too loose', () => ({ body, sequence, options: { rtol: 0.1 } }), 'invalid_request', 'options.rtol', /rtol must be at most/],
    ['65 segments', () => ({ body: { ...body, segments: Array.from({ length: 65 }, () => body.segments[0]) }, sequence }), 'limit_exceeded', 'body.segments', /65 segments; the limit is 64/],
    ['201 dofs', () => ({ body: { ...body, segments: [body.segments[0], { ...body.segments[1], joint: { origin: [0, 0, 0], dofs: Array.from({ length: 201 }, (_, i) => ({ name: `d${i}`, axis: [0, 0, 1], min: -1, max: 1 })) } }] }, sequence }), 'limit_exceeded', 'body.segments', /201 dofs; the limit is 200/],
    ['501 steps', () => ({ body, sequence: { steps: Array.from({ length: 501 }, () => ({ kind: 'hold', duration: 0.1 })) } }), 'limit_exceeded', 'sequence.steps', /501 steps; the limit is 500/],
    ['601 s', () => ({ body, sequence: { steps: [{ kind: 'hold', duration: 601 }] } }), 'limit_exceeded', 'sequence.steps', /601\.0 s; the limit is 600 s/],
    ['a bad body', () => ({ body: { ...body, segments: [body.segments[0], { ...body.segments[1], parent: 'chest' }] }, sequence }), 'invalid_body', 'body.segments[1].parent', /unknown parent 'chest'/],
    ['a bad sequence', () => ({ body, sequence: { steps: [{ kind: 'move', duration: 1, to: { knee: 3 } }] } }), 'invalid_sequence', 'sequence.steps[0].to.knee', /unknown dof 'knee'/],
  ];
  for (const [name, make, code, field, message] of bad) {
    it(`400 for ${name}, naming ${field}`, async () => {
      const res = await request(app).post('/api/simulate').send(make());
      expect(res.status).toBe(400);
      const e = apiErrorSchema.parse(res.body).error;
      expect(e.code).toBe(code);
      expect(e.field).toBe(field);
      expect(e.message).toMatch(message);
    });
  }

  it('stops a simulation over its time budget with a clear 503, and the pool keeps serving', async () => {
    const tinyPool = new SimulationPool({ size: 1, timeoutMs: 300 });
    const slowApp = express().use(express.json()).use('/api/simulate', createSimulateRouter({ pool: tinyPool })).use(errorHandler);
    try {
      // 10 minutes of fast harmonic motion at a very tight tolerance, in twelve 50 s steps (each within
      // the integrator's step limit): over a second of work, several times the 300 ms budget.
      const circles = { kind: 'harmonic', period: 0.15, cycles: 333, joints: { r_sh_abd: { offset: 0, amplitude: 60, phase: 0 } } };
      const slow = { steps: Array.from({ length: 12 }, () => circles) };
      const res = await request(slowApp).post('/api/simulate').send({ body, sequence: slow, options: { rtol: 1e-13 } });
      expect(res.status).toBe(503);
      expect(apiError(res).code).toBe('simulation_timeout');
      expect(apiError(res).message).toMatch(/exceeded its time budget of 300 ms/);
      const ok = await request(slowApp).post('/api/simulate').send({ body, sequence: { steps: [{ kind: 'hold', duration: 0.1 }] } });
      expect(ok.status).toBe(200);
    } finally {
      await tinyPool.close();
    }
  });
});
