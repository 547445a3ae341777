/**
 * Sends one invitation's e-mail from the outbox (the invitation row). Each attempt makes a fresh
 * token and stores only its hash, so no usable link waits in the database or the job queue; the
 * link in the newest e-mail is the one that works. A failed attempt is recorded for the admin and
 * thrown, so the job queue retries it with backoff; the last attempt marks the invitation `failed`
 * (the admin can resend or revoke it).
 */
import { and, eq, gt, isNull } from 'drizzle-orm';

import { invitations, users } from '../../db/schema/index.ts';
import type { AppContext } from '../app-context.ts';
import { publicUrl } from '../config.ts';
import { invitationMail } from './invitation-mail.ts';
import { newInvitationToken } from './invitation-token.ts';

/** Data of one invitation-mail job. */
export interface InvitationMailJob {
  invitationId: string;
}

/** A mailer error, short and without the recipient's address repeated. */
function describe(err: unknown): string {
  const e = err as { code?: string; message?: string };
  const text = `${e.code ? `${e.code}: ` : ''}${e.message ?? String(err)}`;
  return text.length > 300 ? `${text.slice(0, 297)}…` : text;
}

/** One delivery attempt; `attempt` counts from 0, the last allowed is `retryLimit`. */
export async function deliverInvitation(ctx: AppContext, job: InvitationMailJob, opts: { attempt: number; retryLimit: number }): Promise<void> {
  const { db } = ctx;
  const [row] = await db
    .select({ inv: invitations, by: users.name })
    .from(invitations)
    .innerJoin(users, eq(users.id, invitations.invitedBy))
    .where(eq(invitations.id, job.invitationId));
  // Accepted, revoked, expired or already sent: nothing to do.
  if (!row || row.inv.acceptedAt || row.inv.revokedAt || row.inv.expiresAt <= new Date() || row.inv.mailState !== 'sending') return;
  const { token, hash } = newInvitationToken();
  const [claimed] = await db
    .update(invitations)
    .set({ tokenHash: hash, mailAttempts: row.inv.mailAttempts + 1 })
    .where(and(eq(invitations.id, row.inv.id), eq(invitations.mailState, 'sending'), isNull(invitations.acceptedAt), isNull(invitations.revokedAt), gt(invitations.expiresAt, new Date())))
    .returning({ id: invitations.id });
  if (!claimed) return;
  const link = `${publicUrl(ctx.config)}/invite/${token}`;
  try {
    await ctx.mailer.send(invitationMail({ to: row.inv.email, name: row.inv.name, role: row.inv.role, invitedBy: row.by, link }));
  } catch (err) {
    const last = opts.attempt >= opts.retryLimit;
    await db.update(invitations).set({ mailError: describe(err), ...(last ? { mailState: 'failed' as const } : {}) })
      .where(and(eq(invitations.id, row.inv.id), eq(invitations.mailState, 'sending')));
    ctx.logger.warn({ err, invitationId: row.inv.id, attempt: opts.attempt, last }, 'invitation e-mail failed');
    if (!last) throw err;
    return;
  }
  await db.update(invitations).set({ mailState: 'sent', mailSentAt: new Date(), mailError: null })
    .where(and(eq(invitations.id, row.inv.id), eq(invitations.mailState, 'sending')));
}
