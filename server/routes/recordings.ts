/**
 * Recorded joint-angle tracks (staff): list, one recording with its frames, and (BVH) a new mapping,
 * which re-reads the raw file from object storage and replaces the track in one update.
 */
import { desc, eq } from 'drizzle-orm';
import { Router } from 'express';
import { z } from 'zod';

import { recordings, uploads } from '../../db/schema/index.ts';
import { bvhMappingSchema } from '../../shared/contracts/recording.ts';
import { TRACK_LIMITS } from '../../shared/contracts/sequence.ts';
import type { AppContext } from '../app-context.ts';
import { recordAudit } from '../audit/record-audit.ts';
import { HttpError, notFound } from '../http/http-error.ts';
import { validate } from '../http/validate.ts';
import { readBvh } from '../recordings/bvh-file.ts';
import { bvhTrack } from '../recordings/bvh-track.ts';
import { recordingView } from '../recordings/recording-view.ts';

const idParams = z.object({ id: z.string().uuid('Not a valid recording id.') });
const mappingBody = z.object({
  mapping: bvhMappingSchema,
  rateHz: z.number().min(TRACK_LIMITS.minRateHz).max(TRACK_LIMITS.maxRateHz).optional(),
});

/** The recordings API. */
export function recordingsRouter(ctx: AppContext): Router {
  const router = Router();
  const { db } = ctx;

  /** A recording row with its upload's file name and storage key. */
  async function load(id: string) {
    const [r] = await db.select({ rec: recordings, fileName: uploads.fileName, objectKey: uploads.objectKey })
      .from(recordings).innerJoin(uploads, eq(uploads.id, recordings.uploadId)).where(eq(recordings.id, id));
    if (!r) throw notFound('Recording');
    return r;
  }

  router.get('/', async (_req, res) => {
    const rows = await db.select({ rec: recordings, fileName: uploads.fileName }).from(recordings)
      .innerJoin(uploads, eq(uploads.id, recordings.uploadId)).orderBy(desc(recordings.createdAt)).limit(100);
    // The list leaves the frames out.
    res.json({ recordings: rows.map((r) => ({ ...recordingView(r.rec, r.fileName), frames: [], frameCount: r.rec.frames.length })) });
  });

  router.get('/:id', validate({ params: idParams }), async (_req, res) => {
    const { id } = res.locals.params;
    const r = await load(id);
    const joints = r.rec.source === 'bvh' ? readBvh((await ctx.storage.get(r.objectKey)).toString('utf8')).motion?.joints ?? null : null;
    res.json({ recording: recordingView(r.rec, r.fileName, joints) });
  });

  router.put('/:id/mapping', validate({ params: idParams, body: mappingBody }), async (req, res) => {
    const { id } = res.locals.params;
    const { mapping, rateHz } = req.body;
    const r = await load(id);
    if (r.rec.source !== 'bvh') throw new HttpError(409, 'not_bvh', 'Only a BVH recording has a joint mapping.', 'mapping');
    const read = readBvh((await ctx.storage.get(r.objectKey)).toString('utf8'));
    if (!read.motion) throw new HttpError(422, 'file_unreadable', 'The stored BVH file can no longer be read.', 'mapping');
    const track = bvhTrack(read.motion, mapping, rateHz ?? r.rec.rateHz);
    if (!track.ok) throw new HttpError(400, 'bad_mapping', `The mapping cannot be used: ${track.issues.join('; ')}.`, 'mapping');
    const [rec] = await db.transaction(async (tx) => {
      const updated = await tx.update(recordings).set({
        mapping, rateHz: track.rateHz, dofs: track.dofs, frames: track.frames, assumptions: track.assumptions, updatedAt: new Date(),
      }).where(eq(recordings.id, id)).returning();
      await recordAudit(tx, { actorId: req.user!.id, action: 'recording.remap', objectType: 'recording', objectId: id, detail: { joints: mapping.joints, facing: mapping.facing } });
      return updated;
    });
    res.json({ recording: recordingView(rec, r.fileName, read.motion.joints) });
  });

  return router;
}
