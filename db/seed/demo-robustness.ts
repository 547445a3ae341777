/**
 * Robustness of the demo versions. A save queues a 1,000-sample run that the worker computes in
 * seconds; the seed cannot wait for that (every test file seeds), so it stores runs computed ahead
 * by the same code (server/planning/robustness.ts) from db/seed/demo-robustness.json, keyed by the
 * exact inputs of the run. A version whose inputs have no entry (the body model, the steps or the
 * robustness model changed since) gets its run queued as a save would, and the worker computes it;
 * `npx tsx db/seed/precompute-demo-robustness.ts` rewrites the file (tests/maneuvers/demo-data.test.ts
 * fails while an entry is missing and re-computes samples of every entry to check them).
 */
import { createHash } from 'node:crypto';
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';

import { recordAudit } from '../../server/audit/record-audit.ts';
import { chunkRanges, createRobustnessRun, DEFAULT_ROBUSTNESS_SAMPLES, DEFAULT_ROBUSTNESS_SEED, type NewRun } from '../../server/jobs/robustness/robustness-runs.ts';
import { canonicalJson } from '../../server/maneuvers/inputs-hash.ts';
import { summariseRobustness } from '../../server/planning/robustness.ts';
import { DEFAULT_ROBUSTNESS_MODEL, type RobustnessModel } from '../../shared/contracts/robustness.ts';
import type { RobustnessSample } from '../../shared/contracts/robustness-stored.ts';
import type { Database } from '../client.ts';
import { robustnessChunks, robustnessRuns } from '../schema/index.ts';

/** Everything a run's figures depend on (besides the code). */
export interface DemoRunInputs {
  body: NewRun['body'];
  sequence: NewRun['sequence'];
  target: NewRun['target'];
  toleranceDeg: number;
  samples: number;
  seed: number;
  model: RobustnessModel;
}

/** One precomputed run: every sample's final error in both execution models, degrees (rounded to 1e-6°). */
export interface DemoRunEntry {
  samples: number;
  openLoopErrorDeg: number[];
  feedbackErrorDeg: number[];
}

/** Precomputed runs by key. */
export type DemoRobustnessFile = Record<string, DemoRunEntry>;

/** Path of the committed precomputed runs. */
export const demoRobustnessFile = fileURLToPath(new URL('./demo-robustness.json', import.meta.url).href);

/** Digits kept per error, degrees (1e-6°: far below any figure shown). */
export const DEMO_ERROR_DIGITS = 6;

/** sha256 of the canonical JSON of a run's inputs. */
export function demoRunKey(inputs: DemoRunInputs): string {
  const { body, sequence, target, toleranceDeg, samples, seed, model } = inputs;
  return createHash('sha256').update(canonicalJson({ body, sequence, target, toleranceDeg, samples, seed, model })).digest('hex');
}

let cache: DemoRobustnessFile | null = null;
/** The committed precomputed runs (empty when the file is missing). */
export function loadDemoRobustness(): DemoRobustnessFile {
  if (!cache) {
    try {
      cache = JSON.parse(readFileSync(demoRobustnessFile, 'utf8')) as DemoRobustnessFile;
    } catch {
      cache = {};
    }
  }
  return cache;
}

/** The samples of an entry in the worker's form. */
export function entrySamples(entry: DemoRunEntry): RobustnessSample[] {
  return entry.feedbackErrorDeg.map((feedbackErrorDeg, index) => ({ index, openLoopErrorDeg: entry.openLoopErrorDeg[index], feedbackErrorDeg }));
}

/**
 * Stores a demo version's robustness run: done with the precomputed samples (chunked as a worker
 * would have stored them) when the file has its inputs, otherwise queued for the worker.
 */
export async function seedVersionRobustness(db: Database, versionId: string, run: Omit<DemoRunInputs, 'samples' | 'seed' | 'model'>, requestedBy: string | null, at: Date): Promise<'precomputed' | 'queued'> {
  const inputs: DemoRunInputs = { ...run, samples: DEFAULT_ROBUSTNESS_SAMPLES, seed: DEFAULT_ROBUSTNESS_SEED, model: DEFAULT_ROBUSTNESS_MODEL };
  const entry = loadDemoRobustness()[demoRunKey(inputs)];
  if (!entry || entry.samples !== inputs.samples) {
    await createRobustnessRun(db, { ...inputs, sequenceVersionId: versionId, requestedBy });
    return 'queued';
  }
  const samples = entrySamples(entry);
  const figures = summariseRobustness(samples, inputs.toleranceDeg);
  // Cut as a queued run would be (its largest chunk is the stored chunk size).
  const ranges = chunkRanges(inputs.samples);
  await db.transaction(async (tx) => {
    const [row] = await tx.insert(robustnessRuns).values({
      sequenceVersionId: versionId, samples: inputs.samples, chunkSize: ranges[0]?.to ?? 0, seed: inputs.seed, model: inputs.model,
      toleranceDeg: inputs.toleranceDeg, inputs: { body: inputs.body, sequence: inputs.sequence, target: [...inputs.target] },
      state: 'done', doneSamples: inputs.samples, figures, requestedBy, createdAt: at, startedAt: at, finishedAt: at,
    }).returning({ id: robustnessRuns.id });
    await tx.insert(robustnessChunks).values(ranges.map((r, i) => ({
      runId: row.id, chunkIndex: i, fromSample: r.from, toSample: r.to, state: 'done' as const, results: samples.slice(r.from, r.to), attempts: 1, finishedAt: at,
    })));
    await recordAudit(tx, {
      actorId: null, action: 'robustness.done', objectType: 'sequence_version', objectId: versionId,
      detail: { runId: row.id, samples: figures.samples, seed: inputs.seed, openLoopP95Deg: figures.openLoopP95Deg, feedbackP95Deg: figures.feedbackP95Deg, demoData: true },
    });
  });
  return 'precomputed';
}
