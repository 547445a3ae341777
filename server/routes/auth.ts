import { eq } from 'drizzle-orm';
import { type CookieOptions, type Request, type Response, Router } from 'express';
import { ipKeyGenerator, rateLimit } from 'express-rate-limit';

import { users } from '../../db/schema/index.ts';
import { changePasswordRequestSchema, signInRequestSchema } from '../../shared/contracts/auth.ts';
import type { AppContext } from '../app-context.ts';
import { recordAudit } from '../audit/record-audit.ts';
import { assertStrongPassword } from '../auth/password-strength.ts';
import { hashPassword, verifyPassword } from '../auth/passwords.ts';
import { toSessionUser } from '../auth/session-user.ts';
import { SESSION_COOKIE } from '../auth/tokens.ts';
import { unauthorized } from '../http/http-error.ts';
import { validate } from '../http/validate.ts';

/** Cookie settings for the web session: httpOnly, SameSite=Strict, Secure behind HTTPS. */
export function sessionCookieOptions(ctx: AppContext): CookieOptions {
  return { httpOnly: true, sameSite: 'strict', secure: (ctx.config.PUBLIC_URL ?? '').startsWith('https:'), path: '/' };
}

/** Public routes: sign-in. (Sign-out, me and password change go through the guard: see me.ts.) */
export function authRouter(ctx: AppContext): Router {
  const router = Router();
  const { db, tokens, config } = ctx;
  // Compared against when the e-mail is unknown, so response time does not reveal which accounts exist.
  const dummyHash = hashPassword('not-a-real-password', config.BCRYPT_COST);

  // Failed attempts are limited twice: per client address (whatever e-mails it tries) and per
  // account (from every address together), so neither spraying e-mails nor spreading addresses helps.
  const limited = (message: string) => (_req: Request, res: Response) => {
    res.status(429).json({ error: { code: 'rate_limited', message } });
  };
  const perAddress = rateLimit({
    windowMs: config.SIGNIN_RATE_WINDOW_MS,
    limit: config.SIGNIN_RATE_LIMIT,
    skipSuccessfulRequests: true,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    identifier: 'sign-in-address',
    keyGenerator: (req) => ipKeyGenerator(req.ip ?? ''),
    handler: limited('Too many failed sign-in attempts from this network. Wait a few minutes and try again.'),
  });
  const perAccount = rateLimit({
    windowMs: config.SIGNIN_RATE_WINDOW_MS,
    limit: config.SIGNIN_ACCOUNT_RATE_LIMIT,
    skipSuccessfulRequests: true,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    identifier: 'sign-in-account',
    keyGenerator: (req) => {
      // Runs before the body is validated: an absent or odd e-mail counts under its text form.
      const body: unknown = req.body;
      const email = body && typeof body === 'object' && 'email' in body && typeof body.email === 'string' ? body.email : '';
      return `account:${email.trim().toLowerCase()}`;
    },
    handler: limited('Too many failed sign-in attempts for this e-mail. Wait a few minutes and try again, or ask your administrator.'),
  });

  router.post('/sign-in', perAddress, perAccount, validate({ body: signInRequestSchema }), async (req, res) => {
    const { email, password } = req.body;
    const [row] = await db.select().from(users).where(eq(users.email, email));
    const ok = await verifyPassword(password, row?.passwordHash ?? (await dummyHash));
    if (!row || !ok) throw unauthorized('E-mail or password is not right.');
    if (row.disabled) throw unauthorized('This account is disabled. Ask your administrator.');
    const token = await tokens.issue({ sub: row.id, role: row.role, tv: row.tokenVersion });
    await recordAudit(db, { actorId: row.id, action: 'auth.sign_in', objectType: 'user', objectId: row.id });
    res.cookie(SESSION_COOKIE, token, sessionCookieOptions(ctx));
    res.json({ user: toSessionUser(row), token });
  });

  return router;
}

/** Signed-in routes about oneself: who am I, sign out (revokes every token), change password. */
export function meRouter(ctx: AppContext): Router {
  const router = Router();
  const { db, config } = ctx;

  router.get('/', (req, res) => {
    res.json({ user: req.user });
  });

  router.post('/sign-out', async (req, res) => {
    const me = req.user!;
    const [row] = await db.select().from(users).where(eq(users.id, me.id));
    await db.update(users).set({ tokenVersion: row.tokenVersion + 1 }).where(eq(users.id, me.id));
    await recordAudit(db, { actorId: me.id, action: 'auth.sign_out', objectType: 'user', objectId: me.id });
    res.clearCookie(SESSION_COOKIE, { path: '/' });
    res.status(204).end();
  });

  router.post('/password', validate({ body: changePasswordRequestSchema }), async (req, res) => {
    const me = req.user!;
    const { currentPassword, newPassword } = req.body;
    const [row] = await db.select().from(users).where(eq(users.id, me.id));
    if (!(await verifyPassword(currentPassword, row.passwordHash))) {
      res.status(400).json({ error: { code: 'wrong_password', message: 'The current password is not right.', field: 'currentPassword' } });
      return;
    }
    assertStrongPassword(newPassword, row, 'newPassword');
    const passwordHash = await hashPassword(newPassword, config.BCRYPT_COST);
    await db.update(users).set({ passwordHash, tokenVersion: row.tokenVersion + 1 }).where(eq(users.id, me.id));
    await recordAudit(db, { actorId: me.id, action: 'auth.password_changed', objectType: 'user', objectId: me.id });
    res.clearCookie(SESSION_COOKIE, { path: '/' });
    res.status(204).end();
  });

  return router;
}
