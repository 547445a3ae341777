/**
 * POST /api/uploads/joint-angles (a joint-angle CSV) and POST /api/uploads/bvh (a BVH file with the
 * default mapping): the raw file to object storage first, then all or nothing — a file with any
 * problem imports nothing and is recorded as rejected with every error by row and column.
 */
import type { Router } from 'express';

import { recordings, uploadRows, uploads } from '../../db/schema/index.ts';
import { type BvhMapping, recordingUploadFieldsSchema } from '../../shared/contracts/recording.ts';
import type { UploadRowData, UploadRowError } from '../../shared/contracts/uploads.ts';
import type { AppContext } from '../app-context.ts';
import { recordAudit } from '../audit/record-audit.ts';
import { readableMember } from '../crew/crew-access.ts';
import { validate } from '../http/validate.ts';
import { readBvh } from '../recordings/bvh-file.ts';
import { defaultBvhMapping } from '../recordings/bvh-mapping.ts';
import { bvhTrack } from '../recordings/bvh-track.ts';
import { readJointAngleCsv } from '../recordings/joint-angle-csv.ts';
import { recordingView } from '../recordings/recording-view.ts';
import { receiveFile } from '../uploads/receive-file.ts';
import { rejectUpload } from '../uploads/reject-upload.ts';
import { type StoredFile, storeRawFile, uploadValues, uploadView } from '../uploads/stored-file.ts';

type Fields = { name?: string; rateHz?: number; crewMemberId?: string };

/** Stores an accepted recording: upload row, parsed rows, the recording, the audit line, in one transaction. */
async function saveRecording(
  ctx: AppContext, file: StoredFile, actorId: string, fields: Fields, source: 'joint_angles_csv' | 'bvh',
  parsedRows: { row: number; data: UploadRowData }[], track: { rateHz: number; dofs: string[]; frames: number[][]; assumptions: string[] }, mapping: BvhMapping | null,
) {
  return ctx.db.transaction(async (tx) => {
    const [upload] = await tx.insert(uploads).values(uploadValues(file, 'imported', parsedRows.length, [], actorId)).returning();
    // Rows in batches (a long recording has thousands of frames).
    for (let k = 0; k < parsedRows.length; k += 1000) {
      await tx.insert(uploadRows).values(parsedRows.slice(k, k + 1000).map((r) => ({ uploadId: file.id, rowNumber: r.row, data: r.data })));
    }
    const [rec] = await tx.insert(recordings).values({
      uploadId: file.id, name: fields.name || file.fileName.replace(/\.[^.]+$/, ''), source, crewMemberId: fields.crewMemberId ?? null,
      rateHz: track.rateHz, dofs: track.dofs, frames: track.frames, assumptions: track.assumptions, mapping, createdBy: actorId,
    }).returning();
    await recordAudit(tx, { actorId, action: 'upload.import', objectType: 'upload', objectId: file.id, detail: { fileName: file.fileName, recordingId: rec.id, frames: track.frames.length } });
    return { upload, rec };
  });
}

/** Adds the recording upload routes to the uploads router (planners and admins). */
export function mountRecordingUploads(router: Router, ctx: AppContext): void {
  router.post('/joint-angles', receiveFile(['.csv']), validate({ body: recordingUploadFieldsSchema }), async (req, res) => {
    const me = req.user!;
    const fields = req.body;
    if (fields.crewMemberId) await readableMember(ctx.db, me, fields.crewMemberId);
    const file = await storeRawFile(ctx, 'joint_angles_csv', req.file!);
    const t = readJointAngleCsv(file.text, fields.rateHz);
    if (t.errors.length) return rejectUpload(ctx, res, file, t.rows.length, t.errors, me.id);
    const { upload, rec } = await saveRecording(ctx, file, me.id, fields, 'joint_angles_csv', t.rows.map((r) => ({ row: r.row, data: r.cells })), t, null);
    res.status(201).json({ upload: uploadView(upload), recording: recordingView(rec, file.fileName) });
  });

  router.post('/bvh', receiveFile(['.bvh']), validate({ body: recordingUploadFieldsSchema }), async (req, res) => {
    const me = req.user!;
    const fields = req.body;
    if (fields.crewMemberId) await readableMember(ctx.db, me, fields.crewMemberId);
    const file = await storeRawFile(ctx, 'bvh', req.file!);
    const read = readBvh(file.text);
    if (!read.motion) return rejectUpload(ctx, res, file, 0, read.errors, me.id);
    const motion = read.motion;
    const mapping = defaultBvhMapping(motion.joints.map((j) => j.name));
    const track = bvhTrack(motion, mapping, fields.rateHz);
    if (!track.ok) {
      const errors: UploadRowError[] = track.issues.map((reason) => ({ row: 0, column: 'mapping', reason: `${reason} (the default mapping expects Hips, Spine/Chest, LeftArm, LeftForeArm, LeftUpLeg, LeftLeg and the Right… joints)` }));
      return rejectUpload(ctx, res, file, motion.frameCount, errors, me.id);
    }
    // Parsed rows: one per file frame, the mapped dof angles (degrees) at the file's rate.
    const { rateHz: _r, ...atFileRate } = bvhTrack(motion, mapping) as Extract<ReturnType<typeof bvhTrack>, { ok: true }>;
    const rows = atFileRate.frames.map((f, k) => ({ row: k + 1, data: Object.fromEntries(atFileRate.dofs.map((d, j) => [d, f[j]])) }));
    const { upload, rec } = await saveRecording(ctx, file, me.id, fields, 'bvh', rows, track, mapping);
    res.status(201).json({ upload: uploadView(upload), recording: recordingView(rec, file.fileName, motion.joints) });
  });
}
