import type { Response } from 'express';

import { uploads } from '../../db/schema/index.ts';
import type { UploadRowError, UploadView } from '../../shared/contracts/uploads.ts';
import type { AppContext } from '../app-context.ts';
import { recordAudit } from '../audit/record-audit.ts';
import { type StoredFile, uploadValues, uploadView } from './stored-file.ts';

/** "row 3, column mass_kg: reason" — one error as a phrase. */
export function describeRowError(e: UploadRowError): string {
  const where = [e.row > 0 ? `row ${e.row}` : 'file', e.column ? `column ${e.column}` : ''].filter(Boolean).join(', ');
  return `${where}: ${e.reason}`;
}

/**
 * Records a rejected upload: metadata and every error, sorted by row (the raw file is already in
 * object storage). Nothing else is written.
 */
export async function recordRejectedUpload(ctx: AppContext, file: StoredFile, rowCount: number, errors: UploadRowError[], actorId: string): Promise<UploadView> {
  const sorted = [...errors].sort((a, b) => a.row - b.row);
  const [row] = await ctx.db.transaction(async (tx) => {
    const inserted = await tx.insert(uploads).values(uploadValues(file, 'rejected', rowCount, sorted, actorId)).returning();
    await recordAudit(tx, { actorId, action: 'upload.reject', objectType: 'upload', objectId: file.id, detail: { fileName: file.fileName, errors: sorted.length } });
    return inserted;
  });
  return uploadView(row);
}

/** Records the rejection and answers 422 with `{ error, upload, imported: [] }`; the error message names the first problem. */
export async function rejectUpload(ctx: AppContext, res: Response, file: StoredFile, rowCount: number, errors: UploadRowError[], actorId: string) {
  const upload = await recordRejectedUpload(ctx, file, rowCount, errors, actorId);
  const n = upload.errors.length;
  const message = `"${file.fileName}" has ${n} problem${n === 1 ? '' : 's'}; nothing was imported. Fix ${n === 1 ? 'it' : 'them'} and upload the file again. First: ${describeRowError(upload.errors[0])}.`;
  res.status(422).json({ error: { code: 'upload_rejected', message, field: 'file' }, upload, imported: [] });
}
