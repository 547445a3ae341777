/**
 * Rewrites db/seed/demo-robustness.json: seeds the demo into a throwaway PostgreSQL, then computes
 * every demo version's robustness run the seed could not take from the file (same code as the
 * worker: robustnessSamples), keeping entries still in use and dropping the rest.
 * `npx tsx db/seed/precompute-demo-robustness.ts` (about a minute on two cores).
 */
import { mkdtempSync, writeFileSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';

import { SimulationPool } from '../../server/engine/pool/simulation-pool.ts';
import { storedRunInputs } from '../../server/jobs/robustness/robustness-runs.ts';
import { robustnessSamples } from '../../server/planning/robustness.ts';
import { startLocalCluster } from '../../server/scripts/postgres-cluster.ts';
import { createDatabase } from '../client.ts';
import { runMigrations } from '../migrate.ts';
import { robustnessRuns } from '../schema/index.ts';
import { DEMO_ERROR_DIGITS, type DemoRobustnessFile, demoRobustnessFile, type DemoRunInputs,demoRunKey, loadDemoRobustness } from './demo-robustness.ts';
import { seedDemo } from './run-seed.ts';

const round = (x: number) => Number(x.toFixed(DEMO_ERROR_DIGITS));

const dir = mkdtempSync(path.join(os.tmpdir(), 'hn-demo-'));
const cluster = await startLocalCluster({ dir, database: 'holonaut', throwaway: true });
try {
  const { db, pool } = createDatabase(cluster.url, { max: 2 });
  await runMigrations(db);
  const simulation = new SimulationPool({ size: 1, timeoutMs: 120_000 });
  await seedDemo(db, 4, simulation);
  await simulation.close();
  const runs = await db.select().from(robustnessRuns);
  const old = loadDemoRobustness();
  const out: DemoRobustnessFile = {};
  for (const run of runs) {
    const inputs: DemoRunInputs = { ...storedRunInputs(run), samples: run.samples };
    const key = demoRunKey(inputs);
    if (old[key]) { out[key] = old[key]; continue; }
    const t0 = performance.now();
    const samples = robustnessSamples(inputs, 0, inputs.samples);
    out[key] = { samples: samples.length, openLoopErrorDeg: samples.map((s) => round(s.openLoopErrorDeg)), feedbackErrorDeg: samples.map((s) => round(s.feedbackErrorDeg)) };
    process.stderr.write(`run of version ${run.sequenceVersionId}: ${samples.length} samples in ${((performance.now() - t0) / 1000).toFixed(1)} s\n`);
  }
  writeFileSync(demoRobustnessFile, `${JSON.stringify(out)}\n`);
  process.stderr.write(`${Object.keys(out).length} runs in ${demoRobustnessFile}\n`);
  await pool.end();
} finally {
  cluster.stop();
}
