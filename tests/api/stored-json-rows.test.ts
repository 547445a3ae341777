/**
 * Stored JSON of uploads, their rows and the audit log is parsed where the rows are read
 * (db/stored-json.ts with the shared zod schemas): a value written behind the API's back that no
 * schema reads answers a 500 `stored_value_unreadable` naming the column, the field and the row, and
 * is logged as an error — never passed on as if it were what the type says.
 */
import { and, eq, sql } from 'drizzle-orm';
import request from 'supertest';
import { beforeAll, describe, expect, it } from 'vitest';

import { auditEvents, uploadRows, uploads } from '../../db/schema/index.ts';
import type { RecordingView } from '../../shared/contracts/recording.ts';
import { storedCaptureSchema } from '../../shared/contracts/recording.ts';
import { logLines } from '../support/log-lines.ts';
import { apiError, bodyOf } from '../support/response-body.ts';
import { testAppForFile } from '../support/test-app.ts';

const { lines, destination } = logLines();
const t = testAppForFile({ env: { LOG_LEVEL: 'warn' }, logDestination: destination });
let planner: string;
let admin: string;
let uploadId: string;
beforeAll(async () => {
  planner = `Bearer ${await t.tokenFor('planner')}`;
  admin = `Bearer ${await t.tokenFor('admin')}`;
  const csv = 'time_s,r_sh_flex\n0,10\n0.1,20\n0.2,30\n0.3,40';
  const res = await request(t.app).post('/api/uploads/joint-angles').set('Authorization', planner).attach('file', Buffer.from(csv), 'stored-json.csv');
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  uploadId = bodyOf<{ recording: RecordingView }>(res).recording.uploadId;
});

const loggedError = (text: string) => lines.some((l) => l.includes('"level":50') && l.includes(text));

describe('uploads and their rows', () => {
  it('reads well-formed rows as stored: the CSV cells by column', async () => {
    const res = await request(t.app).get(`/api/uploads/${uploadId}`).set('Authorization', planner);
    expect(res.status).toBe(200);
    expect(bodyOf<{ rows: { row: number; data: unknown }[] }>(res).rows).toEqual([
      { row: 2, data: { time_s: '0', r_sh_flex: '10' } },
      { row: 3, data: { time_s: '0.1', r_sh_flex: '20' } },
      { row: 4, data: { time_s: '0.2', r_sh_flex: '30' } },
      { row: 5, data: { time_s: '0.3', r_sh_flex: '40' } },
    ]);
  });

  it('names the upload, the row and the column when a row is not an object of fields', async () => {
    const rowTwo = and(eq(uploadRows.uploadId, uploadId), eq(uploadRows.rowNumber, 2));
    await t.ctx.db.update(uploadRows).set({ data: sql`'[10, 20]'::jsonb` }).where(rowTwo);
    const res = await request(t.app).get(`/api/uploads/${uploadId}`).set('Authorization', planner);
    expect(res.status).toBe(500);
    expect(apiError(res)).toMatchObject({ code: 'stored_value_unreadable' });
    expect(apiError(res).message).toContain(`upload_rows.data of upload ${uploadId} row 2`);
    expect(loggedError(`upload ${uploadId} row 2`)).toBe(true);
    await t.ctx.db.update(uploadRows).set({ data: { time_s: '0', r_sh_flex: '10' } }).where(rowTwo);
  });

  it('names the field of an unreadable error list (list and detail both)', async () => {
    await t.ctx.db.update(uploads).set({ errors: sql`'[{"row": "three", "column": "", "reason": "x"}]'::jsonb` }).where(eq(uploads.id, uploadId));
    for (const path of ['/api/uploads', `/api/uploads/${uploadId}`]) {
      const res = await request(t.app).get(path).set('Authorization', planner);
      expect(res.status, path).toBe(500);
      expect(apiError(res).message, path).toContain(`uploads.errors.0.row of upload ${uploadId}`);
    }
  });
});

describe('audit events', () => {
  it('answers the log with each event’s detail, and names the event whose detail is not an object', async () => {
    const objectId = 'stored-json-check';
    await t.ctx.db.insert(auditEvents).values({ actorId: null, action: 'test.ok', objectType: 'test', objectId, detail: { count: 2 } });
    const ok = await request(t.app).get('/api/audit').query({ objectId }).set('Authorization', admin);
    expect(ok.status).toBe(200);
    expect(bodyOf<{ events: { detail: unknown }[] }>(ok).events.map((e) => e.detail)).toEqual([{ count: 2 }]);

    // The log is append-only: the unreadable event stays, so it is looked at through its own object id.
    const broken = 'stored-json-broken';
    const [{ id }] = await t.ctx.db.insert(auditEvents)
      .values({ actorId: null, action: 'test.broken', objectType: 'test', objectId: broken, detail: sql`'"just text"'::jsonb` })
      .returning({ id: auditEvents.id });
    const res = await request(t.app).get('/api/audit').query({ objectId: broken }).set('Authorization', admin);
    expect(res.status).toBe(500);
    expect(apiError(res)).toMatchObject({ code: 'stored_value_unreadable' });
    expect(apiError(res).message).toContain(`audit_events.detail of audit event ${id}`);
    expect(loggedError(`audit event ${id}`)).toBe(true);
  });
});

describe('a stored capture', () => {
  it('reads a ratio written as null (JSON has no NaN) back as NaN, and refuses a missing overlay', () => {
    const stored = {
      rehearsalId: 'r', uploadId: 'u', fileName: 'f.csv', rateHz: 100, duration: 1, dofs: ['r_sh_flex'], assumptions: [],
      targetYprDeg: null, planReachedYprDeg: { yaw: 0, pitch: 0, roll: 0 }, outcomes: [],
      steps: [{ step: 1, cue: 'Sweep', startS: 0, endS: 1, periodRatio: 1, amplitudeRatio: Number.NaN, phaseLagS: 0, dofs: [] }],
      overlay: { t: [], planned: {}, executed: {}, plannedTurnDeg: [], executedTurnDeg: [] }, createdAt: '2026-01-01T00:00:00.000Z',
    };
    const roundTrip: unknown = JSON.parse(JSON.stringify(stored));
    expect(storedCaptureSchema.parse(roundTrip).steps[0].amplitudeRatio).toBeNaN();
    const { overlay: _overlay, ...withoutOverlay } = stored;
    expect(storedCaptureSchema.safeParse(withoutOverlay).success).toBe(false);
  });
});
