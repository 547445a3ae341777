/**
 * Fault test: object storage (S3) down during an upload. The process keeps serving, the planner gets
 * a clear 503 naming storage (never a 500, never mistaken for a database outage), nothing is written
 * (every table's row count and checksum unchanged), and the same upload succeeds once storage is back.
 */
import { mkdtempSync, rmSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';

import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';

import { type S3Fake, startS3Fake } from '../../server/storage/s3-fake.ts';
import type { UploadResult } from '../../shared/contracts/uploads.ts';
import { appTables, changedTables, snapshot } from '../fuzz/db-snapshot.ts';
import { apiError, bodyOf } from '../support/response-body.ts';
import { testAppForFile } from '../support/test-app.ts';
import { recordUncaughtErrors } from '../support/uncaught-errors.ts';

const uncaught = recordUncaughtErrors();
const t = testAppForFile();
let tables: string[];
const extraDirs: string[] = [];
beforeAll(async () => {
  tables = await appTables(t.pool);
});
afterAll(() => {
  for (const d of extraDirs) rmSync(d, { recursive: true, force: true });
});

const CSV = 'name,call_sign,sex,stature_m,mass_kg,suit,thigh_m\nWren Talbot,WREN,female,1.66,59,cabin-clothing,\n';
const portOf = (endpoint: string) => Number(new URL(endpoint).port);

describe('object storage down during an upload', () => {
  it('answers 503 storage_unavailable, writes nothing, and the same upload succeeds once storage is back', async () => {
    const auth = `Bearer ${await t.tokenFor('planner')}`;
    const port = portOf(t.s3.endpoint);
    const before = await snapshot(t.pool, tables);
    await t.s3.stop();
    const down = await request(t.app).post('/api/uploads/measurements').set('Authorization', auth).attach('file', Buffer.from(CSV), 'wren.csv');
    expect(down.status).toBe(503);
    expect(apiError(down).code).toBe('storage_unavailable');
    expect(apiError(down).message).toMatch(/nothing was saved/);
    expect(changedTables(before, await snapshot(t.pool, tables))).toEqual([]);
    // The API still serves everything that does not need storage.
    expect((await request(t.app).get('/api/crew').set('Authorization', auth)).status).toBe(200);

    // Storage comes back (empty: the bucket is made again) on the same address.
    const dir = mkdtempSync(path.join(os.tmpdir(), 'hn-s3b-'));
    extraDirs.push(dir);
    const again: S3Fake = await startS3Fake(dir, port);
    try {
      const ok = await request(t.app).post('/api/uploads/measurements').set('Authorization', auth).attach('file', Buffer.from(CSV), 'wren.csv');
      expect(ok.status).toBe(201);
      expect(bodyOf<UploadResult>(ok).imported).toEqual([expect.objectContaining({ name: 'Wren Talbot', action: 'created', version: 1 })]);
      const raw = await request(t.app).get(`/api/uploads/${bodyOf<UploadResult>(ok).upload.id}/raw`).set('Authorization', auth);
      expect(raw.text).toBe(CSV);
    } finally {
      // Hand the test app a running fake again for its own close().
      Object.assign(t.s3, { stop: () => again.stop() });
    }
    expect(uncaught).toEqual([]);
  }, 60_000);
});
