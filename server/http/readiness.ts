import type { RequestHandler } from 'express';

import { migrationsApplied } from '../../db/migrate.ts';
import type { AppContext } from '../app-context.ts';
import { DATABASE_RETRY_AFTER_S } from './database-unavailable.ts';

/**
 * `GET /readyz`: 200 `{ ready: true }` when the database answers and every committed migration is
 * applied, else 503 with the reason (`database_unavailable` or `migrations_pending`) and Retry-After.
 * Liveness is `/healthz`, which never touches the database.
 */
export function readiness(ctx: Pick<AppContext, 'db' | 'logger'>): RequestHandler {
  return async (_req, res) => {
    let code: 'database_unavailable' | 'migrations_pending' | null = null;
    try {
      if (!(await migrationsApplied(ctx.db))) code = 'migrations_pending';
    } catch (err) {
      ctx.logger.warn({ err: { message: (err as Error).message } }, 'readiness: database unreachable');
      code = 'database_unavailable';
    }
    res.setHeader('Cache-Control', 'no-store');
    if (!code) {
      res.json({ ready: true, database: 'ok', migrations: 'applied' });
      return;
    }
    res.setHeader('Retry-After', String(DATABASE_RETRY_AFTER_S));
    const message = code === 'migrations_pending' ? 'The database is reachable but migrations are not all applied.' : 'The database cannot be reached.';
    res.status(503).json({ ready: false, error: { code, message } });
  };
}
