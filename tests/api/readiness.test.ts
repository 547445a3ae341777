/** Liveness and readiness: /healthz never touches the database; /readyz needs it reachable and migrated. */
import request from 'supertest';
import { describe, expect, inject, it } from 'vitest';

import { createApp } from '../../server/app.ts';
import { loadConfig } from '../../server/config.ts';
import { createContext } from '../../server/context.ts';
import { apiError } from '../support/response-body.ts';
import { testAppForFile } from '../support/test-app.ts';

const t = testAppForFile({ seed: false });

/** An app over some other database URL (no seed, no fakes: nothing here sends mail or stores files). */
function appOver(url: string) {
  const ctx = createContext(loadConfig({ NODE_ENV: 'test', DATABASE_URL: url, JWT_SECRET: 'test-secret-that-is-long-enough-0123456789', LOG_LEVEL: 'silent' }));
  return { app: createApp(ctx), close: ctx.close };
}

describe('GET /healthz and /readyz', () => {
  it('a migrated, reachable database is ready', async () => {
    expect((await request(t.app).get('/healthz')).status).toBe(200);
    const ready = await request(t.app).get('/readyz');
    expect(ready.status).toBe(200);
    expect(ready.body).toEqual({ ready: true, database: 'ok', migrations: 'applied' });
  });

  it('a reachable database without the migrations is not ready (503 migrations_pending)', async () => {
    const other = appOver(inject('pgTemplateUrl').replace(/\/[^/]+$/, '/postgres'));
    const res = await request(other.app).get('/readyz');
    await other.close();
    expect(res.status).toBe(503);
    expect(apiError(res).code).toBe('migrations_pending');
    expect(res.headers['retry-after']).toBe('5');
  });

  it('an unreachable database: alive, not ready, and API requests answer 503 database_unavailable', async () => {
    // Port 9 on loopback: nothing listens, so every connection is refused.
    const other = appOver('postgres://postgres@127.0.0.1:9/holonaut');
    const live = await request(other.app).get('/healthz');
    const ready = await request(other.app).get('/readyz');
    const api = await request(other.app).post('/api/auth/sign-in').send({ email: 'someone@example.test', password: 'long enough password' });
    await other.close();
    expect(live.status).toBe(200);
    expect(ready.status).toBe(503);
    expect(apiError(ready).code).toBe('database_unavailable');
    expect(api.status).toBe(503);
    expect(apiError(api).code).toBe('database_unavailable');
    expect(api.headers['retry-after']).toBe('5');
  });
});
