import { Router } from 'express';
import { z } from 'zod';

import { motionQuerySchema } from '../../shared/contracts/motion.ts';
import type { AppContext } from '../app-context.ts';
import { notFound } from '../http/http-error.ts';
import { RawJson, ReadCache, sendCachedJson } from '../http/read-cache.ts';
import { validate } from '../http/validate.ts';
import { buildMotion } from '../maneuvers/build-motion.ts';
import { assertRehearsable } from '../maneuvers/maneuver-access.ts';
import { MotionCache } from '../maneuvers/motion-cache.ts';
import { loadStoredVersion, loadVersionAccess } from '../maneuvers/stored-version.ts';

const params = z.object({ versionId: z.string().uuid('Not a valid version id.') });

/**
 * GET /api/motion/:versionId?rate= — the verified samples stored with the version, body, steps and
 * cues for the 3D view. Trainees: only cleared versions of their own crew member's maneuvers that are
 * not archived (assertRehearsable). Answered through the read cache like the other signed-in reads
 * (while nothing was written, a repeat reads nothing but the guard's user row); under it, the motion itself is kept as JSON text per version and rate,
 * since a version's verified samples never change.
 */
export function motionRouter(ctx: AppContext): Router {
  const router = Router();
  const { db } = ctx;
  const reads = new ReadCache();
  // The motion without its status and the running engine, serialised once.
  const motions = new MotionCache<{ json: string; engineVersion: string }>();

  router.get('/:versionId', validate({ params, query: motionQuerySchema }), async (req, res) => {
    const { versionId } = res.locals.params;
    const { rate } = res.locals.query;
    await sendCachedJson(reads, req, res, async () => {
      const access = await loadVersionAccess(db, versionId);
      if (!access) throw notFound('Sequence version');
      assertRehearsable(req.user!, access);
      const motion = await motions.get(MotionCache.key(access.id, rate), async () => {
        const v = await loadStoredVersion(db, versionId);
        if (!v) throw notFound('Sequence version');
        const built = buildMotion(v, rate);
        return { json: JSON.stringify(built), engineVersion: built.engineVersion };
      });
      // The status may have moved on (cleared → recheck) and the engine may have changed since the
      // verification: both are added to the motion's text (the running engine is part of the key).
      const live = { status: access.status, runningEngineVersion: ctx.engineVersion, verifiedByOtherEngine: motion.engineVersion !== ctx.engineVersion };
      return new RawJson(`${motion.json.slice(0, -1)},${JSON.stringify(live).slice(1)}`);
    }, ctx.engineVersion);
  });

  return router;
}
