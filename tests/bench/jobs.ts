/**
 * `npm run bench:jobs [-- --json] [-- --samples N] [-- --repeats R]`: wall time of a robustness run
 * (default 1,000 samples) of a 60 s suited maneuver from enqueue to merged result, with one and then
 * two worker processes (`server/scripts/worker.ts`, WORKER_CONCURRENCY=1 each, already started and
 * idle) against a throwaway PostgreSQL. The two configurations alternate (one worker, then two,
 * R times, default 3), so a load that changes during the bench weighs on both alike: both workers
 * stay up and warm (one untimed run first), and the second is paused (SIGSTOP, only while the queue
 * is empty) for the one-worker runs and resumed a second before each two-worker run. The figures of every run must be identical (sample i is
 * seeded by (seed, i)). Prints the load average before and after, since the machine may be shared.
 * With --json the last line is {"oneWorkerS": …, "twoWorkersS": …, "ratio": …, …}.
 */
import { type ChildProcess, spawn } from 'node:child_process';
import { mkdtempSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { parseArgs } from 'node:util';

import { eq } from 'drizzle-orm';

import { createDatabase } from '../../db/client.ts';
import { runMigrations } from '../../db/migrate.ts';
import { robustnessRuns } from '../../db/schema/index.ts';
import { DEMO_PROFILES } from '../../db/seed/seed-crew-profiles.ts';
import type { AppContext } from '../../server/app-context.ts';
import { loadConfig } from '../../server/config.ts';
import { createContext } from '../../server/context.ts';
import { deriveProfile } from '../../server/crew/derive-profile.ts';
import { startJobQueue } from '../../server/jobs/job-queue.ts';
import { createRobustnessRun } from '../../server/jobs/robustness/robustness-runs.ts';
import { BUILT_IN_SUITS } from '../../server/model/suits/index.ts';
import { compileForBody, evaluateSequence } from '../../server/planning/evaluate-steps.ts';
import { robustnessSamples } from '../../server/planning/robustness.ts';
import { startLocalCluster } from '../../server/scripts/postgres-cluster.ts';
import { DEFAULT_ROBUSTNESS_MODEL } from '../../shared/contracts/robustness.ts';
import type { Primitive } from '../../shared/primitives/primitive-schemas.ts';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');
const { values } = parseArgs({ options: { json: { type: 'boolean' }, samples: { type: 'string' }, repeats: { type: 'string' }, chunk: { type: 'string' } } });
const SAMPLES = Number(values.samples ?? 1000);
const REPEATS = Number(values.repeats ?? 3);
const CHUNK = Number(values.chunk ?? 25);
const log = (s: string) => console.log(s);
const load = () => os.loadavg().map((l) => l.toFixed(2)).join(' / ');
const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));
const median = (xs: number[]) => { const s = [...xs].sort((a, b) => a - b); const m = Math.floor(s.length / 2); return s.length % 2 ? s[m] : (s[m - 1] + s[m]) / 2; };

/** The 60 s suited maneuver (invented for the benchmark): arms forward, 18 slow outward arm orbits, a pause. */
const MANEUVER: Primitive[] = [
  { kind: 'pose_shift', posture: 'arms_forward', durationS: 1.5 },
  { kind: 'arm_orbit', arms: 'both', centre: 'forward', halfAngleDeg: 20, travel: 'outward', cycles: 18, periodS: 3 },
  { kind: 'pause', durationS: 3 },
];

function startWorker(env: NodeJS.ProcessEnv, name: string): Promise<ChildProcess> {
  const child = spawn(process.execPath, ['--import', 'tsx', path.join(root, 'server/scripts/worker.ts')], {
    cwd: root, env: { ...env, WORKER_NAME: name }, stdio: ['ignore', 'pipe', 'pipe'],
  });
  let out = '';
  return new Promise((resolve, reject) => {
    const onData = (d: Buffer) => {
      out += d.toString();
      if (out.includes('Ready:')) resolve(child);
      const ran = /\[[^\]]+\] Jobs run: [^\n]*/.exec(d.toString());
      if (ran) log(`  ${ran[0]}`);
    };
    child.stdout.on("data", onData);
    child.stderr.on('data', onData);
    child.on('exit', (code) => reject(new Error(`${name} exited (${code}): ${out}`)));
  });
}

function stopWorker(child: ChildProcess): Promise<void> {
  return new Promise((resolve) => {
    if (child.exitCode !== null) return resolve();
    child.once('exit', () => resolve());
    child.kill('SIGTERM');
  });
}

