/**
 * `npm run worker`: a worker-only process. It consumes every job queue (planning, re-verification,
 * robustness chunks) from the PostgreSQL in DATABASE_URL, configured by the same validated
 * environment as the API server (server/config.ts); WORKER_CONCURRENCY sets how many jobs it runs at
 * once. No HTTP, no web build, no seed. It refuses to start on a database with pending migrations
 * unless given `--migrate` (the API server migrates on its start). Start as many as you like, on this
 * machine or others: they share the work through the queue. SIGINT/SIGTERM stop it gracefully;
 * a worker killed outright loses nothing (its jobs are retried once their heartbeat stops).
 */
import { migrationsApplied, runMigrations } from '../../db/migrate.ts';
import { envVar, loadConfig } from '../config.ts';
import { createContext } from '../context.ts';
import { type RunningJobQueue, startJobQueue } from '../jobs/job-queue.ts';
import { ALL_QUEUES } from '../jobs/queue-names.ts';

const name = envVar('WORKER_NAME') ?? `worker ${process.pid}`;
const log = (s: string) => console.log(`[${name}] ${s}`);

async function main() {
  const args = process.argv.slice(2);
  const unknown = args.filter((a) => a !== '--migrate');
  if (unknown.length) {
    console.error(`Unknown option ${unknown[0]}. Usage: npm run worker [-- --migrate]`);
    process.exit(2);
  }
  let config;
  try {
    config = loadConfig();
  } catch (err) {
    console.error((err as Error).message);
    process.exit(2);
  }
  const ctx = createContext(config);
  let jobs: RunningJobQueue | undefined;
  let stopping = false;
  const stop = async (code: number) => {
    if (stopping) return;
    stopping = true;
    log('Stopping: finishing the jobs in hand (up to 10 s)…');
    await jobs?.stop().catch((err: unknown) => console.error(err));
    if (jobs) log(`Jobs run: ${Object.entries(jobs.jobsRun).map(([q, n]) => `${q} ${n}`).join(', ')}.`);
    await ctx.close().catch(() => undefined);
    log('Stopped.');
    process.exit(code);
  };
  process.on('SIGINT', () => void stop(0));
  process.on('SIGTERM', () => void stop(0));
  try {
    if (!(await migrationsApplied(ctx.db))) {
      if (!args.includes('--migrate')) {
        console.error(`[${name}] The database is missing migrations. ` +
          'Start the API server (it migrates), or run this worker once with `npm run worker -- --migrate`.');
        await ctx.close();
        process.exit(3);
      }
      await runMigrations(ctx.db);
      log('Applied the pending migrations.');
    }
    jobs = await startJobQueue(ctx, { worker: true });
    log(`Ready: ${config.WORKER_CONCURRENCY} job(s) at once from ${ALL_QUEUES.join(', ')}; heartbeat ${config.JOB_HEARTBEAT_SECONDS} s.`);
  } catch (err) {
    console.error(`[${name}] Start failed: ${(err as Error).message}`);
    await stop(1);
  }
}

void main();
