import { eq, sql } from 'drizzle-orm';
import type { NextFunction, Request, Response } from 'express';

import type { Database } from '../../db/client.ts';
import { users } from '../../db/schema/index.ts';
import type { Role } from '../../shared/contracts/roles.ts';
import { forbidden, unauthorized } from '../http/http-error.ts';
import { toSessionUser } from './session-user.ts';
import { SESSION_COOKIE, type TokenService } from './tokens.ts';

/** Reads the token from the session cookie or an `Authorization: Bearer` header. */
export function tokenFrom(req: Request): string | null {
  const header = req.headers.authorization;
  if (header?.startsWith('Bearer ')) return header.slice(7).trim();
  const cookie = (req.cookies as Record<string, string> | undefined)?.[SESSION_COOKIE];
  return cookie ?? null;
}

/**
 * The single access gate for /api: verifies the token, reloads the user (so disabling a user or
 * bumping their token version takes effect at once) and checks the role against `roles`; notes the
 * database's data mark for cached reads.
 */
export function guard(db: Database, tokens: TokenService, roles: readonly Role[]) {
  // The WAL insert position in the same round trip: the mark cached reads are checked against.
  // Prepared (one name, one text for every area): built once here and planned once per connection,
  // not on every request.
  const userAndMark = db
    .select({ row: users, mark: sql<string | null>`CASE WHEN pg_is_in_recovery() THEN NULL ELSE pg_current_wal_insert_lsn()::text END` })
    .from(users).where(eq(users.id, sql.placeholder('id')))
    .prepare('guard_user_and_mark');
  return async (req: Request, _res: Response, next: NextFunction) => {
    const token = tokenFrom(req);
    if (!token) return next(unauthorized());
    const claims = await tokens.verify(token);
    if (!claims) return next(unauthorized('Your session has expired or is invalid. Sign in again.'));
    const [found] = await userAndMark.execute({ id: claims.sub });
    const row = found?.row;
    if (found?.mark) req.dataMark = found.mark;
    if (!row || row.disabled || row.tokenVersion !== claims.tv) {
      return next(unauthorized('Your session has ended. Sign in again.'));
    }
    req.user = toSessionUser(row);
    if (!roles.includes(row.role)) return next(forbidden());
    next();
  };
}
