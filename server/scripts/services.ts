import { randomBytes } from 'node:crypto';
import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import path from 'node:path';

import { envVar } from '../config.ts';
import { type SmtpFake, startSmtpFake } from '../mail/smtp-fake.ts';
import { type S3Fake, startS3Fake } from '../storage/s3-fake.ts';
import { type LocalCluster, startLocalCluster } from './postgres-cluster.ts';

/** The local services the product needs on a fresh machine, started under one data folder. */
export interface LocalServices {
  env: Record<string, string>;
  mail: SmtpFake;
  stop(): Promise<void>;
}

/**
 * Starts PostgreSQL (unless DATABASE_URL is given), the SMTP fake and the S3 fake under `dataDir`
 * and returns the environment that points the server at them.
 */
export async function startLocalServices(dataDir: string, opts: { throwaway?: boolean; log?: (s: string) => void } = {}): Promise<LocalServices> {
  const log = opts.log ?? ((s: string) => console.error(s));
  mkdirSync(dataDir, { recursive: true });
  const env: Record<string, string> = {};

  let cluster: LocalCluster | null = null;
  const databaseUrl = envVar('DATABASE_URL');
  if (databaseUrl) {
    env.DATABASE_URL = databaseUrl;
    log('Using DATABASE_URL from the environment.');
  } else {
    cluster = await startLocalCluster({ dir: path.join(dataDir, 'postgres'), database: 'holonaut', throwaway: opts.throwaway, log });
    env.DATABASE_URL = cluster.url;
    log(`PostgreSQL on 127.0.0.1:${cluster.port} (data in ${path.join(dataDir, 'postgres')}).`);
  }

  const mail = await startSmtpFake();
  env.SMTP_HOST = '127.0.0.1';
  env.SMTP_PORT = String(mail.port);
  env.SMTP_IGNORE_TLS = 'true';
  // The fake's messages are readable at /dev/mail: only in this local development mode.
  if (process.env.NODE_ENV !== 'production' && process.env.DEV_MAILBOX === undefined) env.DEV_MAILBOX = '1';
  log(`SMTP fake on 127.0.0.1:${mail.port}.`);

  let s3: S3Fake | null = null;
  if (!process.env.S3_ENDPOINT) {
    s3 = await startS3Fake(path.join(dataDir, 's3'));
    env.S3_ENDPOINT = s3.endpoint;
    log(`S3 fake on ${s3.endpoint} (objects in ${path.join(dataDir, 's3')}).`);
  }

  // A stable session key per data folder, so restarts keep people signed in.
  const secretFile = path.join(dataDir, 'jwt-secret');
  if (!process.env.JWT_SECRET) {
    if (!existsSync(secretFile)) writeFileSync(secretFile, randomBytes(48).toString('base64url'), { mode: 0o600 });
    env.JWT_SECRET = readFileSync(secretFile, 'utf8').trim();
  }

  return {
    env,
    mail,
    stop: async () => {
      await mail.stop().catch(() => undefined);
      await s3?.stop().catch(() => undefined);
      cluster?.stop();
    },
  };
}
