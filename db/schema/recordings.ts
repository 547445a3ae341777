import { doublePrecision, index, jsonb, pgTable, text, timestamp, uuid } from 'drizzle-orm/pg-core';

import type { BvhMapping } from '../../shared/contracts/recording.ts';
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
    id: uuid('id').primaryKey().defaultRandom(),
    uploadId: uuid('upload_id').notNull().references(() => uploads.id),
    name: text('name').notNull(),
    // joint_angles_csv | bvh
    source: text('source').notNull(),
    crewMemberId: uuid('crew_member_id').references(() => crewMembers.id),
    rateHz: doublePrecision('rate_hz').notNull(),
    dofs: jsonb('dofs').$type<string[]>().notNull(),
    frames: jsonb('frames').$type<number[][]>().notNull(),
    assumptions: jsonb('assumptions').$type<string[]>().notNull().default([]),
    mapping: jsonb('mapping').$type<BvhMapping>(),
    createdBy: uuid('created_by').notNull().references(() => users.id),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('recordings_created_idx').on(t.createdAt)],
);

export type RecordingRow = typeof recordings.$inferSelect;
