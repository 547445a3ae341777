/**
 * /api/reviews (reviewers and admins): the queue of versions under review, decisions and comments
 * (shapes in shared/contracts/maneuver.ts). A reviewer never decides on a version they authored.
 */
import { eq } from 'drizzle-orm';
import { Router } from 'express';
import { z } from 'zod';

import { sequenceVersions } from '../../db/schema/index.ts';
import { reviewCommentRequestSchema, reviewDecisionRequestSchema, type ReviewQueueItem } from '../../shared/contracts/maneuver.ts';
import type { AppContext } from '../app-context.ts';
import { ReadCache, sendCachedJson } from '../http/read-cache.ts';
import { validate } from '../http/validate.ts';
import { commentVersion, decideVersion } from '../maneuvers/version-actions.ts';
import { loadVersionDetail } from '../maneuvers/version-detail.ts';
import { selectVersions, toSequenceHead, toVersionSummary } from '../maneuvers/version-views.ts';

const versionParams = z.object({ versionId: z.uuid('Not a valid id.') });

/** Builds the router. */
export function reviewsRouter(ctx: AppContext): Router {
  const router = Router();
  const { db } = ctx;
  const reads = new ReadCache();

  router.get('/queue', async (req, res) => {
    await sendCachedJson(reads, req, res, async () => {
      // One query: the versions under review with their sequences joined in.
      const rows = await selectVersions(db, eq(sequenceVersions.status, 'under_review'));
      const items: ReviewQueueItem[] = rows
        .map((row) => ({ version: toVersionSummary(row), sequence: toSequenceHead(row) }))
        .sort((a, b) => (a.version.submittedAt ?? '').localeCompare(b.version.submittedAt ?? ''));
      return { items };
    });
  });

  router.post('/:versionId/decision', validate({ params: versionParams, body: reviewDecisionRequestSchema }), async (req, res) => {
    const { versionId } = res.locals.params;
    const input = req.body;
    await decideVersion(ctx, req.user!, versionId, input.decision, input.comment);
    res.json(await loadVersionDetail(db, req.user!, versionId));
  });

  router.post('/:versionId/comments', validate({ params: versionParams, body: reviewCommentRequestSchema }), async (req, res) => {
    const { versionId } = res.locals.params;
    await commentVersion(ctx, req.user!, versionId, (req.body).comment);
    res.json(await loadVersionDetail(db, req.user!, versionId));
  });

  return router;
}
