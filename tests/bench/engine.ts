/**
 * npm run bench:engine [-- --json] — the zero-momentum engine on the 15-segment standard human
 * model through a ≈10 s maneuver (arm cones, then leg loops), side by side with a fixed-step RK4 of
 * our own (same right-hand side, at the step that matches the reference to 1e-8 rad), odex (the
 * general-purpose solver the engine used before, now its cross-check) and MuJoCo (mujoco-js,
 * servo-driven, dt = 2.5e-4 s as before). Prints figures, ratios, the load average and peak memory;
 * with --json, one JSON object as the last line.
 *
 * Same conditions for every timed run: the young generation is collected just before each one, of
 * either method (V8's gc({ type: 'minor' }), exposed here at start-up), so that no run pays for the
 * short-lived garbage another left behind — MuJoCo's runs leave megabytes, whose collection otherwise
 * lands in the engine run after them. (A full collection instead leaves the old generation to be
 * swept by V8's helper threads while the next run is timed: measured, it slowed the run after it.)
 * Collections that still start inside a timed engine run are counted and printed. Every timed run is
 * kept; nothing is dropped.
 */
import os from 'node:os';
import { PerformanceObserver } from 'node:perf_hooks';
import { setFlagsFromString } from 'node:v8';
import { runInNewContext } from 'node:vm';

import { attitudeRhs, integrateAttitude } from '../../server/engine/integrate-attitude.ts';
import { evalPiece } from '../../server/engine/joint-motion.ts';
import { bodyRate, createMomentumWork } from '../../server/engine/locked-momentum.ts';
import { RateNodes } from '../../server/engine/rate-nodes.ts';
import { mergeRigidSegments } from '../../server/engine/rigid-merge.ts';
import { sampleTimes, simulateModel } from '../../server/engine/simulate.ts';
import { auditTrack } from '../../server/engine/track-audit.ts';
import { quatAngleBetween } from '../../shared/math/quaternion.ts';
import { runMujoco } from '../engine/mujoco-run.ts';
import { odexFinalAttitude } from '../engine/odex-reference.ts';
import { standardManeuver } from '../engine/standard-maneuver.ts';

const JSON_OUT = process.argv.includes('--json');

// V8's gc(), without a node flag in the npm script (the flag is set, then gc() read from a fresh context).
setFlagsFromString('--expose-gc');
const gc = runInNewContext('gc') as (options?: { type: 'minor' | 'major' }) => void;
/** Empties the young generation (see the header). */
const collect = () => gc({ type: 'minor' });
/** Collections V8 reports (start time, ms), to count those inside timed runs. */
const gcStarts: number[] = [];
new PerformanceObserver((list) => { for (const e of list.getEntries()) gcStarts.push(e.startTime); }).observe({ entryTypes: ['gc'] });
/** The timed windows [start, end] of the engine's runs with audit, and the CPU time (ms, all threads) of each. */
const engineWindows: [number, number][] = [];
const engineCpu: number[] = [];
const cpuMs = (u: NodeJS.CpuUsage) => (u.user + u.system) / 1000;
/** Milliseconds of one call of f, after a young-generation collection (the same start for every timed run); CPU time into `cpu`. */
function timed(f: () => void, windows?: [number, number][], cpu?: number[]): number {
  collect();
  const c = process.cpuUsage(), t = performance.now();
  f();
  const end = performance.now();
  cpu?.push(cpuMs(process.cpuUsage(c)));
  windows?.push([t, end]);
  return end - t;
}
async function timedAsync(f: () => Promise<unknown>, cpu?: number[]): Promise<number> {
  collect();
  const c = process.cpuUsage(), t = performance.now();
  await f();
  const end = performance.now();
  cpu?.push(cpuMs(process.cpuUsage(c)));
  return end - t;
}

const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];
const q4 = (a: { w: number; x: number; y: number; z: number }) => [a.w, a.x, a.y, a.z];

const { body, sequence: seq, model, plan } = standardManeuver();
const rhsModel = mergeRigidSegments(model);

const out: string[] = [];
const line = (s = '') => { out.push(s); console.log(s); };
line(`Body: ${body.name} — ${model.segmentCount} segments, ${model.dofCount} dofs; maneuver ${plan.duration.toFixed(2)} s, ${plan.pieces.length} steps`);

