import { and, desc, eq, gt, isNull } from 'drizzle-orm';
import { Router } from 'express';
import { z } from 'zod';

import { crewMembers, invitations, users } from '../../db/schema/index.ts';
import { inviteRequestSchema, updateUserRequestSchema, type InviteRequest, type UpdateUserRequest } from '../../shared/contracts/team.ts';
import type { AppContext } from '../app-context.ts';
import { publicUrl } from '../config.ts';
import { recordAudit } from '../audit/record-audit.ts';
import { badRequest, conflict, notFound } from '../http/http-error.ts';
import { validate } from '../http/validate.ts';
import { invitationMail } from '../team/invitation-mail.ts';
import { INVITATION_TTL_MS, newInvitationToken } from '../team/invitation-token.ts';

const idParams = z.object({ id: z.string().uuid('Not a valid id.') });

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
    res.json({
      invitations: rows.map(({ inv, by }) => ({
        id: inv.id, email: inv.email, name: inv.name, role: inv.role, invitedBy: by,
        createdAt: inv.createdAt.toISOString(), expiresAt: inv.expiresAt.toISOString(),
        acceptedAt: inv.acceptedAt?.toISOString() ?? null,
      })),
    });
  });

  router.post('/invitations', validate({ body: inviteRequestSchema }), async (req, res) => {
    const me = req.user!;
    const input = req.body as InviteRequest;
    const [existing] = await db.select({ id: users.id }).from(users).where(eq(users.email, input.email));
    if (existing) throw conflict('Someone with that e-mail already has an account.', 'email_taken');
    if (input.crewMemberId) {
      const [member] = await db.select({ id: crewMembers.id }).from(crewMembers).where(eq(crewMembers.id, input.crewMemberId));
      if (!member) throw badRequest('crewMemberId: no such crew member.', 'crewMemberId');
    }
    const pending = await db
      .select({ id: invitations.id })
      .from(invitations)
      .where(and(eq(invitations.email, input.email), isNull(invitations.acceptedAt), gt(invitations.expiresAt, new Date())));
    if (pending.length) throw conflict('An open invitation for that e-mail already exists.', 'already_invited');

    const { token, hash } = newInvitationToken();
    const [inv] = await db.transaction(async (tx) => {
      const inserted = await tx
        .insert(invitations)
        .values({
          email: input.email, name: input.name, role: input.role, crewMemberId: input.crewMemberId ?? null,
          tokenHash: hash, invitedBy: me.id, expiresAt: new Date(Date.now() + INVITATION_TTL_MS),
        })
        .returning();
      await recordAudit(tx, { actorId: me.id, action: 'team.invite', objectType: 'invitation', objectId: inserted[0].id, detail: { email: input.email, role: input.role } });
      return inserted;
    });
    const link = `${publicUrl(ctx.config)}/invite/${token}`;
    await ctx.mailer.send(invitationMail({ to: input.email, name: input.name, role: input.role, invitedBy: me.name, link }));
    res.status(201).json({ invitation: { id: inv.id, email: inv.email, name: inv.name, role: inv.role, expiresAt: inv.expiresAt.toISOString() } });
  });

  router.patch('/users/:id', validate({ params: idParams, body: updateUserRequestSchema }), async (req, res) => {
    const me = req.user!;
    const { id } = res.locals.params as { id: string };
    const change = req.body as UpdateUserRequest;
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
