/**
 * `npm run bench:jobs [-- --json] [-- --samples N] [-- --repeats R] [-- --chunk S] [-- --gc] [-- --node-flags "…"]`:
 * wall time of a robustness run (default 1,000 samples, split as the product splits it unless
 * --chunk) from enqueue to merged result, with one and then two worker processes
 * (`server/scripts/worker.ts`, WORKER_CONCURRENCY=1 each, already started and idle) against a
 * throwaway PostgreSQL, for two maneuvers in turn: the standard one (the demo's planner-made suited
 * quarter turn, whose figures are the goal's) and a light one (one arm-orbit phase, a quarter of the
 * computing per sample, so the queue's fixed cost per run shows).
 * The two configurations alternate (one worker, then two, R times, default 5), so a load that changes
 * during the bench weighs on both alike: both workers stay up and warm (two untimed runs of each
 * maneuver first), and for each one-worker run one of them is paused (SIGSTOP, only while the queue
 * is empty; the first worker in odd runs, the second in even ones, so that a process whose compute
 * thread happens to run slower weighs on both columns) and resumed a second before the next
 * two-worker run. The figures of every run must be identical (sample i is seeded by (seed, i)).
 * Since the machine may be shared, wall time alone says little: the bench prints the load average
 * before and after, and per run the CPU time of each worker process split by thread (from
 * /proc/<pid>/task: the main thread, i.e. the queue's own work; the compute thread, the busiest other
 * one; the rest, V8's collector and compiler helpers and libuv), of PostgreSQL, and of the bench
 * process itself (it polls the run's state every 250 ms; the wall time ends at the last merge's own
 * timestamp), and from the workers' per-chunk timing lines (debug level) when each took its first
 * chunk, how long its compute thread computed, claimed, merged and sat idle. `--gc` starts the
 * workers with V8's --trace-gc and counts their collections per run; `--node-flags` passes flags to
 * the worker processes (to try V8 settings; the printed figures say which were used).
 * With --json the last line is {"oneWorkerS": …, "twoWorkersS": …, "ratio": …, …, "light": {…}}.
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
import { demoCurrentBody } from '../../db/seed/plan-demo-maneuvers.ts';
import { loadPlannedManeuvers, plannedTarget } from '../../db/seed/planned-maneuvers.ts';
import type { AppContext } from '../../server/app-context.ts';
import { loadConfig } from '../../server/config.ts';
import { createContext } from '../../server/context.ts';
import { startJobQueue } from '../../server/jobs/job-queue.ts';
import { chunkRanges, createRobustnessRun } from '../../server/jobs/robustness/robustness-runs.ts';
import { targetQuat } from '../../server/maneuvers/target-attitude.ts';
import { compileForBody, evaluateSequence } from '../../server/planning/evaluate-steps.ts';
import { robustnessSamples } from '../../server/planning/robustness.ts';
import { startLocalCluster } from '../../server/scripts/postgres-cluster.ts';
import type { Body } from '../../shared/contracts/body.ts';
import { DEFAULT_ROBUSTNESS_MODEL } from '../../shared/contracts/robustness.ts';
import type { Sequence } from '../../shared/contracts/sequence.ts';
import type { Quat } from '../../shared/math/quaternion.ts';
import type { Primitive } from '../../shared/primitives/primitive-schemas.ts';
import { clusterCpuS, mainThreadCpuS, processCpuS, threadCpuS } from './process-cpu.ts';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');
const { values } = parseArgs({
  options: { json: { type: 'boolean' }, samples: { type: 'string' }, repeats: { type: 'string' }, chunk: { type: 'string' }, gc: { type: 'boolean' }, 'node-flags': { type: 'string' } },
});
const NODE_FLAGS = [...(values['node-flags']?.split(/\s+/).filter(Boolean) ?? []), ...(values.gc ? ['--trace-gc'] : [])];
const SAMPLES = Number(values.samples ?? 1000);
const REPEATS = Number(values.repeats ?? 5);
// Unset: the product's default split (chunks that shrink toward the end of the run).
const CHUNK = values.chunk ? Number(values.chunk) : undefined;
const RANGES = chunkRanges(SAMPLES, CHUNK);
const SPLIT = `${RANGES.length} chunks of ${[...new Set(RANGES.map((r) => r.to - r.from))].join('/')}`;
const log = (s: string) => console.log(s);
const load = () => os.loadavg().map((l) => l.toFixed(2)).join(' / ');
/**
 * How often the bench looks at the run's state. The wall time is taken from the last merge's own
 * timestamp, so a slower poll costs no accuracy and keeps the bench's queries (its CPU and
 * PostgreSQL's) from competing with the workers.
 */