// 1. Engine (Magnus, rtol 1e-10), full result with audit and without, interleaved so both see the
// same machine load (a shared 2-core machine: the median and the best run are both printed).
const RUNS = 41;
// Warm-up: every function optimised before the first timed run.
for (let i = 0; i < 30; i++) { simulateModel(model, plan, {}); simulateModel(model, plan, { skipAudit: true }); }
const tFull: number[] = [], tCore: number[] = [];
let res = simulateModel(model, plan, {});
for (let i = 0; i < RUNS; i++) {
  tFull.push(timed(() => { res = simulateModel(model, plan, {}); }, engineWindows, engineCpu));
  tCore.push(timed(() => { simulateModel(model, plan, { skipAudit: true }); }));
}
// Evaluations of ω spent on samples and on the audit (not RHS evaluations: DECISIONS.md).
// The audit takes the integrator's recorded nodes as its reference rate, as simulateModel runs it.
const extraNodes = new RateNodes(plan);
const extra = integrateAttitude(model, plan, { rtol: 1e-10, atol: 1e-10, nodes: extraNodes }, sampleTimes(plan.duration, 60));
const auditEvals = auditTrack(model, plan, sampleTimes(plan.duration, 60), extra.outputs, { reference: extraNodes }).rateEvaluations;
const evals = res.solver.rhsEvaluations;
// Cost of one RHS evaluation, timed alone on every step of the maneuver (calls spread over each
// step, weighted by its duration: steps with more moving segments cost more), best of 5 passes.
const y = [1, 0, 0, 0];
const N = 200_000;
let usPerRhs = Infinity;
{
  const calls = plan.pieces.map((p) => Math.max(1, Math.round((N * (p.t1 - p.t0)) / plan.duration)));
  // The right-hand side exactly as the integrator builds it (dof-less segments folded into their parents).
  const fs = plan.pieces.map((p) => attitudeRhs(rhsModel, createMomentumWork(rhsModel), p, { n: 0 }));
  for (let pass = 0; pass < 5; pass++) {
    let total = 0, ms = 0;
    plan.pieces.forEach((p, k) => {
      const f = fs[k], n = calls[k], span = p.t1 - p.t0;
      const t0 = performance.now();
      for (let i = 0; i < n; i++) f(p.t0 + (span * i) / n, y);
      ms += performance.now() - t0; total += n;
    });
    usPerRhs = Math.min(usPerRhs, (ms * 1000) / total);
  }
}
const engineMs = median(tFull), coreMs = median(tCore);
const bestFull = Math.min(...tFull), bestCore = Math.min(...tCore);
// The reference: the engine at rtol 1e-13 (checked against odex at 1e-13 below).
const reference = q4(simulateModel(model, plan, { rtol: 1e-13, rateHz: 1, skipAudit: true }).final.attitude);
const engineErr = quatAngleBetween(q4(res.final.attitude), reference);

// 2. Fixed-step RK4 of our own on the same right-hand side, doubling steps until 1e-8 rad from the reference.
function rk4(stepsPerSecond: number): { q: number[]; evals: number; ms: number } {
  const counter = { n: 0 };
  const work = createMomentumWork(rhsModel);
  collect();
  const t = performance.now();
  let q = [1, 0, 0, 0];
  for (const p of plan.pieces) {
    const g = attitudeRhs(rhsModel, work, p, counter);
    const n = Math.max(1, Math.ceil((p.t1 - p.t0) * stepsPerSecond));
    const h = (p.t1 - p.t0) / n;
    for (let k = 0; k < n; k++) {
      const tt = p.t0 + k * h;
      const k1 = g(tt, q);
      const k2 = g(tt + h / 2, q.map((v, i) => v + (h / 2) * k1[i]));
      const k3 = g(tt + h / 2, q.map((v, i) => v + (h / 2) * k2[i]));
      const k4 = g(tt + h, q.map((v, i) => v + h * k3[i]));
      q = q.map((v, i) => v + (h / 6) * (k1[i] + 2 * k2[i] + 2 * k3[i] + k4[i]));
    }
    const nn = Math.hypot(...q); q = q.map((v) => v / nn);
  }
  return { q, evals: counter.n, ms: performance.now() - t };
}
let sps = 25, rk = rk4(sps);
while (quatAngleBetween(rk.q, reference) > 1e-8 && sps < 1e6) { sps *= 2; rk = rk4(sps); }
const rkTimes = [rk.ms]; for (let i = 0; i < 4; i++) rkTimes.push(rk4(sps).ms);
const rkMs = median(rkTimes), rkErr = quatAngleBetween(rk.q, reference);

