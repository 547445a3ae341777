import { Router } from 'express';
import { z } from 'zod';

import { motionQuerySchema, type MotionResponse } from '../../shared/contracts/motion.ts';
import type { AppContext } from '../app-context.ts';
import { buildMotion } from '../motion/build-motion.ts';
import { MotionCache } from '../motion/motion-cache.ts';
import { loadVersionFor } from '../motion/version-access.ts';
import { validate } from '../http/validate.ts';

const params = z.object({ versionId: z.string().uuid('Not a valid version id.') });

/**
 * GET /api/motion/:versionId?rate=30 — samples, body, steps and cues for the 3D view, simulated by
 * the engine's worker pool and cached in memory. Trainees: only cleared versions of their own crew member.
 */
export function motionRouter(ctx: AppContext): Router {
  const router = Router();
  const { db } = ctx;
  const cache = new MotionCache<MotionResponse>();

  router.get('/:versionId', validate({ params, query: motionQuerySchema }), async (req, res) => {
    const { versionId } = res.locals.params as z.infer<typeof params>;
    const { rate } = res.locals.query as z.infer<typeof motionQuerySchema>;
    const v = await loadVersionFor(db, req.user!, versionId);
    const motion = await cache.get(MotionCache.key(v.id, v.profileVersionId, rate), () => buildMotion(v, rate));
    // Samples are immutable per key; the status may have moved on (cleared → recheck).
    res.set('Cache-Control', 'private, max-age=0');
    res.json({ ...motion, status: v.status });
  });

  return router;
}
