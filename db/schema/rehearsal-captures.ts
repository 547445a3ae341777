import { doublePrecision, jsonb, pgTable, text } from 'drizzle-orm/pg-core';

import type { CaptureTrack, StoredCaptureInput } from '../../shared/contracts/recording.ts';
import { createdAt, instant, linkTo, rowId } from './columns.ts';
import { rehearsals } from './sequences.ts';
import { uploads } from './uploads.ts';
import { users } from './users.ts';

/**
 * A recording attached to a rehearsal log (issue 15): the executed joint-angle track, and what it
 * would have done in free fall (`capture`: outcomes per profile version, step timing, overlay),
 * with a reviewer's sign-off.
 */
export const rehearsalCaptures = pgTable('rehearsal_captures', {
  id: rowId(),
  rehearsalId: linkTo('rehearsal_id', () => rehearsals.id).notNull().unique(),
  uploadId: linkTo('upload_id', () => uploads.id).notNull(),
  rateHz: doublePrecision('rate_hz').notNull(),
  dofs: jsonb('dofs').$type<CaptureTrack['dofs']>().notNull(),
  frames: jsonb('frames').$type<CaptureTrack['frames']>().notNull(),
  capture: jsonb('capture').$type<StoredCaptureInput>().notNull(),
  signedOffBy: linkTo('signed_off_by', () => users.id),
  signedOffAt: instant('signed_off_at'),
  signOffNote: text('sign_off_note'),
  createdBy: linkTo('created_by', () => users.id).notNull(),
  createdAt: createdAt(),
});

export type RehearsalCaptureRow = typeof rehearsalCaptures.$inferSelect;
