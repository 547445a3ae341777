/**
 * Fault test: the mail service (SMTP) down during an invitation. The process keeps serving, the
 * admin gets a clear answer (never a 500, never mistaken for a database outage), and nothing is
 * half-written: a refused invitation leaves every table unchanged; an accepted one is stored with its
 * audit event and listed, waiting to be sent.
 */
import { eq } from 'drizzle-orm';
import request from 'supertest';
import { beforeAll, describe, expect, it } from 'vitest';

import { auditEvents, invitations } from '../../db/schema/index.ts';
import { startSmtpFake } from '../../server/mail/smtp-fake.ts';
import type { Invitation } from '../../shared/contracts/team.ts';
import { appTables, changedTables, snapshot } from '../fuzz/db-snapshot.ts';
import { apiError, bodyOf, errorCode } from '../support/response-body.ts';
import { testAppForFile } from '../support/test-app.ts';
import { recordUncaughtErrors } from '../support/uncaught-errors.ts';

// Response bodies as the web client reads them.
type InvitationsBody = { invitations: Invitation[] };

const uncaught = recordUncaughtErrors();
const t = testAppForFile();
let tables: string[];
beforeAll(async () => {
  tables = await appTables(t.pool);
});

describe('mail service down during an invitation', () => {
  it('no crash and a clear answer; nothing half-written: a refused invitation leaves no row, an accepted one is kept for sending', async () => {
    const auth = `Bearer ${await t.tokenFor('admin')}`;
    const port = t.mail.port;
    const before = await snapshot(t.pool, tables);
    await t.mail.stop();
    const email = 'rowan.pike@lumen.example.test';
    const res = await request(t.app).post('/api/team/invitations').set('Authorization', auth).send({ email, name: 'Rowan Pike', role: 'reviewer' });
    // Never a 500 or a database error: either refused with a reason, or accepted for sending later.
    expect(res.status).not.toBe(500);
    expect(errorCode(res)).not.toBe('database_unavailable');
    const rows = await t.ctx.db.select().from(invitations).where(eq(invitations.email, email));
    if (res.status >= 400) {
      expect(apiError(res).message.length).toBeGreaterThan(10);
      expect(changedTables(before, await snapshot(t.pool, tables))).toEqual([]);
    } else {
      // Accepted: the invitation and its audit event are stored together, and the admin sees it listed.
      expect(rows).toHaveLength(1);
      const audit = await t.ctx.db.select().from(auditEvents).where(eq(auditEvents.objectId, rows[0].id));
      expect(audit.length).toBeGreaterThan(0);
      const listed = await request(t.app).get('/api/team/invitations').set('Authorization', auth);
      expect(bodyOf<InvitationsBody>(listed).invitations.some((i: { email: string }) => i.email === email)).toBe(true);
    }
    expect((await request(t.app).get('/api/team/users').set('Authorization', auth)).status).toBe(200);
    const again = await startSmtpFake(port);
    Object.assign(t.mail, { stop: () => again.stop() });
    expect(uncaught).toEqual([]);
  }, 60_000);
});
