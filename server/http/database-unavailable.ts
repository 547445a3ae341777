/**
 * Recognises errors that mean "the database cannot be reached right now" (a restart, a crash, a
 * refused or dropped connection), as opposed to an error in the statement itself. Requests that
 * meet one answer 503 `database_unavailable` with a retry hint instead of a 500.
 */

import { DATABASE_CONNECT_ERROR } from '../../db/client.ts';

/** Seconds a client should wait before retrying during a database outage (sent as Retry-After). */
export const DATABASE_RETRY_AFTER_S = 5;

// Socket-level failures of the connection to PostgreSQL.
const NETWORK_CODES = new Set(['ECONNREFUSED', 'ECONNRESET', 'ETIMEDOUT', 'EPIPE', 'EHOSTUNREACH', 'ENETUNREACH', 'EAI_AGAIN']);
// SQLSTATEs: admin_shutdown, crash_shutdown, cannot_connect_now, too_many_connections.
const SERVER_CODES = new Set(['57P01', '57P02', '57P03', '53300']);
// node-postgres reports some connection losses only by message.
const MESSAGES = [
  'Connection terminated',
  'timeout exceeded when trying to connect',
  'Client has encountered a connection error and is not queryable',
  'Cannot use a pool after calling end on the pool',
];

/**
 * True when this error, or any error in its `cause` chain, is a lost database connection. A bare
 * socket code (ECONNREFUSED …) counts only when it came from the database: a connect the pool marked
 * (db/client.ts) or a statement drizzle wrapped (DrizzleQueryError carries `query`); the same code
 * from the mail or storage service is theirs to report.
 */
export function isDatabaseUnavailable(err: unknown, fromDatabase = false): boolean {
  for (let e: unknown = err, depth = 0; e && depth < 5; e = (e as { cause?: unknown }).cause, depth++) {
    if (typeof e !== 'object') return false;
    const { code, message } = e as { code?: unknown; message?: unknown };
    if (typeof (e as { query?: unknown }).query === 'string' || (e as Record<symbol, unknown>)[DATABASE_CONNECT_ERROR]) fromDatabase = true;
    if (typeof code === 'string' && (SERVER_CODES.has(code) || /^08/.test(code) || (fromDatabase && NETWORK_CODES.has(code)))) return true;
    if (typeof message === 'string' && MESSAGES.some((m) => message.includes(m))) return true;
    // AggregateError from a failed connect to several addresses (localhost → ::1 and 127.0.0.1).
    const inner = (e as { errors?: unknown }).errors;
    if (Array.isArray(inner) && inner.some((x) => isDatabaseUnavailable(x, fromDatabase))) return true;
  }
  return false;
}
