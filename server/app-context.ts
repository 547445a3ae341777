import type { PgBoss } from 'pg-boss';
import type { Logger } from 'pino';

import type { Database } from '../db/client.ts';
import type { TokenService } from './auth/tokens.ts';
import type { Config } from './config.ts';
import type { SimulationPools } from './engine/pool/simulation-pools.ts';
import type { Mailer } from './mail/mailer.ts';
import type { ReceivedMail } from './mail/smtp-fake.ts';
import type { ObjectStore } from './storage/object-store.ts';

/** Everything a route needs, built once at start and passed down (no module-level singletons). */
export interface AppContext {
  config: Config;
  db: Database;
  tokens: TokenService;
  mailer: Mailer;
  storage: ObjectStore;
  /** The engine's worker-thread pools: product work and ad-hoc POST /api/simulate. */
  simulation: SimulationPools;
  logger: Logger;
  /** The engine version this process runs (ENGINE_VERSION; what new verifications record). */
  engineVersion: string;
  /** Messages of the local SMTP fake, when one runs in this process (development and tests). */
  devMailbox?: readonly ReceivedMail[];
  /** Hands background work (re-verification, planning) to the job queue; set when a queue is running. */
  jobs?: JobQueue;
}

/** The part of the job queue the routes use. */
export interface JobQueue {
  /** The pg-boss instance (admin view: find and cancel jobs). */
  boss?: PgBoss;
  enqueueReverification(sequenceVersionIds: string[], toProfileVersionId: string): Promise<void>;
  /** Queues the e-mail of an invitation in state `sending` (retried with backoff). */
  enqueueInvitationMail?(invitationId: string): Promise<void>;
  /** Queues a planning run for a `plans` row (optional: queues without planning workers may omit it). */
  enqueuePlan?(planId: string): Promise<void>;
  /** Queues the chunk jobs of a `robustness_runs` row that are not done yet. */
  enqueueRobustness?(runId: string): Promise<void>;
  /** Cancels a queued or running robustness run and its chunk jobs; false when it had already ended. */
  cancelRobustness?(runId: string, reason: string): Promise<boolean>;
}
