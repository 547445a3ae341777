import type pg from 'pg';
import type { DestinationStream } from 'pino';

import { createDatabase } from '../db/client.ts';
import type { AppContext } from './app-context.ts';
import { TokenService } from './auth/tokens.ts';
import type { Config } from './config.ts';
import { createSimulationPools } from './engine/pool/simulation-pools.ts';
import { ENGINE_VERSION } from './engine/version.ts';
import { createLogger } from './logging/logger.ts';
import { createMailer } from './mail/mailer.ts';
import type { ReceivedMail } from './mail/smtp-fake.ts';
import { createObjectStore } from './storage/object-store.ts';

/**
 * Builds the app context from configuration: database pool, tokens, mail, storage, simulation pools.
 * `close()` releases them all (shutdown).
 */
export function createContext(config: Config, devMailbox?: readonly ReceivedMail[], logDestination?: DestinationStream): AppContext & { pool: pg.Pool; close: () => Promise<void> } {
  const logger = createLogger(config.LOG_LEVEL, logDestination);
  const { db, pool } = createDatabase(config.DATABASE_URL, {
    onConnectionError: (err) => logger.warn({ err: { message: err.message, code: (err as { code?: string }).code } }, 'database connection lost; the pool reconnects on demand'),
  });
  const mailer = createMailer(config);
  const simulation = createSimulationPools(config);
  return {
    config,
    db,
    tokens: new TokenService(config.JWT_SECRET, config.TOKEN_TTL),
    mailer,
    storage: createObjectStore(config),
    simulation,
    logger,
    engineVersion: ENGINE_VERSION,
    devMailbox,
    pool,
    close: async () => {
      mailer.close();
      await simulation.close();
      await pool.end();
    },
  };
}
