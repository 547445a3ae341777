/**
 * /api/sequences/:sequenceId/archive, /restore and DELETE /api/sequences/:sequenceId (a maneuver
 * that never went to review). The rules are in server/maneuvers/archive-sequence.ts.
 */
import { Router } from 'express';
import { z } from 'zod';

import type { AppContext } from '../app-context.ts';
import { validate } from '../http/validate.ts';
import { deleteDraftSequence, setSequenceArchived } from '../maneuvers/archive-sequence.ts';

const params = z.object({ sequenceId: z.uuid('Not a valid id.') });

/** Builds the router (mounted inside the sequences router). */
export function sequenceArchiveRouter(ctx: AppContext): Router {
  const router = Router();

  router.post('/:sequenceId/archive', validate({ params }), async (req, res) => {
    const { sequenceId } = res.locals.params;
    await setSequenceArchived(ctx, req.user!, sequenceId, true);
    res.status(204).end();
  });

  router.post('/:sequenceId/restore', validate({ params }), async (req, res) => {
    const { sequenceId } = res.locals.params;
    await setSequenceArchived(ctx, req.user!, sequenceId, false);
    res.status(204).end();
  });

  router.delete('/:sequenceId', validate({ params }), async (req, res) => {
    const { sequenceId } = res.locals.params;
    await deleteDraftSequence(ctx, req.user!, sequenceId);
    res.status(204).end();
  });

  return router;
}
