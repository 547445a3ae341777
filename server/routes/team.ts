import { and, desc, eq, isNull, lte } from 'drizzle-orm';
import { Router } from 'express';
import { z } from 'zod';

import { crewMembers, type InvitationRow, invitations, users } from '../../db/schema/index.ts';
import { type Invitation, inviteRequestSchema, updateUserRequestSchema } from '../../shared/contracts/team.ts';
import type { AppContext } from '../app-context.ts';
import { recordAudit } from '../audit/record-audit.ts';
import { badRequest, conflict, notFound } from '../http/http-error.ts';
import { validate } from '../http/validate.ts';
import { INVITATION_TTL_MS, newInvitationToken } from '../team/invitation-token.ts';
import { queueInvitationMail } from '../team/queue-invitation-mail.ts';

const idParams = z.object({ id: z.string().uuid('Not a valid id.') });

/** An invitation as the Team screen lists it. */
function invitationView(inv: InvitationRow, invitedBy: string): Invitation {
  return {
    id: inv.id, email: inv.email, name: inv.name, role: inv.role, invitedBy,
    createdAt: inv.createdAt.toISOString(), expiresAt: inv.expiresAt.toISOString(),
    acceptedAt: inv.acceptedAt?.toISOString() ?? null, revokedAt: inv.revokedAt?.toISOString() ?? null,
    mailState: inv.mailState, mailAttempts: inv.mailAttempts, mailError: inv.mailError, mailSentAt: inv.mailSentAt?.toISOString() ?? null,
  };
}

