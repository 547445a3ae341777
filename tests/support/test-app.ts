import { mkdtempSync, rmSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';

import type { Express } from 'express';
import type pg from 'pg';
import type { DestinationStream } from 'pino';
import request from 'supertest';
import { afterAll, beforeAll } from 'vitest';

import { DEMO_PASSWORD, DEMO_PEOPLE } from '../../db/seed/demo-people.ts';
import { seedDemo } from '../../db/seed/run-seed.ts';
import { createApp } from '../../server/app.ts';
import type { AppContext } from '../../server/app-context.ts';
import { loadConfig } from '../../server/config.ts';
import { createContext } from '../../server/context.ts';
import { type JobQueueOptions, type RunningJobQueue, startJobQueue } from '../../server/jobs/job-queue.ts';
import { type SmtpFake, startSmtpFake } from '../../server/mail/smtp-fake.ts';
import { type S3Fake, startS3Fake } from '../../server/storage/s3-fake.ts';
import { signInResponseSchema } from '../../shared/contracts/auth.ts';
import type { Role } from '../../shared/contracts/roles.ts';
import { createTestDatabase } from './test-database.ts';

/** A running app over its own fresh, migrated database with the mail and S3 fakes. */
export interface TestApp {
  app: Express;
  ctx: AppContext;
  /** The app's own pool, for raw SQL in tests. */
  pool: pg.Pool;
  mail: SmtpFake;
  s3: S3Fake;
  /** Bearer token of the first demo user with that role (the demo scenario is seeded). */
  tokenFor(role: Role): Promise<string>;
  /** Bearer token for a demo user by e-mail. */
  tokenForEmail(email: string): Promise<string>;
  close(): Promise<void>;
}

/** Low bcrypt cost for speed: tests only; production refuses < 12 (server/config.ts). */
export const TEST_BCRYPT_COST = 4;

export interface TestAppOptions {
  /** Seed the demo scenario (default true). */
  seed?: boolean;
  /** Settings over the test defaults (server/config.ts names). */
  env?: Record<string, string>;
  logDestination?: DestinationStream;
}

export async function startTestApp(opts: TestAppOptions = {}): Promise<TestApp> {
  const database = await createTestDatabase();
  const mail = await startSmtpFake();
  const s3Dir = mkdtempSync(path.join(os.tmpdir(), 'hn-s3-'));
  const s3 = await startS3Fake(s3Dir);
  const config = loadConfig({
    NODE_ENV: 'test',
    DATABASE_URL: database.url,
    JWT_SECRET: 'test-secret-that-is-long-enough-0123456789',
    BCRYPT_COST: String(TEST_BCRYPT_COST),
    SMTP_PORT: String(mail.port),
    SMTP_IGNORE_TLS: 'true',
    S3_ENDPOINT: s3.endpoint,
    PUBLIC_URL: 'http://127.0.0.1:9',
    LOG_LEVEL: 'silent',
    SIGNIN_RATE_LIMIT: '1000',
    SIGNIN_ACCOUNT_RATE_LIMIT: '1000',
    ...opts.env,
  });
  const ctx = createContext(config, mail.messages, opts.logDestination);
  if (opts.seed !== false) await seedDemo(ctx.db, TEST_BCRYPT_COST, ctx.simulation.product);
  const app = createApp(ctx);
  const tokens = new Map<string, string>();
  const tokenForEmail = async (email: string) => {
    const cached = tokens.get(email);
    if (cached) return cached;
    const res = await request(app).post('/api/auth/sign-in').send({ email, password: DEMO_PASSWORD });
    if (res.status !== 200) throw new Error(`sign-in of ${email} failed: ${res.status} ${JSON.stringify(res.body)}`);
    const { token } = signInResponseSchema.parse(res.body);
    tokens.set(email, token);
    return token;
  };
  return {
    app,
    ctx,
    pool: ctx.pool,
    mail,
    s3,
    tokenForEmail,
    tokenFor: (role) => tokenForEmail(DEMO_PEOPLE.find((p) => p.role === role)!.email),
    close: async () => {
      await ctx.close();
      await mail.stop();
      await s3.stop();
      rmSync(s3Dir, { recursive: true, force: true });
      await database.drop();
    },
  };
}

/** The app of one test file, with the job queue it asked for. */
export interface FileTestApp extends TestApp {
  /** The job queue started with the app (`jobQueue` option) or by `startJobQueue`; also the app's `ctx.jobs`. */
  readonly jobs: RunningJobQueue;
  /** Starts the job queue now (after a test has seen work wait for it); it stops before the app closes. */
  startJobQueue(opts: JobQueueOptions): Promise<RunningJobQueue>;
}

/** Starting a cluster-backed app (clone, seed, fakes) takes long on a loaded machine. */
const START_TIMEOUT_MS = 120_000;

/**
 * The test file's app: started in `beforeAll`, closed in `afterAll` (after the file's own `afterAll`
 * hooks, which vitest runs in reverse order). The object returned reads through to the running app, so
 * tests and helpers use it as a TestApp; used before the start it says so instead of reading undefined.
 * `jobQueue` also starts a job queue on it with those options, stopped before the app closes.
 */
export function testAppForFile(opts: TestAppOptions & { jobQueue?: JobQueueOptions } = {}): FileTestApp {
  let started: TestApp | undefined;
  let jobs: RunningJobQueue | undefined;
  const running = (): TestApp => {
    if (!started) throw new Error('the file\'s test app runs from beforeAll to afterAll: use it inside a hook or a test');
    return started;
  };
  const startJobs = async (queueOpts: JobQueueOptions) => {
    const { ctx } = running();
    jobs = await startJobQueue(ctx, queueOpts);
    ctx.jobs = jobs;
    return jobs;
  };
  beforeAll(async () => {
    started = await startTestApp(opts);
    if (opts.jobQueue) await startJobs(opts.jobQueue);
  }, START_TIMEOUT_MS);
  const stop = async () => {
    const app = started;
    started = undefined;
    await jobs?.stop();
    jobs = undefined;
    await app?.close();
  };
  afterAll(stop);
  return {
    get app() { return running().app; },
    get ctx() { return running().ctx; },
    get pool() { return running().pool; },
    get mail() { return running().mail; },
    get s3() { return running().s3; },
    get jobs() {
      if (!jobs) throw new Error('no job queue yet: pass the jobQueue option to testAppForFile or call startJobQueue');
      return jobs;
    },
    startJobQueue: startJobs,
    tokenFor: (role) => running().tokenFor(role),
    tokenForEmail: (email) => running().tokenForEmail(email),
    close: stop,
  };
}
