/**
 * npm run bench:planner [-- --json] [-- --samples N] [-- --seed N]: the maneuver planner on three demo bodies (a
 * cabin-clothed man, a cabin-clothed woman, a man in the pressurised suit; invented demo data) ×
 * the standard targets (yaw 90, yaw 180, pitch 90, roll 45 and two 3-axis targets), all in one
 * process, side by side. Per plan: wall time of the search and verification, of the robustness
 * runs, the process's CPU time, and the best candidate's error, duration, rotation travelled (∫|ω| dt and cycle to cycle),
 * peak joint rate, and both robustness 95th percentiles. Prints the load average before and after;
 * with --json the last line is one JSON object; --seed sets the robustness seed (default 1); --paired-limbs independent uses the stricter timing model.
 */
import os from 'node:os';
import { parseArgs } from 'node:util';

import { DEMO_PROFILES } from '../../db/seed/seed-crew-profiles.ts';
import { deriveProfile } from '../../server/crew/derive-profile.ts';
import { BUILT_IN_SUITS } from '../../server/model/suits/index.ts';
import { planManeuver } from '../../server/planning/plan-maneuver.ts';
import type { Body } from '../../shared/contracts/body.ts';
import { sequenceTargetSchema } from '../../shared/contracts/maneuver.ts';
import { planRequestSchema } from '../../shared/contracts/plan.ts';

const { values } = parseArgs({ options: { json: { type: 'boolean' }, samples: { type: 'string' }, seed: { type: 'string' }, 'paired-limbs': { type: 'string' } } });
const samples = Number(values.samples ?? 100);
const seed = Number(values.seed ?? 1);
const median = (xs: number[]) => { const s = [...xs].sort((a, b) => a - b); const m = Math.floor(s.length / 2); return s.length % 2 ? s[m] : (s[m - 1] + s[m]) / 2; };

function body(sex: 'male' | 'female', stature: number, mass: number, suitId: string, name: string): Body {
  const suit = BUILT_IN_SUITS.find((s) => s.id === suitId) ?? null;
  return deriveProfile({ sex, stature, mass, lengths: {}, gear: [] }, suit, name).body;
}
const kettle = DEMO_PROFILES.kettle[0];
const bodies: Record<string, Body> = {
  'cabin man 1.78 m 77 kg': body('male', 1.78, 77, 'cabin-clothing', 'bench cabin man'),
  'cabin woman 1.67 m 59 kg': body('female', 1.67, 59.1, 'cabin-clothing', 'bench cabin woman'),
  'suited man 1.83 m 86 kg': deriveProfile({ lengths: {}, gear: [], ...kettle.inputs } as Parameters<typeof deriveProfile>[0], BUILT_IN_SUITS.find((s) => s.id === 'pressurised-suit')!, 'bench suited man').body,
};
const targets: [string, number, number, number][] = [
  ['yaw 90', 90, 0, 0], ['yaw 180', 180, 0, 0], ['pitch 90', 0, 90, 0], ['roll 45', 0, 0, 45],
  ['yaw 60 pitch 30 roll 20', 60, 30, 20], ['yaw -45 pitch 20 roll -30', -45, 20, -30],
];

const loadBefore = os.loadavg();
// --paired-limbs independent: the stricter timing model (left and right limbs fall out of step).
const settings = planRequestSchema.parse({ samples, maxCandidates: 3, seed, spreads: { pairedLimbs: values['paired-limbs'] ?? 'together' } });
const rows: Record<string, unknown>[] = [];
for (const [bodyName, b] of Object.entries(bodies)) {
  for (const [label, yaw, pitch, roll] of targets) {
    const target = sequenceTargetSchema.parse({ mode: 'ypr', yprDeg: { yaw, pitch, roll }, toleranceDeg: 2, rateLimitDegS: 180 });
    const t0 = performance.now(), c0 = process.cpuUsage();
    const out = planManeuver({ body: b, target, settings });
    const wallS = (performance.now() - t0) / 1000;
    // CPU time of this process (the planner is single-threaded): less inflated by other work than the wall time.
    const cpu = process.cpuUsage(c0), cpuS = (cpu.user + cpu.system) / 1e6;
    const best = out.candidates[0];
    rows.push({
      body: bodyName, target: label, wallS, cpuS, searchS: out.timings.searchS, robustnessS: out.timings.robustnessS,
      errorDeg: best?.errorDeg ?? null, withinLimits: best ? best.withinTolerance && best.withinRateLimit && best.rangeViolationCount === 0 : false,
      durationS: best?.durationS ?? null, pathDeg: best?.pathDeg ?? null, netPathDeg: best?.netPathDeg ?? null, peakJointRateDegS: best?.peakJointRateDegS ?? null,
      openLoopP95Deg: best?.robustness.openLoopP95Deg ?? null, feedbackP95Deg: best?.robustness.feedbackP95Deg ?? null, level: best?.robustness.level ?? null,
      phases: best?.families.join(' → ') ?? out.notes.join(' '),
    });
    const r = rows[rows.length - 1] as Record<string, number | string | null>;
    const f = (x: unknown, d = 1) => (typeof x === 'number' ? x.toFixed(d) : '—');
    if (!values.json) console.log(`${bodyName.padEnd(26)} ${label.padEnd(26)} plan ${f(r.searchS, 2)} s + robustness ${f(r.robustnessS, 2)} s | error ${f(r.errorDeg, 2)}° | ${f(r.durationS)} s | path ${f(r.pathDeg, 0)}° (cycle to cycle ${f(r.netPathDeg, 0)}°) | peak ${f(r.peakJointRateDegS, 0)}°/s | p95 open-loop ${f(r.openLoopP95Deg)}° feedback ${f(r.feedbackP95Deg)}° (${r.level}) | ${r.phases}`);
  }
}
const loadAfter = os.loadavg();
const summary = {
  bench: 'planner', samplesPerCandidate: samples, seed, pairedLimbs: settings.spreads.pairedLimbs, candidates: settings.maxCandidates, cpus: os.cpus().length,
  loadAverageBefore: loadBefore, loadAverageAfter: loadAfter,
  medianSearchS: median(rows.map((r) => r.searchS as number)), medianWallS: median(rows.map((r) => r.wallS as number)), medianCpuS: median(rows.map((r) => r.cpuS as number)),
  medianFeedbackP95Deg: median(rows.map((r) => (r.feedbackP95Deg as number) ?? Infinity)), medianOpenLoopP95Deg: median(rows.map((r) => (r.openLoopP95Deg as number) ?? Infinity)),
  allWithinLimits: rows.every((r) => r.withinLimits), feedbackWithin3xTolerance: rows.filter((r) => (r.feedbackP95Deg as number) <= 6).length, plans: rows.length,
  rows,
};
if (values.json) console.log(JSON.stringify(summary));
else console.log(`median plan (search + verification) ${summary.medianSearchS.toFixed(2)} s, median with robustness ${summary.medianWallS.toFixed(2)} s (CPU ${summary.medianCpuS.toFixed(2)} s); feedback p95 ≤ 3× tolerance on ${summary.feedbackWithin3xTolerance} of ${rows.length}; all within limits: ${summary.allWithinLimits}; load average ${loadBefore.map((x) => x.toFixed(2)).join(' ')} → ${loadAfter.map((x) => x.toFixed(2)).join(' ')} on ${summary.cpus} cores`);
