import { z } from 'zod';

const bool = z
  .enum(['true', 'false', '1', '0', ''])
  .transform((v) => v === 'true' || v === '1');

/** Every setting the server reads, from the environment, validated once at start. */
export const configSchema = z.object({
  NODE_ENV: z.enum(['development', 'production', 'test']).default('development'),
  HOST: z.string().default('127.0.0.1'),
  PORT: z.coerce.number().int().min(0).max(65535).default(8080),
  /** Public base URL used in e-mailed links. Defaults to http://HOST:PORT. */
  PUBLIC_URL: z.string().url().optional(),
  DATABASE_URL: z.string().min(1, 'DATABASE_URL is required'),
  /** HS256 key for session tokens; at least 32 characters. */
  JWT_SECRET: z.string().min(32, 'JWT_SECRET must be at least 32 characters'),
  /** Session token lifetime, jose time span ("2h", "30m"). */
  TOKEN_TTL: z.string().default('8h'),
  /** bcrypt cost. 12 or more in production; tests lower it through this setting only. */
  BCRYPT_COST: z.coerce.number().int().min(4).max(15).default(12),
  /** Failed sign-in attempts allowed per client address per window (whatever e-mails they name). */
  SIGNIN_RATE_LIMIT: z.coerce.number().int().min(1).default(30),
  /** Failed sign-in attempts allowed per account (e-mail) per window, from all addresses together. */
  SIGNIN_ACCOUNT_RATE_LIMIT: z.coerce.number().int().min(1).default(10),
  SIGNIN_RATE_WINDOW_MS: z.coerce.number().int().min(1000).default(15 * 60 * 1000),
  SMTP_HOST: z.string().default('127.0.0.1'),
  SMTP_PORT: z.coerce.number().int().min(1).max(65535).default(2525),
  SMTP_SECURE: bool.default(false),
  SMTP_USER: z.string().optional(),
  SMTP_PASS: z.string().optional(),
  /** Set for the local SMTP fake, whose certificate has expired. */
  SMTP_IGNORE_TLS: bool.default(false),
  MAIL_FROM: z.string().default('Holonaut <no-reply@holonaut.invalid>'),
  S3_ENDPOINT: z.string().url().optional(),
  S3_REGION: z.string().default('us-east-1'),
  S3_BUCKET: z.string().default('holonaut-uploads'),
  S3_ACCESS_KEY_ID: z.string().default('S3RVER'),
  S3_SECRET_ACCESS_KEY: z.string().default('S3RVER'),
  /**
   * Which reverse proxies Express believes about the client address (X-Forwarded-For): "false"
   * (default: none, the socket address counts), a hop count, or a comma list of addresses, subnets
   * or the names loopback / linklocal / uniquelocal. Set it only behind your own proxy.
   */
  TRUST_PROXY: z
    .string()
    .default('false')
    .transform((v, c): boolean | number | string[] => {
      const t = v.trim();
      if (t === '' || t === 'false' || t === '0') return false;
      if (/^[1-9]\d?$/.test(t)) return Number(t);
      const items = t.split(',').map((x) => x.trim()).filter(Boolean);
      const ok = /^(loopback|linklocal|uniquelocal|[0-9a-fA-F.:]+(\/\d{1,3})?)$/;
      const bad = items.find((x) => !ok.test(x));
      if (bad !== undefined) {
        c.addIssue({ code: 'custom', message: `"${bad}" is not false, a hop count, an address, a subnet or loopback/linklocal/uniquelocal` });
        return z.NEVER;
      }
      return items;
    }),
  /** Extra origins (comma list) allowed to send cookie-authenticated changes, besides PUBLIC_URL and the server's own host. */
  ALLOWED_ORIGINS: z
    .string()
    .default('')
    .transform((v) => v.split(',').map((x) => x.trim().replace(/\/$/, '')).filter(Boolean)),
  /** Serve the local SMTP fake's messages at /dev/mail (development only; refused in production). */
  DEV_MAILBOX: bool.default(false),
  /** Folder of the exported web app; served when it exists. */
  WEB_DIST: z.string().optional(),
  LOG_LEVEL: z.enum(['fatal', 'error', 'warn', 'info', 'debug', 'trace', 'silent']).default('info'),
  /** Simulation time budget per request, ms. */
  SIMULATION_TIMEOUT_MS: z.coerce.number().int().min(100).default(20_000),
  /** Ad-hoc simulations (POST /api/simulate) one person may have running or waiting at once. */
  SIMULATE_CONCURRENCY_PER_USER: z.coerce.number().int().min(1).default(1),
  /** Ad-hoc simulations one person may start per window. */
  SIMULATE_RATE_LIMIT: z.coerce.number().int().min(1).default(30),
  SIMULATE_RATE_WINDOW_MS: z.coerce.number().int().min(1000).default(60_000),
  /** Ad-hoc simulations allowed to wait for a worker, everyone together (more get 429). */
  SIMULATE_QUEUE_MAX: z.coerce.number().int().min(0).default(4),
  /** Worker threads for ad-hoc simulations (trainee motion and verification have their own pool). */
  SIMULATE_POOL_SIZE: z.coerce.number().int().min(1).max(16).default(1),
  /** Largest result one ad-hoc simulation may return, as samples × dofs (≈ 12 bytes of JSON each). */
  SIMULATE_MAX_SAMPLE_VALUES: z.coerce.number().int().min(1000).default(1_000_000),
  /** Background jobs one worker process runs at once (robustness chunks run in that many threads). */
  WORKER_CONCURRENCY: z.coerce.number().int().min(1).max(64).default(1),
  /**
   * A running job's heartbeat period, seconds (pg-boss minimum 10). A job whose worker stops
   * beating is retried once the supervisor next looks, so heartbeat + supervise interval + poll
   * bounds how long work held by a dead process waits (under 60 s with the defaults).
   */
  JOB_HEARTBEAT_SECONDS: z.coerce.number().int().min(10).max(600).default(20),
  /** How often the queue supervisor fails jobs whose heartbeat stopped, seconds. */
  JOB_SUPERVISE_SECONDS: z.coerce.number().int().min(1).max(600).default(10),
  /** How often a worker looks for due jobs (retries included), seconds. */
  JOB_POLL_SECONDS: z.coerce.number().min(0.5).max(60).default(2),
  /** Samples of the robustness run queued when a version is saved. */
  ROBUSTNESS_SAMPLES: z.coerce.number().int().min(10).max(20_000).default(1000),
  /** Samples per robustness chunk job; unset: a run's samples in 16 chunks of at least 25 (robustness-runs.ts). */
  ROBUSTNESS_CHUNK_SIZE: z.coerce.number().int().min(1).max(10_000).optional(),
});

