import { drizzle, type NodePgDatabase } from 'drizzle-orm/node-postgres';
import pg from 'pg';

import * as schema from './schema/index.ts';

export type Database = NodePgDatabase<typeof schema>;

/** Options of createDatabase. */
export interface DatabaseOptions {
  /** Most connections the pool opens (default 10). */
  max?: number;
  /** Told about connection errors that no query is waiting for (a restart of the server, a dropped socket). */
  onConnectionError?: (err: Error) => void;
}

/** Set on errors from opening a database connection, so they are told apart from other services' network errors. */
export const DATABASE_CONNECT_ERROR = Symbol.for('holonaut.databaseConnectError');

function markConnectError(err: unknown): unknown {
  if (err && typeof err === 'object') (err as Record<symbol, boolean>)[DATABASE_CONNECT_ERROR] = true;
  return err;
}

/** How long a request waits for a connection before it fails (and answers 503), ms. */
export const CONNECT_TIMEOUT_MS = 5_000;

/**
 * A connection pool and the typed Drizzle handle over it. Connection errors never become uncaught
 * exceptions: a PostgreSQL restart ends every open connection, and the pool opens fresh ones once
 * the server is back.
 */
export function createDatabase(url: string, opts: DatabaseOptions = {}): { db: Database; pool: pg.Pool } {
  const { max = 10, onConnectionError = () => undefined } = opts;
  const pool = new pg.Pool({ connectionString: url, max, connectionTimeoutMillis: CONNECT_TIMEOUT_MS });
  // An idle client that loses its connection is reported here (unheard, it would crash the process).
  pool.on('error', onConnectionError);
  // pg-pool takes its idle listener off a checked-out client, so a connection that drops between
  // the statements of a transaction would emit 'error' with nobody listening. The statement in
  // flight rejects with the same error, so this listener only keeps the process alive.
  pool.on('connect', (client) => {
    client.on('error', () => undefined);
  });
  // Mark connect failures (pool.query connects through this too): "ECONNREFUSED" alone could be any service.
  const connect = pool.connect.bind(pool) as (cb?: (err: Error | undefined, client?: pg.PoolClient, done?: (release?: unknown) => void) => void) => Promise<pg.PoolClient> | void;
  pool.connect = ((cb?: (err: Error | undefined, client?: pg.PoolClient, done?: (release?: unknown) => void) => void) => {
    if (cb) return connect((err, client, done) => cb(err ? (markConnectError(err) as Error) : undefined, client, done));
    return (connect() as Promise<pg.PoolClient>).catch((err: unknown) => {
      throw markConnectError(err);
    });
  }) as typeof pool.connect;
  const db = drizzle(pool, { schema });
  return { db, pool };
}