const POLL_MS = 250;
const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));
const median = (xs: number[]) => { const s = [...xs].sort((a, b) => a - b); const m = Math.floor(s.length / 2); return s.length % 2 ? s[m] : (s[m - 1] + s[m]) / 2; };

/** A maneuver the bench runs: its body, compiled steps and target. */
interface BenchCase { key: 'standard' | 'light'; title: string; body: Body; sequence: Sequence; target: Quat; durationS: number }

/**
 * The standard maneuver: the demo's planner-made suited quarter turn (db/seed/planned-maneuvers.json,
 * four arm and leg phases with their pose shifts, on the suited demo crew member's current body, toward
 * its own target: yaw 90°, tolerance 2°), the kind of maneuver whose robustness the product runs.
 */
function standardCase(): BenchCase {
  const m = loadPlannedManeuvers().find((x) => x.name === 'Quarter turn to the left in the suit');
  if (!m) throw new Error('the planned demo maneuver "Quarter turn to the left in the suit" is missing from db/seed/planned-maneuvers.json');
  const body = demoCurrentBody(m.crew);
  const sequence = compileForBody(body, m.primitives);
  const durationS = evaluateSequence(body, sequence, [1, 0, 0, 0]).durationS;
  const target = targetQuat(plannedTarget(m));
  return { key: 'standard', title: `${m.name} (planner-made demo maneuver, suited crew member, ${m.primitives.length} steps)`, body, sequence, target, durationS };
}

/**
 * A light maneuver (invented for the benchmark): arms forward, 18 slow outward arm orbits, a pause,
 * toward its own nominal end. One phase, so a sample costs about a quarter of the standard one's: the
 * queue's fixed cost per run weighs four times as much.
 */
function lightCase(): BenchCase {
  const body = demoCurrentBody('kettle');
  const steps: Primitive[] = [
    { kind: 'pose_shift', posture: 'arms_forward', durationS: 1.5 },
    { kind: 'arm_orbit', arms: 'both', centre: 'forward', halfAngleDeg: 20, travel: 'outward', cycles: 18, periodS: 3 },
    { kind: 'pause', durationS: 3 },
  ];
  const sequence = compileForBody(body, steps);
  const nominal = evaluateSequence(body, sequence, [1, 0, 0, 0]);
  const a = nominal.result.final.attitude;
  return { key: 'light', title: 'three-step arm-orbit maneuver (one phase, suited crew member)', body, sequence, target: [a.w, a.x, a.y, a.z], durationS: nominal.durationS };
}

/** Per-chunk timing a worker logs at debug level (robustness-runs.ts), tagged with the worker's name. */
interface ChunkTiming { worker: string; runId: string; chunk: number; fetchedAt: number; claimMs: number; waitMs: number; computeMs: number; mergeMs: number; doneAt: number }
const timings: ChunkTiming[] = [];
/** A collection a worker reported (--trace-gc): when the line arrived, its kind and pause. */
interface GcEvent { worker: string; at: number; kind: 'scavenge' | 'mark-compact' | 'other'; pauseMs: number }
const gcEvents: GcEvent[] = [];
// e.g. "[123:0x5f…]   841 ms: Scavenge 6.1 (7.3) -> 5.2 (7.8) MB, 0.61 / 0.00 ms  (average mu = …"
const GC_LINE = /^\[\d+:0x[0-9a-f]+\]\s+\d+ ms: (Scavenge|Mark-Compact|Mark-sweep|Minor Mark-Sweep|[A-Za-z-]+)[^,]*, ([\d.]+) \/ /;

