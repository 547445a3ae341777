/**
 * The robustness run of a sequence version: queued when the version is saved (and on request), read
 * by the report, cancelled on request. One record per run; the version's figure is its newest run.
 */
import { and, desc, eq, inArray } from 'drizzle-orm';

import type { Database } from '../../../db/client.ts';
import { type RobustnessRunRow,robustnessRuns } from '../../../db/schema/index.ts';
import { levelOf, type VersionRobustness } from '../../../shared/contracts/robustness.ts';
import type { AppContext } from '../../app-context.ts';
import { recordAudit } from '../../audit/record-audit.ts';
import { loadStoredVersion } from '../../maneuvers/stored-version.ts';
import { createRobustnessRun, OPEN_STATES, runFigures, runModel, versionRunInputs } from './robustness-runs.ts';

/** The newest run of a version, or null. */
export async function latestVersionRun(db: Database, versionId: string): Promise<RobustnessRunRow | null> {
  const [run] = await db.select().from(robustnessRuns).where(eq(robustnessRuns.sequenceVersionId, versionId))
    .orderBy(desc(robustnessRuns.createdAt)).limit(1);
  return run ?? null;
}

/** The newest run of a version as its report shows it (`report.robustness`), or null when none was ever queued. */
export async function versionRobustness(db: Database, versionId: string): Promise<VersionRobustness | null> {
  const run = await latestVersionRun(db, versionId);
  if (!run) return null;
  const f = run.state === 'done' ? runFigures(run) : null;
  const feedbackP95Deg = f?.feedbackP95Deg ?? null;
  return {
    runId: run.id,
    state: run.state,
    progress: run.state === 'done' ? 1 : run.doneSamples / Math.max(1, run.samples),
    openLoopP95Deg: f?.openLoopP95Deg ?? null,
    feedbackP95Deg,
    p50Deg: f?.p50Deg ?? null,
    withinToleranceShare: f?.withinToleranceShare ?? null,
    samples: run.samples,
    seed: run.seed,
    model: runModel(run),
    toleranceDeg: run.toleranceDeg,
    level: levelOf(feedbackP95Deg, run.toleranceDeg),
    error: run.error,
  };
}

/** The version's open run, or null. */
export async function openVersionRun(db: Database, versionId: string): Promise<RobustnessRunRow | null> {
  const [run] = await db.select().from(robustnessRuns)
    .where(and(eq(robustnessRuns.sequenceVersionId, versionId), inArray(robustnessRuns.state, [...OPEN_STATES])))
    .orderBy(desc(robustnessRuns.createdAt)).limit(1);
  return run ?? null;
}

/**
 * Creates a run for the version and hands its chunks to the queue (when this process has one; a
 * worker's reconciliation picks up a run saved without one). Returns the run id.
 */
export async function queueVersionRobustness(ctx: AppContext, versionId: string, opts: { requestedBy?: string | null; samples?: number; seed?: number; chunkSize?: number } = {}): Promise<string> {
  const v = await loadStoredVersion(ctx.db, versionId);
  if (!v) throw new Error(`sequence version ${versionId} not found`);
  const runId = await createRobustnessRun(ctx.db, { ...versionRunInputs(v), requestedBy: opts.requestedBy ?? null,
    samples: opts.samples ?? ctx.config.ROBUSTNESS_SAMPLES, seed: opts.seed, chunkSize: opts.chunkSize ?? ctx.config.ROBUSTNESS_CHUNK_SIZE,
  });
  await recordAudit(ctx.db, { actorId: opts.requestedBy ?? null, action: 'robustness.queued', objectType: 'sequence_version', objectId: versionId, detail: { runId, samples: opts.samples ?? ctx.config.ROBUSTNESS_SAMPLES, seed: opts.seed ?? null } });
  await ctx.jobs?.enqueueRobustness?.(runId);
  return runId;
}

/** Queues the run after a save without failing the save (the version is stored; the report offers a new run). */
export async function queueRobustnessAfterSave(ctx: AppContext, versionId: string, requestedBy: string): Promise<void> {
  try {
    await queueVersionRobustness(ctx, versionId, { requestedBy });
  } catch (err) {
    ctx.logger.error({ err, versionId }, 'queueing the robustness run of a saved version failed');
  }
}