export type Config = z.infer<typeof configSchema>;

/** One environment variable as Node gives it (Expo's global types widen `process.env` entries to `any`). */
export function envVar(name: string, env: NodeJS.ProcessEnv = process.env): string | undefined {
  const value: unknown = env[name];
  return typeof value === 'string' ? value : undefined;
}

/** Parses the environment; throws one message listing every bad setting. */
export function loadConfig(env: NodeJS.ProcessEnv = process.env): Config {
  const parsed = configSchema.safeParse(env);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join('.')}: ${i.message}`);
    throw new Error(`Invalid configuration:\n${lines.join('\n')}`);
  }
  if (parsed.data.NODE_ENV === 'production' && parsed.data.BCRYPT_COST < 12) {
    throw new Error('Invalid configuration:\n  BCRYPT_COST: must be at least 12 in production');
  }
  if (parsed.data.NODE_ENV === 'production' && parsed.data.DEV_MAILBOX) {
    throw new Error('Invalid configuration:\n  DEV_MAILBOX: the development mailbox is never served in production');
  }
  return parsed.data;
}

/** Base URL for links in e-mails. */
export function publicUrl(config: Config): string {
  return (config.PUBLIC_URL ?? `http://${config.HOST}:${config.PORT}`).replace(/\/$/, '');
}
