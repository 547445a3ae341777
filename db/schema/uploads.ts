import { integer, jsonb, pgTable, text } from 'drizzle-orm/pg-core';

import { UPLOAD_KINDS, UPLOAD_STATUSES, type UploadRowData, type UploadRowError } from '../../shared/contracts/uploads.ts';
import { createdAt, linkTo, rowId } from './columns.ts';
import { users } from './users.ts';

/** A stored file: the raw bytes live in object storage under `objectKey`; parsed rows below. */
export const uploads = pgTable('uploads', {
  id: rowId(),
  // measurements_csv | segment_table_csv | segment_table_json | joint_angles_csv
  kind: text('kind', { enum: UPLOAD_KINDS }).notNull(),
  objectKey: text('object_key').notNull().unique(),
  fileName: text('file_name').notNull(),
  contentType: text('content_type').notNull(),
  sizeBytes: integer('size_bytes').notNull(),
  sha256: text('sha256').notNull(),
  // imported | rejected
  status: text('status', { enum: UPLOAD_STATUSES }).notNull(),
  rowCount: integer('row_count').notNull().default(0),
  errors: jsonb('errors').$type<UploadRowError[]>().notNull().default([]),
  uploadedBy: linkTo('uploaded_by', () => users.id),
  createdAt: createdAt(),
});

/** Parsed rows of an imported upload, one JSON object per data row (1-based row numbers as in the file). */
export const uploadRows = pgTable('upload_rows', {
  id: rowId(),
  uploadId: linkTo('upload_id', () => uploads.id).notNull(),
  rowNumber: integer('row_number').notNull(),
  data: jsonb('data').$type<UploadRowData>().notNull(),
});

export type UploadRow = typeof uploads.$inferSelect;
