import { boolean, integer, jsonb, pgTable, text, unique } from 'drizzle-orm/pg-core';

import type { Body } from '../../shared/contracts/body.ts';
import { PROFILE_SOURCES, type ProfileSummary, type StoredProfileInputs } from '../../shared/contracts/profile-version.ts';
import type { SuitConfig } from '../../shared/contracts/suit.ts';
import { createdAt, instant, linkTo, rowId } from './columns.ts';
import { users } from './users.ts';

/** A person an inertia profile describes. `currentVersion` names the current profile version. */
export const crewMembers = pgTable('crew_members', {
  id: rowId(),
  name: text('name').notNull(),
  // Short call name shown in lists, e.g. a station call sign.
  callSign: text('call_sign'),
  notes: text('notes').notNull().default(''),
  currentVersion: integer('current_version'),
  createdBy: linkTo('created_by', () => users.id),
  createdAt: createdAt(),
  // Archived members leave the default crew list and take no new profile versions until restored.
  archivedAt: instant('archived_at'),
  archivedBy: linkTo('archived_by', () => users.id),
});

/** Suit configurations: added mass/inertia per segment, suited ranges, locked joints (JSON per shared/contracts/suit.ts). */
export const suitConfigs = pgTable('suit_configs', {
  id: rowId(),
  name: text('name').notNull().unique(),
  config: jsonb('config').$type<SuitConfig>().notNull(),
  illustrative: boolean('illustrative').notNull().default(true),
  // Optimistic lock: an edit names the version it started from (409 stale_version otherwise).
  version: integer('version').notNull().default(1),
  updatedBy: linkTo('updated_by', () => users.id),
  updatedAt: instant('updated_at').notNull().defaultNow(),
});

/**
 * Immutable inertia profile versions (a trigger refuses UPDATE and DELETE).
 * `inputs`: measurements, suit snapshot and gear; `body`: the derived body contract;
 * `summary`: whole-body mass, CoM and principal moments in the reference posture.
 */
export const profileVersions = pgTable(
  'profile_versions',
  {
    id: rowId(),
    crewMemberId: linkTo('crew_member_id', () => crewMembers.id).notNull(),
    version: integer('version').notNull(),
    source: text('source', { enum: PROFILE_SOURCES }).notNull().default('regression'),
    inputs: jsonb('inputs').$type<StoredProfileInputs>().notNull(),
    body: jsonb('body').$type<Body>().notNull(),
    summary: jsonb('summary').$type<ProfileSummary>().notNull(),
    engineVersion: text('engine_version').notNull(),
    authorId: linkTo('author_id', () => users.id),
    note: text('note').notNull().default(''),
    createdAt: createdAt(),
  },
  (t) => [unique('profile_versions_member_version').on(t.crewMemberId, t.version)],
);

export type CrewMemberRow = typeof crewMembers.$inferSelect;
export type SuitConfigRow = typeof suitConfigs.$inferSelect;
export type ProfileVersionRow = typeof profileVersions.$inferSelect;
