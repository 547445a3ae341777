/**
 * A sequence version's robustness run (mounted inside the sequences router):
 * GET    /api/sequences/versions/:versionId/robustness         newest run (404 `no_run` when none)
 * POST   /api/sequences/versions/:versionId/robustness         start a run { samples?, seed? } (planners, admins); 409 `run_open` while one runs
 * POST   /api/sequences/versions/:versionId/robustness/cancel  cancel the open run (planners, admins); 409 `no_open_run`
 * Visibility is the version's: a trainee only their own crew member's cleared versions.
 */
import { eq } from 'drizzle-orm';
import { Router } from 'express';
import { z } from 'zod';

import { robustnessRuns, sequences, sequenceVersions } from '../../db/schema/index.ts';
import type { SessionUser } from '../../shared/contracts/auth.ts';
import { startRobustnessRequestSchema } from '../../shared/contracts/robustness-run.ts';
import type { AppContext } from '../app-context.ts';
import { recordAudit } from '../audit/record-audit.ts';
import { conflict, HttpError, notFound } from '../http/http-error.ts';
import { validate } from '../http/validate.ts';
import { cancelRobustnessRun, robustnessRunView } from '../jobs/robustness/robustness-runs.ts';
import { latestVersionRun, openVersionRun, queueVersionRobustness } from '../jobs/robustness/version-robustness.ts';
import { requireAuthor, visibleVersions } from '../maneuvers/maneuver-access.ts';
import { allOf } from '../maneuvers/version-views.ts';

const versionParams = z.object({ versionId: z.uuid('Not a valid id.') });

export function robustnessRouter(ctx: AppContext): Router {
  const router = Router();
  const { db } = ctx;

  async function requireVisible(user: SessionUser, versionId: string) {
    const [row] = await db.select({ id: sequenceVersions.id }).from(sequenceVersions)
      .innerJoin(sequences, eq(sequences.id, sequenceVersions.sequenceId))
      .where(allOf(eq(sequenceVersions.id, versionId), visibleVersions(user)));
    if (!row) throw notFound('Sequence version');
  }

  router.get('/versions/:versionId/robustness', validate({ params: versionParams }), async (req, res) => {
    const { versionId } = res.locals.params;
    await requireVisible(req.user!, versionId);
    const run = await latestVersionRun(db, versionId);
    if (!run) throw new HttpError(404, 'no_run', 'No robustness run for this version yet.');
    res.json(await robustnessRunView(db, run));
  });

  router.post('/versions/:versionId/robustness', validate({ params: versionParams, body: startRobustnessRequestSchema }), async (req, res) => {
    const { versionId } = res.locals.params;
    const input = req.body;
    const user = req.user!;
    requireAuthor(user);
    await requireVisible(user, versionId);
    if (await openVersionRun(db, versionId)) throw conflict('A robustness run of this version is already queued or running; cancel it first or wait for it.', 'run_open');
    const runId = await queueVersionRobustness(ctx, versionId, { requestedBy: user.id, samples: input.samples, seed: input.seed });
    const [run] = await db.select().from(robustnessRuns).where(eq(robustnessRuns.id, runId));
    res.status(202).json(await robustnessRunView(db, run));
  });

  router.post('/versions/:versionId/robustness/cancel', validate({ params: versionParams }), async (req, res) => {
    const { versionId } = res.locals.params;
    const user = req.user!;
    requireAuthor(user);
    await requireVisible(user, versionId);
    const open = await openVersionRun(db, versionId);
    if (!open) throw conflict('No robustness run of this version is queued or running.', 'no_open_run');
    const reason = `Cancelled by ${user.name}.`;
    const cancelled = ctx.jobs?.cancelRobustness
      ? await ctx.jobs.cancelRobustness(open.id, reason)
      : await cancelRobustnessRun(ctx, null, open.id, reason);
    if (!cancelled) throw conflict('The run finished before it could be cancelled.', 'no_open_run');
    await recordAudit(db, { actorId: user.id, action: 'robustness.cancel', objectType: 'sequence_version', objectId: versionId, detail: { runId: open.id } });
    const [run] = await db.select().from(robustnessRuns).where(eq(robustnessRuns.id, open.id));
    res.json(await robustnessRunView(db, run));
  });

  return router;
}
