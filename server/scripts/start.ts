/**
 * `npm start`: runs the whole product on this machine with its demo data.
 * Starts PostgreSQL (installing Debian's package when missing), the SMTP and S3 fakes, migrates,
 * seeds the demo scenario, builds the web app when needed and serves it on 127.0.0.1 from the API
 * process, and runs one worker process (the job queues) beside it. Ctrl-C stops both.
 */
import { writeFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

import { DEMO_PASSWORD, DEMO_PEOPLE } from '../../db/seed/demo-people.ts';
import { ROLE_LABELS } from '../../shared/contracts/roles.ts';
import { envVar, loadConfig } from '../config.ts';
import { serve } from './serve.ts';
import { startLocalServices } from './services.ts';
import { ensureWebBuild } from './web-build.ts';
import { startWorkerProcess, type WorkerProcess } from './worker-process.ts';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');
const dataDir = envVar('HOLONAUT_DATA_DIR') ?? path.join(root, '.data');
const log = (s: string) => console.log(`[holonaut] ${s}`);

async function main() {
  const webDist = path.join(root, 'dist', 'web');
  if (process.env.SKIP_WEB_BUILD !== '1') ensureWebBuild(root, webDist, log);
  const services = await startLocalServices(dataDir, { log, throwaway: process.env.HOLONAUT_THROWAWAY === '1' });
  let stopping = false;
  const stopAll = async (code: number) => {
    if (stopping) return;
    stopping = true;
    log('Shutting down…');
    await worker?.stop().catch(() => undefined);
    await server?.close().catch(() => undefined);
    await services.stop();
    process.exit(code);
  };
  process.on('SIGINT', () => void stopAll(0));
  process.on('SIGTERM', () => void stopAll(0));

  let server: Awaited<ReturnType<typeof serve>> | undefined;
  let worker: WorkerProcess | undefined;
  try {
    const env = { WEB_DIST: webDist, ...process.env, ...services.env };
    const config = loadConfig(env);
    server = await serve(config, { seed: true, devMailbox: services.mail.messages });
    log(server.seeded ? 'Seeded the demo scenario.' : 'Database already has data; demo seed skipped.');
    log(`API process (pid ${process.pid}) is running at ${server.url}`);
    // The worker starts after the API migrated the database (workers never migrate unasked).
    worker = startWorkerProcess(root, env, { name: 'worker 1', log });
    const workerEnv = path.join(dataDir, 'worker.env');
    writeFileSync(workerEnv, Object.entries(services.env).map(([k, v]) => `${k}=${v}`).join('\n') + '\n', { mode: 0o600 });
    log(`More worker processes against this database: set -a; . ${workerEnv}; set +a; npm run worker`);
    if (config.DEV_MAILBOX) log(`Development mailbox (invitation links): ${server.url}/dev/mail`);
    log(`Demo accounts (password for all: ${DEMO_PASSWORD}):`);
    for (const p of DEMO_PEOPLE) log(`  ${ROLE_LABELS[p.role].padEnd(15)} ${p.email}`);
    log('Planning and training aid only: follow flight rules and certified procedures.');
  } catch (err) {
    console.error(`[holonaut] Start failed: ${(err as Error).message}`);
    await stopAll(1);
  }
}

void main();