async function main() {
  const loadBefore = load();
  log(`Load average at start (1/5/15 min): ${loadBefore} on ${os.cpus().length} cores`);
  const dir = mkdtempSync(path.join(os.tmpdir(), 'hn-bench-jobs-'));
  const cluster = await startLocalCluster({ dir, database: 'holonaut', throwaway: true, log: () => undefined });
  const workers: ChildProcess[] = [];
  try {
    const { db, pool } = createDatabase(cluster.url);
    await runMigrations(db);
    await pool.end();
    const env: NodeJS.ProcessEnv = {
      ...process.env, NODE_ENV: 'production', DATABASE_URL: cluster.url, JWT_SECRET: 'bench-secret-that-is-long-enough-0123456789',
      LOG_LEVEL: 'warn', WORKER_CONCURRENCY: '1', JOB_POLL_SECONDS: '2',
    };
    const config = loadConfig(env);
    const ctx = createContext(config) as AppContext & { close(): Promise<void> };
    // This process only enqueues (like the API process).
    const queue = await startJobQueue(ctx, { worker: false, reconcile: false });

    const kettle = DEMO_PROFILES.kettle[0];
    const suit = BUILT_IN_SUITS.find((s) => s.id === 'pressurised-suit')!;
    const body = deriveProfile({ lengths: {}, gear: [], ...kettle.inputs } as Parameters<typeof deriveProfile>[0], suit, 'bench suited man').body;
    const sequence = compileForBody(body, MANEUVER);
    const nominal = evaluateSequence(body, sequence, [1, 0, 0, 0]);
    const a = nominal.result.final.attitude;
    const target: [number, number, number, number] = [a.w, a.x, a.y, a.z];
    log(`Maneuver: suited demo crew member (1.83 m, 86 kg, pressurised suit), ${nominal.durationS.toFixed(1)} s of steps; ${SAMPLES} samples in chunks of ${CHUNK}, seed 1`);

    const timeRun = async (): Promise<{ s: number; figures: unknown }> => {
      const runId = await createRobustnessRun(ctx.db, { body, sequence, target, toleranceDeg: 2, samples: SAMPLES, seed: 1, chunkSize: CHUNK });
      const t0 = performance.now();
      await queue.enqueueRobustness!(runId);
      for (;;) {
        const [r] = await ctx.db.select({ state: robustnessRuns.state, figures: robustnessRuns.figures, error: robustnessRuns.error }).from(robustnessRuns).where(eq(robustnessRuns.id, runId));
        if (r.state === 'done') return { s: (performance.now() - t0) / 1000, figures: r.figures };
        if (r.state !== 'queued' && r.state !== 'running') throw new Error(`run ${r.state}: ${r.error}`);
        await new Promise((res) => setTimeout(res, 20));
      }
    };

    // Reference: the same samples in this process, one thread, no queue (the work the workers share).
    const t0 = performance.now();
    robustnessSamples({ body, sequence, target, toleranceDeg: 2, seed: 1, model: DEFAULT_ROBUSTNESS_MODEL }, 0, SAMPLES);
    const directS = (performance.now() - t0) / 1000;
    log(`  one thread in this process, no queue: ${directS.toFixed(2)} s (load ${load()})`);

    workers.push(await startWorker(env, 'bench worker 1'));
    const second = await startWorker(env, 'bench worker 2');
    workers.push(second);
    await sleep(1000);
    const warm = await timeRun();
    log(`  untimed warm-up run, two workers: ${warm.s.toFixed(2)} s`);
    const oneTimes: number[] = [], twoTimes: number[] = [];
    let oneFigures: unknown = null, twoFigures: unknown = null;
    for (let i = 0; i < REPEATS; i++) {
      // The queue is empty here, so the paused worker holds no job.
      second.kill('SIGSTOP');
      await sleep(500);
      const a = await timeRun();
      oneTimes.push(a.s);
      oneFigures = a.figures;
      log(`  one worker process, run ${i + 1}: ${a.s.toFixed(2)} s (load ${load()})`);
      second.kill('SIGCONT');
      await sleep(1000);
      const b = await timeRun();
      twoTimes.push(b.s);
      twoFigures = b.figures;
      log(`  two worker processes, run ${i + 1}: ${b.s.toFixed(2)} s (load ${load()})`);
    }
    // Stopped here so each prints how many jobs it ran (both took chunks).
    await Promise.all(workers.splice(0).map(stopWorker));
    const one = { median: median(oneTimes), times: oneTimes, figures: oneFigures };
    const two = { median: median(twoTimes), times: twoTimes, figures: twoFigures };
    const same = JSON.stringify(one.figures) === JSON.stringify(two.figures) && JSON.stringify(warm.figures) === JSON.stringify(one.figures);
    if (!same) throw new Error('figures differ between one and two workers: the split changed the result');
    const f = one.figures as { openLoopP95Deg: number; feedbackP95Deg: number };
    const ratio = one.median / two.median;
    const loadAfter = load();
    log('');
    log(`| workers | wall time, enqueue → merged result (median of ${REPEATS}) | ratio |`);
    log('|---|---|---|');
    log(`| 1 | ${one.median.toFixed(2)} s | 1.00 (queue overhead vs one thread without a queue, measured once: ${(one.median / directS).toFixed(2)}×) |`);
    log(`| 2 | ${two.median.toFixed(2)} s | ${ratio.toFixed(2)}× faster |`);
    log(`Identical figures with one and two workers: yes (open-loop p95 ${f.openLoopP95Deg.toFixed(2)}°, feedback p95 ${f.feedbackP95Deg.toFixed(2)}°).`);
    log(`Load average (1/5/15 min) before ${loadBefore}, after ${loadAfter}; ${os.cpus().length} cores shared with whatever else runs.`);
    await queue.stop();
    await ctx.close();
    if (values.json) {
      console.log(JSON.stringify({
        oneWorkerS: Number(one.median.toFixed(3)), twoWorkersS: Number(two.median.toFixed(3)), ratio: Number(ratio.toFixed(3)),
        directOneThreadS: Number(directS.toFixed(3)), samples: SAMPLES, chunkSize: CHUNK, repeats: REPEATS, oneWorkerRunsS: one.times, twoWorkersRunsS: two.times,
        loadBefore, loadAfter,
      }));
    }
  } finally {
    await Promise.all(workers.map(stopWorker));
    cluster.stop();
  }
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