// 3. odex (Gragg–Bulirsch–Stoer extrapolation) on the same right-hand side at the same rtol: the
// engine's integrator before the Magnus method, and its cross-check in the tests.
const odexTimes: number[] = [];
let od = odexFinalAttitude(model, plan, 1e-10);
for (let i = 0; i < 5; i++) odexTimes.push(timed(() => { od = odexFinalAttitude(model, plan, 1e-10); }));
const odexMs = median(odexTimes), odexErr = quatAngleBetween(od.q, reference);
const odexRef = odexFinalAttitude(model, plan, 1e-13).q;

// 4. MuJoCo at dt = 2.5e-4 s (servo tracking, as in every earlier run of this benchmark, so the
// ratio is comparable), 5 timed runs interleaved with the engine's (same load). Between two MuJoCo
// runs the engine runs twice, both timed: straight after MuJoCo ("cold": 0.3-0.4 s of MuJoCo have
// replaced the engine's code and data in the caches and branch predictors; measured 1.2-1.4× the
// CPU time of a run after an engine run, with no collection inside) and after that first one
// ("warm", as the engine's own runs above and as MuJoCo's 40,000 steps keep themselves). Both
// ratios are printed; the table's is against the warm runs.
const dt = 2.5e-4;
let mj = await runMujoco(body, seq, dt);
const mjTimes: number[] = [], tFull2: number[] = [], tCold: number[] = [], mjCpu: number[] = [], engineCpu2: number[] = [], engineCpuCold: number[] = [];
for (let i = 0; i < 5; i++) {
  tCold.push(timed(() => { simulateModel(model, plan, {}); }, engineWindows, engineCpuCold));
  tFull2.push(timed(() => { simulateModel(model, plan, {}); }, engineWindows, engineCpu2));
  mjTimes.push(await timedAsync(async () => { mj = await runMujoco(body, seq, dt); }, mjCpu));
}
const mjMs = median(mjTimes), engineBesideMujocoMs = median(tFull2), engineColdMs = median(tCold);
const mjErr = quatAngleBetween(mj.attitude, reference);

// Shape momentum scale, for relative figures.
const work = createMomentumWork(model);
const qq = new Float64Array(model.dofCount), qd = new Float64Array(model.dofCount);
let peakH = 0;
for (const p of plan.pieces) for (let k = 0; k <= 50; k++) { evalPiece(p, p.t0 + ((p.t1 - p.t0) * k) / 50, qq, qd); bodyRate(model, qq, qd, work); peakH = Math.max(peakH, Math.hypot(...work.h)); }

// Collections that started inside an engine run with audit (the observer reports them asynchronously).
await new Promise((r) => setTimeout(r, 0));
const gcInEngine = gcStarts.filter((t) => engineWindows.some(([a, b]) => t >= a && t <= b)).length;

