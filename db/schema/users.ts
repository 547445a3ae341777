import { sql } from 'drizzle-orm';
import { boolean, integer, pgEnum, pgTable, text, uniqueIndex, uuid } from 'drizzle-orm/pg-core';

import { ROLES } from '../../shared/contracts/roles.ts';
import { createdAt, instant, linkTo, rowId } from './columns.ts';

export const roleEnum = pgEnum('role', ROLES);

/** People who sign in. `tokenVersion` is bumped to revoke every JWT issued before. */
export const users = pgTable('users', {
  id: rowId(),
  email: text('email').notNull().unique(),
  name: text('name').notNull(),
  passwordHash: text('password_hash').notNull(),
  role: roleEnum('role').notNull(),
  disabled: boolean('disabled').notNull().default(false),
  tokenVersion: integer('token_version').notNull().default(0),
  // A trainee is linked to the crew member they are; the FK is added in crew.ts's migration order.
  crewMemberId: uuid('crew_member_id'),
  createdAt: createdAt(),
});

/** Delivery of an invitation's e-mail (the row is the outbox; a pg-boss job retries the send). */
export const INVITATION_MAIL_STATES = ['sending', 'sent', 'failed'] as const;
export const invitationMailStateEnum = pgEnum('invitation_mail_state', INVITATION_MAIL_STATES);

/**
 * E-mailed invitations; only the SHA-256 of the secret token is stored (each send makes a new token,
 * so no plain token waits in the outbox). One address has at most one invitation that is neither
 * accepted nor revoked (expired ones are revoked when the address is invited again).
 */
export const invitations = pgTable('invitations', {
  id: rowId(),
  email: text('email').notNull(),
  name: text('name').notNull(),
  role: roleEnum('role').notNull(),
  crewMemberId: uuid('crew_member_id'),
  tokenHash: text('token_hash').notNull().unique(),
  invitedBy: linkTo('invited_by', () => users.id).notNull(),
  createdAt: createdAt(),
  expiresAt: instant('expires_at').notNull(),
  acceptedAt: instant('accepted_at'),
  revokedAt: instant('revoked_at'),
  revokedBy: linkTo('revoked_by', () => users.id),
  mailState: invitationMailStateEnum('mail_state').notNull().default('sending'),
  mailAttempts: integer('mail_attempts').notNull().default(0),
  /** The last delivery error, for the admin (no secrets: the mailer's message). */
  mailError: text('mail_error'),
  mailSentAt: instant('mail_sent_at'),
}, (t) => [
  uniqueIndex('invitations_one_open_per_email').on(t.email).where(sql`${t.acceptedAt} IS NULL AND ${t.revokedAt} IS NULL`),
]);

export type UserRow = typeof users.$inferSelect;
export type InvitationRow = typeof invitations.$inferSelect;
