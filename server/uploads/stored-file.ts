import { createHash, randomUUID } from 'node:crypto';

import { z } from 'zod';

import type { UploadRow } from '../../db/schema/index.ts';
import { readStored } from '../../db/stored-json.ts';
import { type UploadKind, type UploadRowError, uploadRowErrorSchema, type UploadView } from '../../shared/contracts/uploads.ts';
import type { AppContext } from '../app-context.ts';
import { safeFileName } from './receive-file.ts';

/** A received file after it was written to object storage. */
export interface StoredFile {
  id: string;
  kind: UploadKind;
  objectKey: string;
  fileName: string;
  contentType: string;
  sizeBytes: number;
  sha256: string;
  text: string;
}

/**
 * Writes the raw bytes to object storage under uploads/<id>/<file name> before anything is parsed,
 * so every upload — imported or rejected — can be fetched and inspected later.
 */
export async function storeRawFile(ctx: AppContext, kind: UploadKind, file: Express.Multer.File): Promise<StoredFile> {
  const id = randomUUID();
  const fileName = safeFileName(file.originalname);
  const objectKey = `uploads/${id}/${fileName}`;
  const lower = fileName.toLowerCase();
  const contentType = lower.endsWith('.json') ? 'application/json' : lower.endsWith('.bvh') ? 'text/plain' : 'text/csv';
  await ctx.storage.put(objectKey, file.buffer, contentType);
  return {
    id,
    kind,
    objectKey,
    fileName,
    contentType,
    sizeBytes: file.size,
    sha256: createHash('sha256').update(file.buffer).digest('hex'),
    text: file.buffer.toString('utf8'),
  };
}

/** The uploads row for a stored file. */
export function uploadValues(f: StoredFile, status: 'imported' | 'rejected', rowCount: number, errors: UploadRowError[], uploadedBy: string) {
  return {
    id: f.id, kind: f.kind, objectKey: f.objectKey, fileName: f.fileName, contentType: f.contentType,
    sizeBytes: f.sizeBytes, sha256: f.sha256, status, rowCount, errors, uploadedBy,
  };
}

/** An uploads row for the API. */
export function uploadView(row: UploadRow): UploadView {
  return {
    id: row.id,
    kind: row.kind,
    fileName: row.fileName,
    contentType: row.contentType,
    sizeBytes: row.sizeBytes,
    sha256: row.sha256,
    objectKey: row.objectKey,
    status: row.status,
    rowCount: row.rowCount,
    errors: readStored(z.array(uploadRowErrorSchema), row.errors, 'uploads.errors', `upload ${row.id}`),
    uploadedBy: row.uploadedBy,
    createdAt: row.createdAt.toISOString(),
  };
}
