import { Router } from 'express';
import { z } from 'zod';

import { motionQuerySchema } from '../../shared/contracts/motion.ts';
import type { AppContext } from '../app-context.ts';
import { notFound } from '../http/http-error.ts';
import { validate } from '../http/validate.ts';
import { buildMotion } from '../motion/build-motion.ts';
import { MotionCache } from '../motion/motion-cache.ts';
import { loadVersion, versionAccessFor } from '../motion/version-access.ts';

const params = z.object({ versionId: z.string().uuid('Not a valid version id.') });

/**
 * GET /api/motion/:versionId?rate= — the verified samples stored with the version, body, steps and
 * cues for the 3D view, cached in memory as JSON text. Trainees: only cleared versions of their own
 * crew member. A cached request reads only the version's status and owner.
 */
export function motionRouter(ctx: AppContext): Router {
  const router = Router();
  const { db } = ctx;
  // The motion without its status and the running engine, serialised once: a version's verified samples never change.
  const cache = new MotionCache<{ json: string; engineVersion: string }>();

  router.get('/:versionId', validate({ params, query: motionQuerySchema }), async (req, res) => {
    const { versionId } = res.locals.params;
    const { rate } = res.locals.query;
    const access = await versionAccessFor(db, req.user!, versionId);
    const key = MotionCache.key(access.id, rate);
    const motion = await cache.get(key, async () => {
      const v = await loadVersion(db, versionId);
      if (!v) throw notFound('Sequence version');
      const built = buildMotion(v, rate);
      return { json: JSON.stringify(built), engineVersion: built.engineVersion };
    });
    // The status may have moved on (cleared → recheck) and the engine may have changed since the
    // verification: both are added to the cached text per request.
    const live = { status: access.status, runningEngineVersion: ctx.engineVersion, verifiedByOtherEngine: motion.engineVersion !== ctx.engineVersion };
    const body = `${motion.json.slice(0, -1)},${JSON.stringify(live).slice(1)}`;
    // Cached text: the ETag names the key, status and running engine instead of hashing the body on every request.
    res.set('Cache-Control', 'private, max-age=0');
    res.set('ETag', `"${Buffer.from(`${key}|${access.status}|${ctx.engineVersion}`).toString('base64url')}"`);
    if (req.fresh) {
      res.status(304).end();
      return;
    }
    res.type('application/json').send(body);
  });

  return router;
}
