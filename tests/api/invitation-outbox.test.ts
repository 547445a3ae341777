/**
 * Invitation e-mails go through an outbox: the invitation row plus a pg-boss job retried with
 * backoff. With the SMTP fake down the admin sees "sending" (then "failed"), nothing is stranded:
 * resend works once mail is back, revoking frees the address, and one address has at most one
 * open invitation.
 */
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';

import { INVITATION_MAIL_RETRY_LIMIT } from '../../server/jobs/queue-names.ts';
import { type SmtpFake, startSmtpFake } from '../../server/mail/smtp-fake.ts';
import type { AuditEvent, Invitation } from '../../shared/contracts/team.ts';
import { eventually } from '../support/eventually.ts';
import { apiError, bodyOf } from '../support/response-body.ts';
import { testAppForFile } from '../support/test-app.ts';

// Response bodies as the web client reads them.
type InvitationsBody = { invitations: Invitation[] };
type InvitationBody = { invitation: Invitation };
type EventsBody = { events: AuditEvent[] };

const t = testAppForFile({ jobQueue: { retryDelayS: 1, pollingIntervalS: 0.5, superviseS: 2 } });
let admin: string;
let port: number;
// The SMTP fake now listening on the configured port (null while "mail is down").
let mail: SmtpFake | null;

beforeAll(async () => {
  port = t.mail.port;
  mail = t.mail;
  admin = `Bearer ${await t.tokenFor('admin')}`;
});
afterAll(async () => {
  if (mail && mail !== t.mail) await mail.stop();
  if (mail !== t.mail) t.mail.stop = () => Promise.resolve(); // already stopped by the test
});

const mailDown = async () => {
  await mail?.stop();
  mail = null;
};
const mailUp = async () => {
  mail = await startSmtpFake(port);
};
const invitation = async (email: string): Promise<Invitation> => {
  const res = await request(t.app).get('/api/team/invitations').set('Authorization', admin);
  return (bodyOf<InvitationsBody>(res).invitations).find((i) => i.email === email && !i.revokedAt)!;
};
const invite = (email: string, name = 'Lark Fenwick') => request(t.app).post('/api/team/invitations').set('Authorization', admin).send({ email, name, role: 'reviewer' });
const linkIn = (text: string) => /\/invite\/([A-Za-z0-9_-]+)/.exec(text)![1];

describe('invitation outbox', () => {
  it('mail down: the invitation is saved and shows "sending" with the error; when mail is back the retry delivers it and the link works', async () => {
    await mailDown();
    const email = 'lark.fenwick@lumen.example.test';
    const res = await invite(email);
    expect(res.status).toBe(201);
    expect(bodyOf<InvitationBody>(res).invitation.mailState).toBe('sending');
    const retried = await eventually(async () => {
      const inv = await invitation(email);
      return inv.mailAttempts >= 2 ? inv : undefined;
    }, 30_000);
    expect(retried.mailState).toBe('sending');
    expect(retried.mailError).toMatch(/ECONNREFUSED|connect/i);

    await mailUp();
    const waiting = mail!.waitFor(email, undefined, 30_000);
    const sent = await eventually(async () => {
      const inv = await invitation(email);
      return inv.mailState === 'sent' ? inv : undefined;
    }, 30_000);
    expect(sent.mailError).toBeNull();
    expect(sent.mailSentAt).not.toBeNull();
    const token = linkIn((await waiting).text);
    expect((await request(t.app).get(`/api/invitations/${token}`)).body).toMatchObject({ email });
    const accepted = await request(t.app).post(`/api/invitations/${token}/accept`).send({ password: 'Granite-Willow-Sextant-19' });
    expect(accepted.status).toBe(201);
    // An accepted invitation can be neither resent nor revoked.
    const done = bodyOf<InvitationsBody>(await request(t.app).get('/api/team/invitations').set('Authorization', admin)).invitations.find((i: Invitation) => i.email === email)!;
    expect((await request(t.app).post(`/api/team/invitations/${done.id}/revoke`).set('Authorization', admin)).status).toBe(409);
  }, 90_000);

  it('mail down for good: after its retries the invitation is "failed"; the address stays held until the admin resends (works once mail is back) or revokes (frees it)', async () => {
    await mailDown();
    const email = 'moth.arden@lumen.example.test';
    expect((await invite(email, 'Moth Arden')).status).toBe(201);
    const failed = await eventually(async () => {
      const inv = await invitation(email);
      return inv.mailState === 'failed' ? inv : undefined;
    }, 60_000);
    expect(failed.mailAttempts).toBe(1 + INVITATION_MAIL_RETRY_LIMIT);
    expect(failed.mailError).toBeTruthy();

    // One open invitation per address: inviting again is refused with a pointer to resend or revoke.
    const again = await invite(email, 'Moth Arden');
    expect(again.status).toBe(409);
    expect(apiError(again).code).toBe('already_invited');
    expect(apiError(again).message).toMatch(/resend or revoke/);

    await mailUp();
    const waiting = mail!.waitFor(email, undefined, 30_000);
    const resent = await request(t.app).post(`/api/team/invitations/${failed.id}/resend`).set('Authorization', admin);
    expect(resent.status).toBe(200);
    expect(bodyOf<InvitationBody>(resent).invitation.mailState).toBe('sending');
    await eventually(async () => ((await invitation(email)).mailState === 'sent' ? true : undefined), 30_000);
    const token = linkIn((await waiting).text);
    expect((await request(t.app).get(`/api/invitations/${token}`)).status).toBe(200);

    // Revoking kills the link and frees the address.
    const revoked = await request(t.app).post(`/api/team/invitations/${failed.id}/revoke`).set('Authorization', admin);
    expect(revoked.status).toBe(200);
    expect(bodyOf<InvitationBody>(revoked).invitation.revokedAt).not.toBeNull();
    expect((await request(t.app).get(`/api/invitations/${token}`)).status).toBe(404);
    expect((await request(t.app).post(`/api/invitations/${token}/accept`).send({ password: 'Granite-Willow-Sextant-19' })).status).toBe(404);
    expect((await request(t.app).post(`/api/team/invitations/${failed.id}/resend`).set('Authorization', admin)).status).toBe(409);
    const fresh = await invite(email, 'Moth Arden');
    expect(fresh.status).toBe(201);
    // Every step is in the audit log.
    const audit = await request(t.app).get('/api/audit?action=team.revoke_invitation').set('Authorization', admin);
    expect(bodyOf<EventsBody>(audit).events.length).toBeGreaterThanOrEqual(1);
  }, 120_000);

  it('two admins inviting the same address at once: exactly one invitation is made', async () => {
    const email = 'pell.quarry@lumen.example.test';
    const [a, b] = await Promise.all([invite(email, 'Pell Quarry'), invite(email, 'Pell Quarry')]);
    expect([a.status, b.status].sort()).toEqual([201, 409]);
    const all = bodyOf<InvitationsBody>(await request(t.app).get('/api/team/invitations').set('Authorization', admin)).invitations.filter((i: Invitation) => i.email === email);
    expect(all).toHaveLength(1);
  });
});
