/**
 * npm run bench:api — the main read routes under load. A throwaway PostgreSQL cluster (the project's
 * own cluster helper) gets the migrations, the demo seed and 200 generated maneuvers with versions;
 * the product's server runs in a child process on loopback; autocannon drives each route in turn
 * with 50 concurrent connections, a bounded request count and a time cap. Prints p50/p95/p99,
 * requests/s, the server's and PostgreSQL's CPU per request and the bytes per response per route,
 * with the load average; `-- --json` ends with one JSON object. GET /healthz (no database, no
 * session) is measured in the same run as the floor of this machine and load. Requests carry the
 * Accept-Encoding a browser sends (the web app's requests); `BENCH_API_ENCODING=identity` measures
 * uncompressed responses.
 *
 * autocannon is the load generator because it keeps many connections busy from one process with
 * little overhead, bounds a run by request count, and reports each response's time (we compute
 * the percentiles from those, since its own histogram has no p95).
 */
import { fork } from 'node:child_process';
import { mkdtempSync, readdirSync, readFileSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

import autocannon from 'autocannon';

import { createDatabase } from '../../db/client.ts';
import { runMigrations } from '../../db/migrate.ts';
import { DEMO_PASSWORD, DEMO_PEOPLE } from '../../db/seed/demo-people.ts';
import { seedDemo } from '../../db/seed/run-seed.ts';
import { SimulationPool } from '../../server/engine/pool/simulation-pool.ts';
import { startLocalCluster } from '../../server/scripts/postgres-cluster.ts';
import { addGeneratedManeuvers } from './generated-maneuvers.ts';

const JSON_OUT = process.argv.includes('--json');
/** Concurrent connections per route. */
const CONNECTIONS = 50;
/** Requests per route (bounded count) and the time cap per route, seconds. */
const REQUESTS = Number(process.env.BENCH_API_REQUESTS ?? 3000);
/** Accept-Encoding of every request: Chromium's by default. */
const ENCODING = String(process.env.BENCH_API_ENCODING ?? 'gzip, deflate, br, zstd');
const CAP_S = 20;
/** Generated maneuvers on top of the demo seed. */
const GENERATED = 200;
/** The goal: every main read route's p95 at 50 concurrent, ms. */
const GOAL_P95_MS = 50;

const log = (s = '') => console.log(s);
const load = () => os.loadavg().map((x) => x.toFixed(2)).join(' ');
const here = path.dirname(fileURLToPath(import.meta.url));

/** CPU time (user + system) of a process so far, ms, from /proc (Linux). */
function cpuMs(pid: number): number {
  const fields = readFileSync(`/proc/${pid}/stat`, 'utf8').split(') ')[1].split(' ');
  // utime and stime are fields 14 and 15 of the stat line (index 11 and 12 after the command name).
  return ((Number(fields[11]) + Number(fields[12])) * 1000) / 100;
}

/** CPU so far of the PostgreSQL server whose data folder is `dataDir`: the postmaster and its children, ms. */
function clusterCpuMs(dataDir: string): number {
  const postmaster = Number(readFileSync(path.join(dataDir, 'postmaster.pid'), 'utf8').split('\n')[0]);
  let total = cpuMs(postmaster);
  for (const name of readdirSync('/proc')) {
    if (!/^\d+$/.test(name)) continue;
    try {
      const fields = readFileSync(`/proc/${name}/stat`, 'utf8').split(') ')[1].split(' ');
      // The parent pid is field 4 (index 1 after the command name).
      if (Number(fields[1]) === postmaster) total += cpuMs(Number(name));
    } catch {
      // The process ended meanwhile.
    }
  }
  return total;
}

const percentile = (sorted: number[], p: number) => sorted[Math.min(sorted.length - 1, Math.ceil((p / 100) * sorted.length) - 1)];

/** One route's measurement. */
interface RouteResult {
  name: string;
  requests: number;
  non2xx: number;
  errors: number;
  p50: number;
  p95: number;
  p99: number;
  rps: number;
  cpuMsPerRequest: number;
  dbCpuMsPerRequest: number;
  kbPerResponse: number;
  load1: number;
}

/** Drives one route with autocannon: `amount` requests or `CAP_S` seconds, whichever first. */
function drive(url: string, token: string | null, amount: number, connections: number): Promise<{ times: number[]; non2xx: number; errors: number; bytes: number; seconds: number }> {
  return new Promise((resolve, reject) => {
    const times: number[] = [];
    let non2xx = 0;
    let bytes = 0;
    let errors = 0;
    let first = 0;
    let last = 0;
    const headers: Record<string, string> = { 'accept-encoding': ENCODING };
    if (token) headers.authorization = `Bearer ${token}`;
    const inst = autocannon({ url, connections, amount, timeout: 30, headers }, (err) => {
      clearTimeout(cap);
      if (err) reject(err instanceof Error ? err : new Error(String(err)));
      else resolve({ times, non2xx, errors, bytes, seconds: (last - first) / 1000 });
    });
    const cap = setTimeout(() => inst.stop(), CAP_S * 1000);
    inst.on('start', () => { first = performance.now(); });
    inst.on('response', (_client, status, resBytes, ms) => {
      last = performance.now();
      times.push(ms);
      bytes += resBytes;
      if (status < 200 || status >= 300) non2xx++;
    });
    inst.on('reqError', () => { errors++; });
  });
}

async function main() {
  const loadAtStart = os.loadavg()[0];
  log(`Load average at start (1/5/15 min): ${load()} on ${os.cpus().length} cores`);
  const dir = mkdtempSync(path.join(os.tmpdir(), 'hn-bench-'));
  const cluster = await startLocalCluster({ dir, database: 'holonaut', throwaway: true, log: () => undefined });
  const dataDir = path.join(dir, 'data');
  let child: ReturnType<typeof fork> | undefined;
  try {
    const { db, pool } = createDatabase(cluster.url, { max: 4 });
    await runMigrations(db);
    // The product pool the API's context would own (the server runs in its own process below).
    const simulation = new SimulationPool({ timeoutMs: 20_000 });
    await seedDemo(db, 12, simulation);
    const t0 = performance.now();
    const versions = await addGeneratedManeuvers(db, GENERATED, simulation);
    log(`Data: demo seed + ${GENERATED} generated maneuvers (${versions} versions with engine reports), generated in ${((performance.now() - t0) / 1000).toFixed(1)} s`);
    await pool.query('ANALYZE');
    await pool.end();
    await simulation.close();

    // The product's server in its own process, production settings, logging as in production.
    child = fork(path.join(here, 'api-server.ts'), [], {
      execArgv: ['--import', 'tsx'],
      stdio: ['ignore', 'ignore', 'inherit', 'ipc'],
      env: {
        ...process.env, NODE_ENV: 'production', DATABASE_URL: cluster.url, PORT: '0', HOST: '127.0.0.1',
        JWT_SECRET: 'bench-secret-that-is-long-enough-0123456789', SIGNIN_RATE_LIMIT: '1000', LOG_LEVEL: 'info',
      },
    });
    const server = child;
    const base = await new Promise<string>((resolve, reject) => {
      server.once('message', (m) => resolve((m as { url: string }).url));
      server.once('exit', (code) => reject(new Error(`bench server exited (${code})`)));
    });

    const signIn = async (role: string) => {
      const email = DEMO_PEOPLE.find((p) => p.role === role)!.email;
      const res = await fetch(`${base}/api/auth/sign-in`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ email, password: DEMO_PASSWORD }) });
      if (!res.ok) throw new Error(`sign-in ${email}: ${res.status}`);
      return ((await res.json()) as { token: string }).token;
    };
    const planner = await signIn('planner');
    const reviewer = await signIn('reviewer');
    const trainee = await signIn('trainee');
    const get = async (p: string, token: string) => {
      const res = await fetch(`${base}${p}`, { headers: { authorization: `Bearer ${token}` } });
      if (!res.ok) throw new Error(`GET ${p}: ${res.status}`);
      return res.json() as Promise<Record<string, unknown>>;
    };
    const crew = (await get('/api/crew', planner)).members as { id: string }[];
    const list = (await get('/api/sequences', planner)).sequences as { id: string; name: string; latest: { id: string } | null }[];
    const seq = list.find((s) => s.name.startsWith('Generated') && s.latest) ?? list[0];
    const own = (await get('/api/sequences', trainee)).sequences as { cleared: { id: string } | null }[];
    const cleared = own.find((s) => s.cleared)?.cleared;
    if (!cleared) throw new Error('the demo trainee has no cleared version');
    const queue = (await get('/api/reviews/queue', reviewer)).items as unknown[];
    log(`Server ${base} (child process ${server.pid}); ${list.length} maneuvers, ${crew.length} crew members, ${queue.length} versions in the review queue`);

    const routes: { name: string; path: string; token: string | null; key?: string }[] = [
      { name: 'GET /healthz (floor: no session, no database)', path: '/healthz', token: null },
      // The list screen's request: the first page of 50 by name.
      { name: 'GET /api/sequences?limit=50 (planner)', path: '/api/sequences?limit=50', token: planner, key: 'sequencesList' },
      { name: 'GET /api/sequences (planner, whole list)', path: '/api/sequences', token: planner, key: 'sequencesListAll' },
      { name: 'GET /api/sequences?limit=50 (trainee)', path: '/api/sequences?limit=50', token: trainee, key: 'traineeSequencesList' },
      { name: 'GET /api/crew', path: '/api/crew', token: planner, key: 'crewList' },
      { name: 'GET /api/crew/:id', path: `/api/crew/${crew[0].id}`, token: planner, key: 'crewDetail' },
      { name: 'GET /api/sequences/:id', path: `/api/sequences/${seq.id}`, token: planner, key: 'sequenceDetail' },
      { name: 'GET /api/sequences/versions/:id', path: `/api/sequences/versions/${seq.latest!.id}`, token: planner, key: 'versionDetail' },
      { name: 'GET /api/motion/:id (trainee, cleared)', path: `/api/motion/${cleared.id}`, token: trainee, key: 'motion' },
      { name: 'GET /api/reviews/queue', path: '/api/reviews/queue', token: reviewer, key: 'reviewQueue' },
    ];

    // Warm-up of every route before any is measured, so the first one measured does not pay for the
    // JIT compiling the shared path (guard, read cache, compression) that the later ones find warm.
    for (const r of routes) await drive(base + r.path, r.token, 500, 10);
    const results: RouteResult[] = [];
    for (const r of routes) {
      // Again just before measuring: connections opened, caches filled (a motion's first simulation included).
      await drive(base + r.path, r.token, 200, 10);
      const cpu0 = cpuMs(server.pid!);
      const db0 = clusterCpuMs(dataDir);
      const m = await drive(base + r.path, r.token, REQUESTS, CONNECTIONS);
      const cpu1 = cpuMs(server.pid!);
      const db1 = clusterCpuMs(dataDir);
      const sorted = [...m.times].sort((a, b) => a - b);
      results.push({
        name: r.name, requests: m.times.length, non2xx: m.non2xx, errors: m.errors,
        p50: percentile(sorted, 50), p95: percentile(sorted, 95), p99: percentile(sorted, 99),
        rps: m.times.length / m.seconds, cpuMsPerRequest: (cpu1 - cpu0) / m.times.length, dbCpuMsPerRequest: (db1 - db0) / m.times.length,
        kbPerResponse: m.bytes / m.times.length / 1024, load1: os.loadavg()[0],
      });
    }

    log(`\n${CONNECTIONS} concurrent connections, ${REQUESTS} requests per route (cap ${CAP_S} s), loopback, Accept-Encoding: ${ENCODING}:`);
    log(`${'route'.padEnd(48)} ${'p50 ms'.padStart(7)} ${'p95 ms'.padStart(7)} ${'p99 ms'.padStart(7)} ${'req/s'.padStart(7)} ${'CPU ms/req'.padStart(10)} ${'DB ms/req'.padStart(9)} ${'KB/resp'.padStart(8)} ${'p95/floor'.padStart(9)} ${'load 1m'.padStart(7)}`);
    const floor = results[0];
    for (const r of results) {
      log(`${r.name.padEnd(48)} ${r.p50.toFixed(1).padStart(7)} ${r.p95.toFixed(1).padStart(7)} ${r.p99.toFixed(1).padStart(7)} ${r.rps.toFixed(0).padStart(7)} ${r.cpuMsPerRequest.toFixed(2).padStart(10)} ${r.dbCpuMsPerRequest.toFixed(2).padStart(9)} ${r.kbPerResponse.toFixed(1).padStart(8)} ${(r.p95 / floor.p95).toFixed(1).padStart(9)} ${r.load1.toFixed(2).padStart(7)}${r.non2xx || r.errors ? `  (${r.non2xx} non-2xx, ${r.errors} errors)` : ''}`);
    }
    const main = results.slice(1);
    const worst = main.reduce((a, b) => (b.p95 > a.p95 ? b : a));
    log(`\nGoal p95 ≤ ${GOAL_P95_MS} ms on every main read route: ${worst.p95 <= GOAL_P95_MS ? 'met' : `missed (worst ${worst.name}, ${worst.p95.toFixed(1)} ms)`}.`);
    log('CPU ms/req is the server process alone, DB ms/req the PostgreSQL processes; KB/resp counts headers and the body as sent. With 50 connections in a closed loop, p50 ≈ 50 / (req/s) whatever the route costs.');
    log(`Load average at end (1/5/15 min): ${load()} (at start ${loadAtStart.toFixed(2)}; the bench itself adds about 2)`);
    const failed = results.filter((r) => r.non2xx || r.errors);
    if (JSON_OUT) {
      const byKey = Object.fromEntries(routes.flatMap((r, i) => (r.key ? [[`${r.key}P95Ms`, +results[i].p95.toFixed(2)]] : [])));
      console.log(JSON.stringify({
        ...byKey,
        ...Object.fromEntries(routes.flatMap((r, i) => (r.key ? [[`${r.key}Rps`, Math.round(results[i].rps)]] : []))),
        ...Object.fromEntries(routes.flatMap((r, i) => (r.key ? [[`${r.key}CpuMs`, +results[i].cpuMsPerRequest.toFixed(3)]] : []))),
        ...Object.fromEntries(routes.flatMap((r, i) => (r.key ? [[`${r.key}DbCpuMs`, +results[i].dbCpuMsPerRequest.toFixed(3)]] : []))),
        ...Object.fromEntries(routes.flatMap((r, i) => (r.key ? [[`${r.key}KB`, +results[i].kbPerResponse.toFixed(1)]] : []))),
        acceptEncoding: ENCODING,
        healthzP95Ms: +floor.p95.toFixed(2), connections: CONNECTIONS, requestsPerRoute: REQUESTS,
        loadAverageStart: +loadAtStart.toFixed(2), loadAverage: +os.loadavg()[0].toFixed(2),
      }));
    }
    if (failed.length) {
      console.error(`Failed responses on: ${failed.map((r) => r.name).join(', ')}`);
      process.exitCode = 1;
    }
  } finally {
    if (child && child.exitCode === null) {
      const c = child;
      await new Promise<void>((resolve) => { c.once('exit', () => resolve()); c.kill('SIGTERM'); setTimeout(() => c.kill('SIGKILL'), 5000).unref(); });
    }
    cluster.stop();
  }
}

await main();
