import type { BadgeTone } from '@/components/ui/Badge';
import type { Invitation } from '@/shared/contracts/team';

/** Where an invitation stands: waiting for the invitee, used, or past its expiry. */
export type InvitationState = 'open' | 'accepted' | 'expired';

/** The state of an invitation at time `now` (ms since epoch). */
export function invitationState(inv: Pick<Invitation, 'acceptedAt' | 'expiresAt'>, now: number = Date.now()): InvitationState {
  if (inv.acceptedAt) return 'accepted';
  return new Date(inv.expiresAt).getTime() <= now ? 'expired' : 'open';
}

/** Badge label and tone for each state. */
export const INVITATION_STATE_BADGE: Record<InvitationState, { label: string; tone: BadgeTone }> = {
  open: { label: 'Waiting', tone: 'accent' },
  accepted: { label: 'Joined', tone: 'success' },
  expired: { label: 'Expired', tone: 'neutral' },
};
