import type { BadgeTone } from '@/components/ui/Badge';
import type { Invitation, InvitationMailState } from '@/shared/contracts/team';

/** Where an invitation stands: waiting for the invitee, used, withdrawn, or past its expiry. */
export type InvitationState = 'open' | 'accepted' | 'revoked' | 'expired';

/** The state of an invitation at time `now` (ms since epoch). */
export function invitationState(inv: Pick<Invitation, 'acceptedAt' | 'expiresAt'> & { revokedAt?: string | null }, now: number = Date.now()): InvitationState {
  if (inv.acceptedAt) return 'accepted';
  if (inv.revokedAt) return 'revoked';
  return new Date(inv.expiresAt).getTime() <= now ? 'expired' : 'open';
}

/** Badge label and tone for each state. */
export const INVITATION_STATE_BADGE: Record<InvitationState, { label: string; tone: BadgeTone }> = {
  open: { label: 'Waiting', tone: 'accent' },
  accepted: { label: 'Joined', tone: 'success' },
  revoked: { label: 'Revoked', tone: 'neutral' },
  expired: { label: 'Expired', tone: 'neutral' },
};

/** Badge label and tone for the delivery of an open invitation's e-mail. */
export const MAIL_STATE_BADGE: Record<InvitationMailState, { label: string; tone: BadgeTone }> = {
  sending: { label: 'Sending e-mail', tone: 'teal' },
  sent: { label: 'E-mail sent', tone: 'success' },
  failed: { label: 'E-mail failed', tone: 'danger' },
};
