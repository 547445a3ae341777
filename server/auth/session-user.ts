import type { UserRow } from '../../db/schema/index.ts';
import type { SessionUser } from '../../shared/contracts/auth.ts';

declare module 'express-serve-static-core' {
  interface Request {
    /** Set by `authenticate` for every signed-in request. */
    user?: SessionUser;
    /** The database's WAL insert position when the user was loaded (server/http/read-cache.ts); absent on a standby. */
    dataMark?: string;
  }
}

/** The public view of a user row. */
export function toSessionUser(row: UserRow): SessionUser {
  return { id: row.id, email: row.email, name: row.name, role: row.role, crewMemberId: row.crewMemberId };
}