function startWorker(env: NodeJS.ProcessEnv, name: string): Promise<ChildProcess> {
  const child = spawn(process.execPath, [...NODE_FLAGS, '--import', 'tsx', path.join(root, 'server/scripts/worker.ts')], {
    cwd: root, env: { ...env, WORKER_NAME: name }, stdio: ['ignore', 'pipe', 'pipe'],
  });
  let out = '';
  let partial = '';
  return new Promise((resolve, reject) => {
    const onData = (d: Buffer) => {
      out += d.toString();
      if (out.includes('Ready:')) { out = ''; resolve(child); }
      const lines = (partial + d.toString()).split('\n');
      partial = lines.pop() ?? '';
      for (const line of lines) {
        if (line.startsWith('{') && line.includes('"chunkTiming"')) {
          timings.push({ worker: name, ...(JSON.parse(line) as { chunkTiming: Omit<ChunkTiming, 'worker'> }).chunkTiming });
        }
        const gc = GC_LINE.exec(line);
        if (gc) {
          const kind = gc[1] === 'Scavenge' ? 'scavenge' : /^Mark-(Compact|sweep)$/.test(gc[1]) ? 'mark-compact' : 'other';
          gcEvents.push({ worker: name, at: Date.now(), kind, pauseMs: Number(gc[2]) });
        }
        const ran = /\[[^\]]+\] Jobs run: .*/.exec(line);
        if (ran) log(`  ${ran[0]}`);
      }
    };
    child.stdout.on('data', onData);
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
  const dataDir = path.join(dir, 'data');
  const workers: ChildProcess[] = [];
  try {
    const { db, pool } = createDatabase(cluster.url);
    await runMigrations(db);
    await pool.end();
    const env: NodeJS.ProcessEnv = {
      ...process.env, NODE_ENV: 'production', DATABASE_URL: cluster.url, JWT_SECRET: 'bench-secret-that-is-long-enough-0123456789',
      LOG_LEVEL: 'debug', WORKER_CONCURRENCY: '1', JOB_POLL_SECONDS: '2',
    };
    const config = loadConfig(env);
    const ctx = createContext(config) as AppContext & { close(): Promise<void> };
    // This process only enqueues (like the API process).
    const queue = await startJobQueue(ctx, { worker: false, reconcile: false });

    if (NODE_FLAGS.length) log(`Worker processes started with node flags: ${NODE_FLAGS.join(' ')}`);
    const cases = [standardCase(), lightCase()];

    /** One timed run: wall time enqueue → merged result, CPU of each worker process and of PostgreSQL meanwhile. */
    interface Timed {
      s: number; figures: unknown; workerCpuS: number[]; mainThreadCpuS: number[]; computeThreadCpuS: number[]; helperThreadsCpuS: number[];
      postgresCpuS: number; benchCpuS: number; runId: string; t0: number; t1: number;
      /** The workers that were running (not paused) during the run. */
      ran: string[];
    }
    const cpuNow = () => ({
      workers: workers.map((w) => processCpuS(w.pid!)), mains: workers.map((w) => mainThreadCpuS(w.pid!)), threads: workers.map((w) => threadCpuS(w.pid!)),
      pg: clusterCpuS(dataDir), bench: process.cpuUsage(),
    });
    /** A worker's thread CPU in a run: the busiest thread besides the main one is its compute thread, the others are helpers. */
    const splitThreads = (pid: number, before: Map<number, number>, after: Map<number, number>) => {
      const deltas = [...after].filter(([tid]) => tid !== pid).map(([tid, c]) => c - (before.get(tid) ?? 0)).sort((x, y) => y - x);
      return { compute: deltas[0] ?? 0, helpers: deltas.slice(1).reduce((x, c) => x + c, 0) };
    };
    const timeRun = async (c: BenchCase, ran: string[]): Promise<Timed> => {
      const runId = await createRobustnessRun(ctx.db, { body: c.body, sequence: c.sequence, target: c.target, toleranceDeg: 2, samples: SAMPLES, seed: 1, chunkSize: CHUNK });
      const before = cpuNow();
      const t0Epoch = Date.now();
      const t0 = performance.now();
      await queue.enqueueRobustness!(runId);
      for (;;) {
        const [r] = await ctx.db.select({ state: robustnessRuns.state, error: robustnessRuns.error }).from(robustnessRuns).where(eq(robustnessRuns.id, runId));
        if (r.state === 'done') break;
        if (r.state !== 'queued' && r.state !== 'running') throw new Error(`run ${r.state}: ${r.error}`);
        await sleep(POLL_MS);
      }
      const seenS = (performance.now() - t0) / 1000;
      // The last chunk's timing line is written just after its merge (and the figures) commit.
      await sleep(150);
      // The run ended when its last merge committed (that worker's clock is this machine's); polling only notices it.
      const lastDone = Math.max(...timings.filter((x) => x.runId === runId).map((x) => x.doneAt));
      const s = Number.isFinite(lastDone) && lastDone >= t0Epoch ? Math.min(seenS, (lastDone - t0Epoch) / 1000) : seenS;
      const after = cpuNow();
      const [r] = await ctx.db.select({ figures: robustnessRuns.figures }).from(robustnessRuns).where(eq(robustnessRuns.id, runId));
      const bench = process.cpuUsage(before.bench);
      const split = workers.map((w, i) => splitThreads(w.pid!, before.threads[i], after.threads[i]));
      return {
        s, figures: r.figures, runId, t0: t0Epoch, t1: Date.now(), ran,
        workerCpuS: after.workers.map((c, i) => c - before.workers[i]), mainThreadCpuS: after.mains.map((c, i) => c - before.mains[i]),
        computeThreadCpuS: split.map((x) => x.compute), helperThreadsCpuS: split.map((x) => x.helpers),
        postgresCpuS: after.pg - before.pg, benchCpuS: (bench.user + bench.system) / 1e6,
      };
    };
    /** Where a worker's time went in one run, from its per-chunk timing lines (debug level). */
    const breakdown = (run: Timed, worker: string) => {
      const mine = timings.filter((t) => t.runId === run.runId && t.worker === worker);
      if (!mine.length) return { chunks: 0, firstStartMs: null, computeS: 0, claimS: 0, mergeS: 0, waitS: 0, idleS: run.s };
      const sum = (k: 'computeMs' | 'claimMs' | 'mergeMs' | 'waitMs') => mine.reduce((x, t) => x + t[k], 0) / 1000;
      return {
        chunks: mine.length, firstStartMs: Math.min(...mine.map((t) => t.fetchedAt)) - run.t0,
        computeS: sum('computeMs'), claimS: sum('claimMs'), mergeS: sum('mergeMs'), waitS: sum('waitMs'),
        // Time this worker's thread computed nothing between enqueue and the merged result.
        idleS: run.s - sum('computeMs'),
      };
    };
    /** Collections a worker reported during a run (--gc). */
    const gcOf = (run: Timed, worker: string) => {
      const mine = gcEvents.filter((e) => e.worker === worker && e.at >= run.t0 && e.at <= run.t1);
      return { scavenges: mine.filter((e) => e.kind === 'scavenge').length, markCompacts: mine.filter((e) => e.kind === 'mark-compact').length, pauseMs: mine.reduce((x, e) => x + e.pauseMs, 0) };
    };
    /** The merge that completed the run (it also computed and stored the figures), ms. */
    const lastMergeMs = (run: Timed) => timings.filter((x) => x.runId === run.runId).reduce((last, x) => (x.doneAt >= last.doneAt ? x : last), { doneAt: -Infinity, mergeMs: NaN }).mergeMs;
    const describe = (run: Timed, names: string[]) => names.map((n, i) => {
      const b = breakdown(run, n);
      const g = gcOf(run, n);
      const gc = values.gc ? `, GC ${g.scavenges} scavenges + ${g.markCompacts} mark-compacts (${g.pauseMs.toFixed(0)} ms paused)` : '';
      const cpu = `CPU ${run.workerCpuS[i].toFixed(2)} s (main thread ${run.mainThreadCpuS[i].toFixed(2)} s, compute thread ${run.computeThreadCpuS[i].toFixed(2)} s, other threads ${run.helperThreadsCpuS[i].toFixed(2)} s)${gc}`;
      if (!b.chunks) return `${n}: no chunks, ${cpu}`;
      return `${n}: ${b.chunks} chunks, first ${b.firstStartMs} ms after enqueue, computing ${b.computeS.toFixed(2)} s, claim ${b.claimS.toFixed(3)} s, merge ${b.mergeS.toFixed(3)} s, thread idle ${b.idleS.toFixed(2)} s, ${cpu}`;
    }).join('; ') + `; last merge (with the figures) ${lastMergeMs(run).toFixed(0)} ms; PostgreSQL CPU ${run.postgresCpuS.toFixed(2)} s; bench process CPU ${run.benchCpuS.toFixed(2)} s`;

    /** The same samples in this process, one thread, no queue (the work the workers share); measured once, cold. */
    const direct = (c: BenchCase) => {
      const cpu0 = process.cpuUsage();
      const t0 = performance.now();
      robustnessSamples({ body: c.body, sequence: c.sequence, target: c.target, toleranceDeg: 2, seed: 1, model: DEFAULT_ROBUSTNESS_MODEL }, 0, SAMPLES);
      const cpu1 = process.cpuUsage(cpu0);
      return { s: (performance.now() - t0) / 1000, cpuS: (cpu1.user + cpu1.system) / 1e6 };
    };
    const directs = cases.map((c) => {
      const d = direct(c);
      log(`${c.title}: ${c.durationS.toFixed(1)} s of steps; ${SAMPLES} samples in ${SPLIT}, seed 1. One thread in this process, no queue: ${d.s.toFixed(2)} s, CPU ${d.cpuS.toFixed(2)} s (load ${load()})`);
      return d;
    });

    const both = ['bench worker 1', 'bench worker 2'];
    for (const name of both) workers.push(await startWorker(env, name));
    await sleep(1000);

    /** Warm-up and alternating timed runs of one maneuver; its figures. */
    const measure = async (c: BenchCase, d: { s: number; cpuS: number }) => {
      log('');
      log(`${c.title}:`);
      // Two untimed runs: a compute thread's code settles (V8 tiers it up) only after about a thousand
      // samples, and each worker gets about half of a two-worker run.
      const warmFirst = await timeRun(c, both);
      const warm = await timeRun(c, both);
      log(`  untimed warm-up runs, two workers: ${warmFirst.s.toFixed(2)} s, ${warm.s.toFixed(2)} s`);
      const ones: Timed[] = [], twos: Timed[] = [];
      for (let i = 0; i < REPEATS; i++) {
        // The one-worker runs alternate between the two processes, so that a process whose compute
        // thread happens to run slower weighs on both columns alike.
        // The queue is empty here, so the paused worker holds no job.
        const alone = i % 2, paused = workers[1 - alone];
        paused.kill('SIGSTOP');
        await sleep(500);
        const a = await timeRun(c, [both[alone]]);
        ones.push(a);
        log(`  one worker process (${both[alone]}), run ${i + 1}: ${a.s.toFixed(2)} s (load ${load()}); ${describe(a, a.ran)}`);
        paused.kill('SIGCONT');
        await sleep(1000);
        const b = await timeRun(c, both);
        twos.push(b);
        log(`  two worker processes, run ${i + 1}: ${b.s.toFixed(2)} s (load ${load()}); ${describe(b, both)}`);
      }
      const sameFigures = [warmFirst, warm, ...ones, ...twos].every((r) => JSON.stringify(r.figures) === JSON.stringify(warm.figures));
      if (!sameFigures) throw new Error(`${c.title}: figures differ between runs: the split changed the result`);
      const f = warm.figures as { openLoopP95Deg: number; feedbackP95Deg: number };
      const one = median(ones.map((r) => r.s));
      const two = median(twos.map((r) => r.s));
      const ratio = one / two;
      const workerCpu = (runs: Timed[]) => median(runs.map((r) => r.workerCpuS.reduce((x, y) => x + y, 0)));
      // The queue's own CPU in the workers: their main threads (the compute threads do only the samples).
      const mainCpu = (runs: Timed[]) => median(runs.map((r) => r.mainThreadCpuS.reduce((x, y) => x + y, 0)));
      const pgCpu = (runs: Timed[]) => median(runs.map((r) => r.postgresCpuS));
      const computeCpu = (runs: Timed[]) => median(runs.map((r) => r.computeThreadCpuS.reduce((x, y) => x + y, 0)));
      const helperCpu = (runs: Timed[]) => median(runs.map((r) => r.helperThreadsCpuS.reduce((x, y) => x + y, 0)));
      const benchCpu = (runs: Timed[]) => median(runs.map((r) => r.benchCpuS));
      // All the CPU a run cost on this machine: the workers, PostgreSQL and the bench's own polling.
      const totalCpu = (runs: Timed[]) => median(runs.map((r) => r.workerCpuS.reduce((x, y) => x + y, 0) + r.postgresCpuS + r.benchCpuS));
      const gcCount = (runs: Timed[]) => median(runs.map((r) => r.ran.reduce((x, n) => { const g = gcOf(r, n); return x + g.scavenges + g.markCompacts; }, 0)));
      // Thread idle per worker, summed over the workers that ran (the second is paused in one-worker runs).
      const idle = (runs: Timed[]) => median(runs.map((r) => r.ran.reduce((x, n) => x + breakdown(r, n).idleS, 0)));
      log('');
      log(`| workers | wall time, enqueue → merged result (median of ${REPEATS}) | ratio | worker CPU (main / compute / other threads) | PostgreSQL CPU | all CPU of a run | compute threads idle |`);
      log('|---|---|---|---|---|---|---|');
      const row = (runs: Timed[]) =>
        `${workerCpu(runs).toFixed(2)} s (${mainCpu(runs).toFixed(2)} / ${computeCpu(runs).toFixed(2)} / ${helperCpu(runs).toFixed(2)} s) | ${pgCpu(runs).toFixed(2)} s | ${totalCpu(runs).toFixed(2)} s | ${idle(runs).toFixed(2)} s |`;
      log(`| 1 | ${one.toFixed(2)} s | 1.00 | ${row(ones)}`);
      log(`| 2 | ${two.toFixed(2)} s | ${ratio.toFixed(2)}× faster | ${row(twos)}`);
      if (values.gc) log(`Worker collections per run (median): one worker ${gcCount(ones)}, two workers ${gcCount(twos)} (summed).`);
      log(`Same samples in one thread without a queue: ${d.s.toFixed(2)} s wall, ${d.cpuS.toFixed(2)} s CPU (cold, measured once). ${SPLIT}.`);
      log(`Identical figures in every run: yes (open-loop p95 ${f.openLoopP95Deg.toFixed(2)}°, feedback p95 ${f.feedbackP95Deg.toFixed(2)}°).`);
      const round = (x: number) => Number(x.toFixed(3));
      return {
        oneWorkerS: round(one), twoWorkersS: round(two), ratio: round(ratio),
        directOneThreadS: round(d.s), directOneThreadCpuS: round(d.cpuS),
        oneWorkerRunsS: ones.map((r) => round(r.s)), twoWorkersRunsS: twos.map((r) => round(r.s)),
        oneWorkerCpuS: round(workerCpu(ones)), twoWorkersCpuS: round(workerCpu(twos)),
        oneWorkerMainThreadCpuS: round(mainCpu(ones)), twoWorkersMainThreadCpuS: round(mainCpu(twos)),
        oneWorkerPostgresCpuS: round(pgCpu(ones)), twoWorkersPostgresCpuS: round(pgCpu(twos)),
        oneWorkerComputeThreadCpuS: round(computeCpu(ones)), twoWorkersComputeThreadCpuS: round(computeCpu(twos)),
        oneWorkerOtherThreadsCpuS: round(helperCpu(ones)), twoWorkersOtherThreadsCpuS: round(helperCpu(twos)),
        oneWorkerBenchCpuS: round(benchCpu(ones)), twoWorkersBenchCpuS: round(benchCpu(twos)),
        oneWorkerTotalCpuS: round(totalCpu(ones)), twoWorkersTotalCpuS: round(totalCpu(twos)),
        ...(values.gc ? { oneWorkerGcCount: gcCount(ones), twoWorkersGcCount: gcCount(twos) } : {}),
        oneWorkerThreadIdleS: round(idle(ones)), twoWorkersThreadIdleS: round(idle(twos)),
        openLoopP95Deg: round(f.openLoopP95Deg), feedbackP95Deg: round(f.feedbackP95Deg),
      };
    };
    const results: Awaited<ReturnType<typeof measure>>[] = [];
    for (const [i, c] of cases.entries()) results.push(await measure(c, directs[i]));
    // Stopped here so each prints how many jobs it ran (both took chunks).
    await Promise.all(workers.splice(0).map(stopWorker));
    const loadAfter = load();
    log('');
    log(`Summary: ${cases.map((c, i) => `${c.key} maneuver ${results[i].oneWorkerS.toFixed(2)} s → ${results[i].twoWorkersS.toFixed(2)} s, ${results[i].ratio.toFixed(2)}×`).join('; ')}.`);
    log(`Load average (1/5/15 min) before ${loadBefore}, after ${loadAfter}; ${os.cpus().length} cores shared with whatever else runs.`);
    await queue.stop();
    await ctx.close();
    if (values.json) {
      const [standard, light] = results;
      console.log(JSON.stringify({
        // The standard maneuver's figures (the goal), then the light one's under `light`.
        ...standard, samples: SAMPLES, chunkSize: RANGES[0]?.to ?? 0, chunks: RANGES.length, repeats: REPEATS,
        ...(NODE_FLAGS.length ? { workerNodeFlags: NODE_FLAGS.join(' ') } : {}),
        light, loadBefore, loadAfter,
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
