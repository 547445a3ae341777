import { z } from 'zod';

import { emailSchema, passwordSchema, sessionUserSchema } from './auth.ts';
import { roleSchema } from './roles.ts';

/** A user row as the Team screen shows it. */
export const teamMemberSchema = sessionUserSchema.extend({
  disabled: z.boolean(),
  createdAt: z.string(),
});
export type TeamMember = z.infer<typeof teamMemberSchema>;

/** POST /api/team/invitations (admin). */
export const inviteRequestSchema = z.object({
  email: emailSchema,
  name: z.string().trim().min(1, 'Enter the person\'s name.').max(120),
  role: roleSchema,
  crewMemberId: sessionUserSchema.shape.crewMemberId.optional(),
});
export type InviteRequest = z.infer<typeof inviteRequestSchema>;

/** Delivery of the invitation e-mail: queued or being retried, delivered to the mail server, or given up. */
export const invitationMailStateSchema = z.enum(['sending', 'sent', 'failed']);
export type InvitationMailState = z.infer<typeof invitationMailStateSchema>;

/**
 * GET /api/invitations/:token — what the invitee sees before choosing a password: the user the
 * invitation will make (e-mail, name, role).
 */
export const invitationPreviewSchema = sessionUserSchema.pick({ email: true, name: true, role: true });
export type InvitationPreview = z.infer<typeof invitationPreviewSchema>;

/** An open or used invitation as listed to admins: the user it will make, who invited them, when, and the mail's delivery. */
export const invitationSchema = invitationPreviewSchema.extend({
  id: z.string().uuid(),
  invitedBy: z.string(),
  createdAt: z.string(),
  expiresAt: z.string(),
  acceptedAt: z.string().nullable(),
  revokedAt: z.string().nullable(),
  mailState: invitationMailStateSchema,
  /** Send attempts so far. */
  mailAttempts: z.number().int(),
  /** Why the last attempt failed (null after a successful send). */
  mailError: z.string().nullable(),
  mailSentAt: z.string().nullable(),
});
export type Invitation = z.infer<typeof invitationSchema>;

/** POST /api/invitations/:token/accept */
export const acceptInvitationRequestSchema = z.object({ password: passwordSchema });
export type AcceptInvitationRequest = z.infer<typeof acceptInvitationRequestSchema>;

/**
 * PATCH /api/team/users/:id (admin). `crewMemberId` links a trainee to the crew member whose profile
 * and maneuvers they see (null unlinks); it does not sign the person out, unlike a role change.
 */
export const updateUserRequestSchema = z
  .object({ role: roleSchema.optional(), disabled: z.boolean().optional(), crewMemberId: sessionUserSchema.shape.crewMemberId.optional() })
  .refine((v) => v.role !== undefined || v.disabled !== undefined || v.crewMemberId !== undefined, { message: 'Give a role, a disabled flag or a crew member.' });
export type UpdateUserRequest = z.infer<typeof updateUserRequestSchema>;

/** GET /api/audit query (admin). */
export const auditQuerySchema = z.object({
  actorId: z.string().uuid().optional(),
  action: z.string().max(80).optional(),
  objectType: z.string().max(40).optional(),
  objectId: z.string().max(80).optional(),
  since: z.iso.datetime().optional(),
  until: z.iso.datetime().optional(),
  limit: z.coerce.number().int().min(1).max(500).default(100),
});
export type AuditQuery = z.infer<typeof auditQuerySchema>;

/** What an audit event adds about its action (ids, counts, names): an object, by key. */
export const auditDetailSchema = z.record(z.string(), z.unknown());
export type AuditDetail = z.infer<typeof auditDetailSchema>;

export const auditEventSchema = z.object({
  id: z.number(),
  at: z.string(),
  actorId: z.string().nullable(),
  actorEmail: z.string().nullable(),
  /** The actor's name; null for the system. */
  actorName: z.string().nullable().default(null),
  action: z.string(),
  objectType: z.string(),
  objectId: z.string().nullable(),
  /** The object's name as it reads now ("'Quarter turn left' v2"), or null when gone or unnamed. */
  objectLabel: z.string().nullable().default(null),
  detail: z.unknown(),
});
export type AuditEvent = z.infer<typeof auditEventSchema>;
