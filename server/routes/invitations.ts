import { and, eq, gt, isNull } from 'drizzle-orm';
import { Router } from 'express';
import { z } from 'zod';

import { invitations, users } from '../../db/schema/index.ts';
import { acceptInvitationRequestSchema } from '../../shared/contracts/team.ts';
import type { AppContext } from '../app-context.ts';
import { recordAudit } from '../audit/record-audit.ts';
import { assertStrongPassword } from '../auth/password-strength.ts';
import { hashPassword } from '../auth/passwords.ts';
import { toSessionUser } from '../auth/session-user.ts';
import { SESSION_COOKIE } from '../auth/tokens.ts';
import { conflict, HttpError } from '../http/http-error.ts';
import { validate } from '../http/validate.ts';
import { hashInvitationToken } from '../team/invitation-token.ts';
import { sessionCookieOptions } from './auth.ts';

const tokenParams = z.object({ token: z.string().min(20).max(100) });
const invalid = () => new HttpError(404, 'invitation_invalid', 'This invitation link is not valid, was already used, or has expired. Ask your administrator for a new one.');

/** Public routes the invitee reaches from the e-mailed link: preview, then accept with a password. */
export function invitationsRouter(ctx: AppContext): Router {
  const router = Router();
  const { db } = ctx;

  const openInvitation = async (token: string) => {
    const [inv] = await db
      .select()
      .from(invitations)
      .where(and(eq(invitations.tokenHash, hashInvitationToken(token)), isNull(invitations.acceptedAt), isNull(invitations.revokedAt), gt(invitations.expiresAt, new Date())));
    return inv;
  };

  router.get('/:token', validate({ params: tokenParams }), async (_req, res) => {
    const inv = await openInvitation((res.locals.params).token);
    if (!inv) throw invalid();
    res.json({ email: inv.email, name: inv.name, role: inv.role });
  });

  router.post('/:token/accept', validate({ params: tokenParams, body: acceptInvitationRequestSchema }), async (req, res) => {
    const inv = await openInvitation((res.locals.params).token);
    if (!inv) throw invalid();
    const { password } = req.body;
    assertStrongPassword(password, inv);
    const passwordHash = await hashPassword(password, ctx.config.BCRYPT_COST);
    const user = await db.transaction(async (tx) => {
      // Marking the invitation used in the same statement that checks it keeps a double click from making two accounts.
      const used = await tx
        .update(invitations)
        .set({ acceptedAt: new Date() })
        .where(and(eq(invitations.id, inv.id), isNull(invitations.acceptedAt), isNull(invitations.revokedAt)))
        .returning({ id: invitations.id });
      if (!used.length) throw invalid();
      const [existing] = await tx.select({ id: users.id }).from(users).where(eq(users.email, inv.email));
      if (existing) throw conflict('Someone with that e-mail already has an account.', 'email_taken');
      const [u] = await tx
        .insert(users)
        .values({ email: inv.email, name: inv.name, role: inv.role, passwordHash, crewMemberId: inv.crewMemberId })
        .returning();
      await recordAudit(tx, { actorId: u.id, action: 'team.accept_invitation', objectType: 'user', objectId: u.id, detail: { invitationId: inv.id } });
      return u;
    });
    const token = await ctx.tokens.issue({ sub: user.id, role: user.role, tv: user.tokenVersion });
    res.cookie(SESSION_COOKIE, token, sessionCookieOptions(ctx));
    res.status(201).json({ user: toSessionUser(user), token });
  });

  return router;
}
