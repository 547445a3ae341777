/**
 * /api/jobs (admins): background work — plans, robustness runs, re-verifications — with state,
 * progress and reasons, and the queues' job counts.
 * GET  /api/jobs?filter=open|failed|done
 * POST /api/jobs/:kind/:id/retry   (failed or cancelled → queued again)
 * POST /api/jobs/:kind/:id/cancel  (queued or running → cancelled)
 */
import { Router } from 'express';
import { z } from 'zod';

import { WORK_KINDS, workListQuerySchema } from '../../shared/contracts/background-work.ts';
import type { AppContext } from '../app-context.ts';
import { validate } from '../http/validate.ts';
import { cancelBackgroundWork, listBackgroundWork, retryBackgroundWork } from '../jobs/background-work.ts';

const itemParams = z.object({
  kind: z.enum(WORK_KINDS, { error: 'kind must be plan, robustness or reverification' }),
  id: z.uuid('Not a valid id.'),
});

export function jobsRouter(ctx: AppContext): Router {
  const router = Router();

  router.get('/', validate({ query: workListQuerySchema }), async (_req, res) => {
    const { filter } = res.locals.query;
    res.json(await listBackgroundWork(ctx, filter));
  });

  router.post('/:kind/:id/retry', validate({ params: itemParams }), async (req, res) => {
    const { kind, id } = res.locals.params;
    await retryBackgroundWork(ctx, kind, id, req.user!);
    res.status(202).json({ ok: true });
  });

  router.post('/:kind/:id/cancel', validate({ params: itemParams }), async (req, res) => {
    const { kind, id } = res.locals.params;
    await cancelBackgroundWork(ctx, kind, id, req.user!);
    res.json({ ok: true });
  });

  return router;
}
