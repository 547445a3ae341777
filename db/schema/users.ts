import { boolean, integer, pgEnum, pgTable, text, timestamp, uuid } from 'drizzle-orm/pg-core';

import { ROLES } from '../../shared/contracts/roles.ts';

export const roleEnum = pgEnum('role', ROLES);

/** People who sign in. `tokenVersion` is bumped to revoke every JWT issued before. */
export const users = pgTable('users', {
  id: uuid('id').primaryKey().defaultRandom(),
  email: text('email').notNull().unique(),
  name: text('name').notNull(),
  passwordHash: text('password_hash').notNull(),
  role: roleEnum('role').notNull(),
  disabled: boolean('disabled').notNull().default(false),
  tokenVersion: integer('token_version').notNull().default(0),
  // A trainee is linked to the crew member they are; the FK is added in crew.ts's migration order.
  crewMemberId: uuid('crew_member_id'),
  createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
});

/** E-mailed invitations; only the SHA-256 of the secret token is stored. */
export const invitations = pgTable('invitations', {
  id: uuid('id').primaryKey().defaultRandom(),
  email: text('email').notNull(),
  name: text('name').notNull(),
  role: roleEnum('role').notNull(),
  crewMemberId: uuid('crew_member_id'),
  tokenHash: text('token_hash').notNull().unique(),
  invitedBy: uuid('invited_by').notNull().references(() => users.id),
  createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  expiresAt: timestamp('expires_at', { withTimezone: true }).notNull(),
  acceptedAt: timestamp('accepted_at', { withTimezone: true }),
});

export type UserRow = typeof users.$inferSelect;
export type InvitationRow = typeof invitations.$inferSelect;
