import { desc, eq } from 'drizzle-orm';
import { Router } from 'express';
import { z } from 'zod';

import { crewMembers, uploadRows, uploads } from '../../db/schema/index.ts';
import { readStored } from '../../db/stored-json.ts';
import type { StoredProfileInputs } from '../../shared/contracts/profile-version.ts';
import { type ImportedRowResult, type UploadResult, uploadRowDataSchema } from '../../shared/contracts/uploads.ts';
import type { AppContext } from '../app-context.ts';
import { recordAudit } from '../audit/record-audit.ts';
import { appendProfileVersion } from '../crew/append-profile-version.ts';
import { readableMember } from '../crew/crew-access.ts';
import { getVersion } from '../crew/crew-queries.ts';
import { summarizeBody } from '../crew/profile-summary.ts';
import { HttpError, notFound } from '../http/http-error.ts';
import { validate } from '../http/validate.ts';
import { type FlaggedVersions, sendRecheckJobs, staleVersionsOf } from '../maneuvers/flag-recheck.ts';
import { planMeasurementImport } from '../uploads/measurement-rows.ts';
import { receiveFile } from '../uploads/receive-file.ts';
import { recordRejectedUpload, rejectUpload } from '../uploads/reject-upload.ts';
import { measuredBodyFromCsv, measuredBodyFromJson } from '../uploads/segment-table.ts';
import { storeRawFile, uploadValues, uploadView } from '../uploads/stored-file.ts';
import { mountRecordingUploads } from './recording-uploads.ts';

const idParams = z.object({ id: z.string().uuid('Not a valid upload id.') });
const segmentTableFields = z.object({
  crewMemberId: z.string().uuid('Choose a crew member.'),
  baseVersion: z.coerce.number().int('baseVersion must be a whole number.').min(0),
  note: z.string().trim().max(2000).default(''),
});

/**
 * Uploads (planners and admins): a measurements CSV creating or updating several crew members, or a
 * measured segment table (CSV or contract JSON) replacing the regression for one member. The raw
 * file always goes to object storage first; a file with any bad row imports nothing (one
 * transaction) and is recorded as rejected with its errors.
 */