/** Admin routes: list people and invitations, invite, change a role, disable or enable a user. */
export function teamRouter(ctx: AppContext): Router {
  const router = Router();
  const { db } = ctx;

  router.get('/users', async (_req, res) => {
    const rows = await db.select().from(users).orderBy(users.name);
    res.json({
      users: rows.map((u) => ({
        id: u.id, email: u.email, name: u.name, role: u.role, disabled: u.disabled,
        crewMemberId: u.crewMemberId, createdAt: u.createdAt.toISOString(),
      })),
    });
  });

  router.get('/invitations', async (_req, res) => {
    const rows = await db
      .select({ inv: invitations, by: users.name })
      .from(invitations)
      .innerJoin(users, eq(users.id, invitations.invitedBy))
      .orderBy(desc(invitations.createdAt));
    res.json({ invitations: rows.map(({ inv, by }) => invitationView(inv, by)) });
  });

  router.post('/invitations', validate({ body: inviteRequestSchema }), async (req, res) => {
    const me = req.user!;
    const input = req.body;
    const [existing] = await db.select({ id: users.id }).from(users).where(eq(users.email, input.email));
    if (existing) throw conflict('Someone with that e-mail already has an account.', 'email_taken');
    if (input.crewMemberId) {
      const [member] = await db.select({ id: crewMembers.id }).from(crewMembers).where(eq(crewMembers.id, input.crewMemberId));
      if (!member) throw badRequest('crewMemberId: no such crew member.', 'crewMemberId');
    }
    const alreadyInvited = () => conflict('That e-mail already has an open invitation: resend or revoke it in the list of invitations.', 'already_invited');
    const inv = await db.transaction(async (tx) => {
      // An expired invitation no longer holds the address: revoke it so the new one can take its place.
      await tx.update(invitations).set({ revokedAt: new Date() })
        .where(and(eq(invitations.email, input.email), isNull(invitations.acceptedAt), isNull(invitations.revokedAt), lte(invitations.expiresAt, new Date())));
      const [open] = await tx.select({ id: invitations.id }).from(invitations)
        .where(and(eq(invitations.email, input.email), isNull(invitations.acceptedAt), isNull(invitations.revokedAt)));
      if (open) throw alreadyInvited();
      // The e-mail goes out from the outbox; until then the stored hash is of a token nobody holds.
      const [inserted] = await tx
        .insert(invitations)
        .values({
          email: input.email, name: input.name, role: input.role, crewMemberId: input.crewMemberId ?? null,
          tokenHash: newInvitationToken().hash, invitedBy: me.id, expiresAt: new Date(Date.now() + INVITATION_TTL_MS), mailState: 'sending',
        })
        .onConflictDoNothing()
        .returning();
      // Two admins inviting the same address at once: the unique index lets one through.
      if (!inserted) throw alreadyInvited();
      await recordAudit(tx, { actorId: me.id, action: 'team.invite', objectType: 'invitation', objectId: inserted.id, detail: { email: input.email, role: input.role } });
      return inserted;
    });
    await queueInvitationMail(ctx, inv.id);
    res.status(201).json({ invitation: invitationView(inv, me.name) });
  });

  /** Sends the invitation again with a fresh link and a fresh 7-day validity (sending, sent or failed alike). */
  router.post('/invitations/:id/resend', validate({ params: idParams }), async (req, res) => {
    const me = req.user!;
    const { id } = res.locals.params;
    const [inv] = await db.transaction(async (tx) => {
      const updated = await tx.update(invitations)
        .set({ mailState: 'sending', mailError: null, expiresAt: new Date(Date.now() + INVITATION_TTL_MS) })
        .where(and(eq(invitations.id, id), isNull(invitations.acceptedAt), isNull(invitations.revokedAt)))
        .returning();
      if (updated.length) await recordAudit(tx, { actorId: me.id, action: 'team.resend_invitation', objectType: 'invitation', objectId: id, detail: { email: updated[0].email } });
      return updated;
    });
    if (!inv) throw await closedInvitation(id);
    await queueInvitationMail(ctx, inv.id);
    res.json({ invitation: await loadInvitationView(id) });
  });

  /** Withdraws an invitation: its link stops working and the address may be invited again. */
  router.post('/invitations/:id/revoke', validate({ params: idParams }), async (req, res) => {
    const me = req.user!;
    const { id } = res.locals.params;
    const [inv] = await db.transaction(async (tx) => {
      const updated = await tx.update(invitations)
        .set({ revokedAt: new Date(), revokedBy: me.id, tokenHash: newInvitationToken().hash })
        .where(and(eq(invitations.id, id), isNull(invitations.acceptedAt), isNull(invitations.revokedAt)))
        .returning();
      if (updated.length) await recordAudit(tx, { actorId: me.id, action: 'team.revoke_invitation', objectType: 'invitation', objectId: id, detail: { email: updated[0].email } });
      return updated;
    });
    if (!inv) throw await closedInvitation(id);
    res.json({ invitation: await loadInvitationView(id) });
  });

  /** 404 for an unknown id, 409 for an accepted or revoked invitation. */
  async function closedInvitation(id: string) {
    const [row] = await db.select().from(invitations).where(eq(invitations.id, id));
    if (!row) return notFound('Invitation');
    return conflict(row.acceptedAt ? 'That invitation was already accepted.' : 'That invitation was revoked; send a new one.', 'invitation_closed');
  }

  async function loadInvitationView(id: string) {
    const [row] = await db.select({ inv: invitations, by: users.name }).from(invitations).innerJoin(users, eq(users.id, invitations.invitedBy)).where(eq(invitations.id, id));
    return invitationView(row.inv, row.by);
  }

  router.patch('/users/:id', validate({ params: idParams, body: updateUserRequestSchema }), async (req, res) => {
    const me = req.user!;
    const { id } = res.locals.params;
    const change = req.body;
    if (id === me.id && (change.disabled === true || (change.role && change.role !== 'admin'))) {
      throw badRequest('You cannot disable yourself or remove your own admin role.', change.disabled ? 'disabled' : 'role');
    }
    const [row] = await db.select().from(users).where(eq(users.id, id));
    if (!row) throw notFound('User');
    const changes = (change.role !== undefined && change.role !== row.role) || (change.disabled !== undefined && change.disabled !== row.disabled)
      || (change.crewMemberId !== undefined && change.crewMemberId !== row.crewMemberId);
    if (!changes) throw badRequest('Nothing to change: the user already has that role, state and crew member.', Object.keys(change)[0]);
    if (change.crewMemberId) {
      const [member] = await db.select({ id: crewMembers.id }).from(crewMembers).where(eq(crewMembers.id, change.crewMemberId));
      if (!member) throw badRequest('crewMemberId: no such crew member.', 'crewMemberId');
    }
    // A role change or disabling revokes the user's open sessions; a crew link alone does not (it is read per request).
    const revoke = change.role !== undefined || change.disabled !== undefined;
    const updated = await db.transaction(async (tx) => {
      const [u] = await tx
        .update(users)
        .set({
          role: change.role ?? row.role, disabled: change.disabled ?? row.disabled,
          crewMemberId: change.crewMemberId === undefined ? row.crewMemberId : change.crewMemberId,
          tokenVersion: revoke ? row.tokenVersion + 1 : row.tokenVersion,
        })
        .where(eq(users.id, id))
        .returning();
      await recordAudit(tx, { actorId: me.id, action: 'team.update_user', objectType: 'user', objectId: id, detail: { from: { role: row.role, disabled: row.disabled, crewMemberId: row.crewMemberId }, to: change } });
      return u;
    });
    res.json({ user: { id: updated.id, email: updated.email, name: updated.name, role: updated.role, disabled: updated.disabled, crewMemberId: updated.crewMemberId, createdAt: updated.createdAt.toISOString() } });
  });

  return router;
}
