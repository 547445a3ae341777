import { doublePrecision, jsonb, pgTable, text, timestamp, uuid } from 'drizzle-orm/pg-core';

import type { RehearsalCapture } from '../../shared/contracts/recording.ts';
import { rehearsals } from './sequences.ts';
import { uploads } from './uploads.ts';
import { users } from './users.ts';

/**
 * A recording attached to a rehearsal log (issue 15): the executed joint-angle track, and what it
 * would have done in free fall (`capture`: outcomes per profile version, step timing, overlay),
 * with a reviewer's sign-off.
 */
export const rehearsalCaptures = pgTable('rehearsal_captures', {
  id: uuid('id').primaryKey().defaultRandom(),
  rehearsalId: uuid('rehearsal_id').notNull().unique().references(() => rehearsals.id),
  uploadId: uuid('upload_id').notNull().references(() => uploads.id),
  rateHz: doublePrecision('rate_hz').notNull(),
  dofs: jsonb('dofs').$type<string[]>().notNull(),
  frames: jsonb('frames').$type<number[][]>().notNull(),
  capture: jsonb('capture').$type<Omit<RehearsalCapture, 'signedOff'>>().notNull(),
  signedOffBy: uuid('signed_off_by').references(() => users.id),
  signedOffAt: timestamp('signed_off_at', { withTimezone: true }),
  signOffNote: text('sign_off_note'),
  createdBy: uuid('created_by').notNull().references(() => users.id),
  createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
});

export type RehearsalCaptureRow = typeof rehearsalCaptures.$inferSelect;