export function uploadsRouter(ctx: AppContext): Router {
  const router = Router();
  const { db } = ctx;

  router.get('/', async (_req, res) => {
    const rows = await db.select().from(uploads).orderBy(desc(uploads.createdAt)).limit(50);
    res.json({ uploads: rows.map(uploadView) });
  });

  router.get('/:id', validate({ params: idParams }), async (_req, res) => {
    const { id } = res.locals.params;
    const [row] = await db.select().from(uploads).where(eq(uploads.id, id));
    if (!row) throw notFound('Upload');
    const stored = await db.select({ row: uploadRows.rowNumber, data: uploadRows.data }).from(uploadRows).where(eq(uploadRows.uploadId, id)).orderBy(uploadRows.rowNumber);
    const rows = stored.map((r) => ({ row: r.row, data: readStored(uploadRowDataSchema, r.data, 'upload_rows.data', `upload ${id} row ${r.row}`) }));
    res.json({ upload: uploadView(row), rows });
  });

  // The raw file as uploaded, from object storage.
  router.get('/:id/raw', validate({ params: idParams }), async (_req, res) => {
    const { id } = res.locals.params;
    const [row] = await db.select().from(uploads).where(eq(uploads.id, id));
    if (!row) throw notFound('Upload');
    const bytes = await ctx.storage.get(row.objectKey);
    res.attachment(row.fileName).type(row.contentType).send(bytes);
  });

  // Joint-angle CSV and BVH recordings (issue 15).
  mountRecordingUploads(router, ctx);

  router.post('/measurements', receiveFile(['.csv']), async (req, res) => {
    const me = req.user!;
    const file = await storeRawFile(ctx, 'measurements_csv', req.file!);
    const { plans, errors, rowCount } = await planMeasurementImport(db, file.text);
    if (errors.length) return rejectUpload(ctx, res, file, rowCount, errors, me.id);

    let result;
    try {
      result = await db.transaction(async (tx) => {
        const [upload] = await tx.insert(uploads).values(uploadValues(file, 'imported', rowCount, [], me.id)).returning();
        await tx.insert(uploadRows).values(plans.map((p) => ({ uploadId: file.id, rowNumber: p.row, data: p.cells })));
        const out: ImportedRowResult[] = [];
        const evs: FlaggedVersions[] = [];
        for (const p of plans) {
          let memberId = p.existingMemberId;
          if (!memberId) {
            const [m] = await tx.insert(crewMembers).values({ name: p.name, callSign: p.callSign || null, createdBy: me.id }).returning({ id: crewMembers.id });
            memberId = m.id;
          }
          // Imports build on whatever is latest; the row lock in appendProfileVersion still serialises them.
          const [locked] = await tx.select({ v: crewMembers.currentVersion }).from(crewMembers).where(eq(crewMembers.id, memberId)).for('update');
          const { row, flagged } = await appendProfileVersion(tx, {
            crewMemberId: memberId, baseVersion: locked.v ?? 0, source: 'regression', inputs: p.profile.inputs,
            body: p.profile.body, summary: p.profile.summary, note: p.note || `Imported from ${file.fileName}, row ${p.row}`, authorId: me.id,
          });
          out.push({ row: p.row, crewMemberId: memberId, name: p.name, action: p.existingMemberId ? 'updated' : 'created', version: row.version });
          evs.push(flagged);
        }
        await recordAudit(tx, { actorId: me.id, action: 'upload.import', objectType: 'upload', objectId: file.id, detail: { fileName: file.fileName, rows: out.length } });
        return { upload, out, evs };
      });
    } catch (err) {
      if (err instanceof HttpError) return rejectUpload(ctx, res, file, rowCount, [{ row: 0, column: '', reason: err.message }], me.id);
      throw err;
    }
    await sendRecheckJobs(ctx, result.evs);
    const body: UploadResult = { upload: uploadView(result.upload), imported: result.out, staleVersions: await staleVersionsOf(db, result.evs) };
    res.status(201).json(body);
  });

  router.post('/segment-table', receiveFile(['.csv', '.json']), validate({ body: segmentTableFields }), async (req, res) => {
    const me = req.user!;
    const fields = req.body;
    const member = await readableMember(db, me, fields.crewMemberId);
    const isJson = req.file!.originalname.toLowerCase().endsWith('.json');
    const current = member.currentVersion ? await getVersion(db, member.id, member.currentVersion) : null;
    if (!isJson && !current) {
      throw new HttpError(409, 'no_profile', `${member.name} has no profile yet: a segment table CSV replaces the mass properties of an existing body. Save a profile first, or upload a complete contract JSON body.`, 'crewMemberId');
    }
    const file = await storeRawFile(ctx, isJson ? 'segment_table_json' : 'segment_table_csv', req.file!);
    const measured = isJson ? measuredBodyFromJson(file.text) : measuredBodyFromCsv(file.text, current!.version.body);
    if (measured.errors.length || !measured.body) return rejectUpload(ctx, res, file, measured.rows.length, measured.errors, me.id);

    const previous = (current?.version.inputs ?? {});
    const inputs: StoredProfileInputs = { ...previous, measuredTable: { uploadId: file.id, fileName: file.fileName, segments: measured.segments } };
    const body = { ...measured.body, name: measured.body.name || member.name };
    let result;
    try {
      result = await db.transaction(async (tx) => {
        const [upload] = await tx.insert(uploads).values(uploadValues(file, 'imported', measured.rows.length, [], me.id)).returning();
        if (measured.rows.length) await tx.insert(uploadRows).values(measured.rows.map((r) => ({ uploadId: file.id, rowNumber: r.row, data: r.data })));
        const appended = await appendProfileVersion(tx, {
          crewMemberId: member.id, baseVersion: fields.baseVersion, source: 'measured', inputs, body,
          summary: summarizeBody(body, 'measured'), note: fields.note || `Measured segment table ${file.fileName}`, authorId: me.id,
        });
        await recordAudit(tx, { actorId: me.id, action: 'upload.import', objectType: 'upload', objectId: file.id, detail: { fileName: file.fileName, crewMemberId: member.id, version: appended.row.version } });
        return { upload, appended };
      });
    } catch (err) {
      if (err instanceof HttpError && err.status === 409) {
        // The profile moved on meanwhile: keep the record of the attempt, then answer the 409.
        await recordRejectedUpload(ctx, file, measured.rows.length, [{ row: 0, column: '', reason: err.message }], me.id);
      }
      throw err;
    }
    await sendRecheckJobs(ctx, [result.appended.flagged]);
    const imported: ImportedRowResult[] = [{ row: 0, crewMemberId: member.id, name: member.name, action: 'updated', version: result.appended.row.version }];
    res.status(201).json({ upload: uploadView(result.upload), imported, staleVersions: await staleVersionsOf(db, [result.appended.flagged]) } satisfies UploadResult);
  });

  return router;
}
