import { Router } from 'express';
import { z } from 'zod';

import { motionQuerySchema } from '../../shared/contracts/motion.ts';
import type { AppContext } from '../app-context.ts';
import { buildMotion } from '../motion/build-motion.ts';
import { MotionCache } from '../motion/motion-cache.ts';
import { loadVersion, versionAccessFor } from '../motion/version-access.ts';
import { notFound } from '../http/http-error.ts';
import { validate } from '../http/validate.ts';

const params = z.object({ versionId: z.string().uuid('Not a valid version id.') });

/**
 * GET /api/motion/:versionId?rate=30 — samples, body, steps and cues for the 3D view, simulated by
 * the engine's worker pool and cached in memory as JSON text. Trainees: only cleared versions of
 * their own crew member. A cached request reads only the version's status and owner.
 */
export function motionRouter(ctx: AppContext): Router {
  const router = Router();
  const { db } = ctx;
  // The motion without its status, serialised once: samples are immutable per key.
  const cache = new MotionCache<string>();

  router.get('/:versionId', validate({ params, query: motionQuerySchema }), async (req, res) => {
    const { versionId } = res.locals.params as z.infer<typeof params>;
    const { rate } = res.locals.query as z.infer<typeof motionQuerySchema>;
    const access = await versionAccessFor(db, req.user!, versionId);
    const key = MotionCache.key(access.id, access.profileVersionId, rate);
    const json = await cache.get(key, async () => {
      const v = await loadVersion(db, versionId);
      if (!v) throw notFound('Sequence version');
      const { status: _status, ...motion } = await buildMotion(v, rate, ctx.simulation.product);
      return JSON.stringify(motion);
    });
    // The status may have moved on (cleared → recheck): it is added to the cached text per request.
    const body = `${json.slice(0, -1)},"status":${JSON.stringify(access.status)}}`;
    // Cached text: the ETag names the key and status instead of hashing the body on every request.
    res.set('Cache-Control', 'private, max-age=0');
    res.set('ETag', `"${Buffer.from(`${key}|${access.status}`).toString('base64url')}"`);
    if (req.fresh) {
      res.status(304).end();
      return;
    }
    res.type('application/json').send(body);
  });

  return router;
}