const ru = process.resourceUsage();
const load = os.loadavg()[0];
line('');
line('method                            | time/sim ms | ratio | RHS evals | attitude err vs rtol 1e-13 (rad) | momentum drift');
line('----------------------------------|-------------|-------|-----------|----------------------------------|---------------');
line(`engine Magnus rtol 1e-10 + audit  | ${engineMs.toFixed(2).padStart(11)} | 1.00  | ${String(evals).padStart(9)} | ${engineErr.toExponential(2).padStart(32)} | audit max ‖H‖ ${res.momentumResidual.maxAbs.toExponential(2)} kg·m²/s (${res.momentumResidual.relative.toExponential(2)} rel)`);
line(`engine Magnus, audit skipped      | ${coreMs.toFixed(2).padStart(11)} | ${(coreMs / engineMs).toFixed(2)}  | ${String(evals).padStart(9)} | ${engineErr.toExponential(2).padStart(32)} | —`);
line(`odex rtol 1e-10, final only       | ${odexMs.toFixed(2).padStart(11)} | ${(odexMs / engineMs).toFixed(2).padEnd(5)} | ${String(od.evaluations).padStart(9)} | ${odexErr.toExponential(2).padStart(32)} | —`);
line(`fixed-step RK4 h=${(1 / sps).toExponential(1)} s       | ${rkMs.toFixed(2).padStart(11)} | ${(rkMs / engineMs).toFixed(2).padEnd(5)} | ${String(rk.evals).padStart(9)} | ${rkErr.toExponential(2).padStart(32)} | same ω formula: H = 0 at every evaluation`);
line(`MuJoCo servo dt=${dt.toExponential(2)} s      | ${mjMs.toFixed(2).padStart(11)} | ${(mjMs / engineBesideMujocoMs).toFixed(1).padEnd(5)} | ${String(mj.steps).padStart(9)} steps | ${mjErr.toExponential(2).padStart(26)} | max ‖H‖ ${mj.maxMomentum.toExponential(2)} kg·m²/s (${(mj.maxMomentum / peakH).toExponential(2)} rel)`);
line('');
line(`Engine, best of ${RUNS} runs: ${bestFull.toFixed(2)} ms with audit, ${bestCore.toFixed(2)} ms audit skipped (samples and audit ${(bestFull - bestCore).toFixed(2)} ms for ${res.momentumResidual.points} samples); medians above; load average ${load.toFixed(1)} on ${os.availableParallelism()} cores`);
line(`Garbage collections inside the ${engineWindows.length} timed engine runs with audit: ${gcInEngine} (a young-generation collection precedes every timed run of either method)`);
line(`CPU time per run (every thread of the process: waiting for a core does not count, helper threads working inside the run do): engine with audit ${median(engineCpu).toFixed(2)} ms median over ${engineCpu.length} runs (beside MuJoCo ${median(engineCpu2).toFixed(2)} ms warm, ${median(engineCpuCold).toFixed(2)} ms cold), MuJoCo ${median(mjCpu).toFixed(1)} ms: ${(median(mjCpu) / median(engineCpu2)).toFixed(0)}× warm, ${(median(mjCpu) / median(engineCpuCold)).toFixed(0)}× cold`);
line(`MuJoCo ratio against the engine runs interleaved with it: warm (after an engine run; median ${engineBesideMujocoMs.toFixed(2)} ms) ${(mjMs / engineBesideMujocoMs).toFixed(0)}×, cold (straight after MuJoCo; median ${engineColdMs.toFixed(2)} ms) ${(mjMs / engineColdMs).toFixed(0)}×`);
line(`ω evaluations: ${evals} by the integrator (${res.solver.steps} steps, ${res.solver.rejectedSteps} rejected), ${extra.stats.sampleEvaluations} for the 60 Hz samples and the pieces' ends (the audit's reference), ${auditEvals} by the audit`);
const rhsMs = (evals * usPerRhs) / 1000;
line(`RHS cost alone: ${usPerRhs.toFixed(2)} µs/evaluation → evals × cost = ${rhsMs.toFixed(2)} ms; engine core/that = ${(coreMs / rhsMs).toFixed(2)}× (median), ${(bestCore / rhsMs).toFixed(2)}× (best)`);
line(`Reference (engine, rtol 1e-13) vs odex at rtol 1e-13: ${quatAngleBetween(reference, odexRef).toExponential(2)} rad`);
line(`Peak shape momentum ${peakH.toFixed(3)} kg·m²/s; final rotation ${res.final.rotation.angleDeg.toFixed(3)}°`);
line(`Peak memory: maxRSS ${(ru.maxRSS / 1024).toFixed(0)} MiB; heap used now ${(process.memoryUsage().heapUsed / 2 ** 20).toFixed(0)} MiB`);
if (JSON_OUT) {
  console.log(JSON.stringify({
    engineMs: +engineMs.toFixed(3), engineNoAuditMs: +coreMs.toFixed(3), rhsEvaluations: evals, errorRad: +engineErr.toExponential(3),
    mujocoMs: +mjMs.toFixed(1), mujocoErrorRad: +mjErr.toExponential(3), loadAverage: +load.toFixed(2),
  }));
}
process.exit(0);
