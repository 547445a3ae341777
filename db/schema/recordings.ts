import { doublePrecision, index, jsonb, pgTable, text } from 'drizzle-orm/pg-core';

import { type BvhMapping, RECORDING_SOURCES } from '../../shared/contracts/recording.ts';
import { createdAt, instant, linkTo, rowId } from './columns.ts';
import { crewMembers } from './crew.ts';
import { uploads } from './uploads.ts';
import { users } from './users.ts';

/**
 * A recorded joint-angle track (issue 15), imported from a joint-angle CSV or a BVH file (the raw
 * file: `uploadId`'s object; per-frame rows: upload_rows). `frames` is the uniform-rate track on the
 * standard model's dofs, degrees; BVH recordings keep the mapping that produced it.
 */
export const recordings = pgTable(
  'recordings',
  {
    id: rowId(),
    uploadId: linkTo('upload_id', () => uploads.id).notNull(),
    name: text('name').notNull(),
    // joint_angles_csv | bvh
    source: text('source', { enum: RECORDING_SOURCES }).notNull(),
    crewMemberId: linkTo('crew_member_id', () => crewMembers.id),
    rateHz: doublePrecision('rate_hz').notNull(),
    dofs: jsonb('dofs').$type<string[]>().notNull(),
    frames: jsonb('frames').$type<number[][]>().notNull(),
    assumptions: jsonb('assumptions').$type<string[]>().notNull().default([]),
    mapping: jsonb('mapping').$type<BvhMapping>(),
    createdBy: linkTo('created_by', () => users.id).notNull(),
    createdAt: createdAt(),
    updatedAt: instant('updated_at').notNull().defaultNow(),
  },
  (t) => [index('recordings_created_idx').on(t.createdAt)],
);

export type RecordingRow = typeof recordings.$inferSelect;
