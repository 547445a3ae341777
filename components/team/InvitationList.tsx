import { View } from 'react-native';

import { useTeamInvitationsQuery } from '@/components/api/use-team';
import { formatDate } from '@/components/format/date-time';
import { spacing } from '@/components/theme';
import { Badge } from '@/components/ui/Badge';
import { EmptyState } from '@/components/ui/EmptyState';
import { ErrorBanner } from '@/components/ui/ErrorBanner';
import { Icon } from '@/components/ui/Icon';
import { ListRow } from '@/components/ui/ListRow';
import { LoadingState } from '@/components/ui/LoadingState';
import { ROLE_LABELS } from '@/shared/contracts/roles';
import { INVITATION_STATE_BADGE, invitationState } from './invitation-state';

/** Invitations, newest first, with their state (waiting, joined, expired) and who sent them. */
export function InvitationList() {
  const invitations = useTeamInvitationsQuery();
  if (invitations.isPending) return <LoadingState label="Loading invitations…" />;
  if (invitations.isError) {
    return <ErrorBanner title="Could not load invitations" error={invitations.error} onRetry={() => void invitations.refetch()} />;
  }
  if (invitations.data.length === 0) {
    return <EmptyState icon="mail" title="No invitations yet" body="Invitations you send appear here until the person joins or the link expires." />;
  }
  return (
    <View style={{ gap: spacing.xxs }} role="list" aria-label="Invitations">
      {invitations.data.map((inv) => {
        const state = invitationState(inv);
        const badge = INVITATION_STATE_BADGE[state];
        const when = state === 'accepted' && inv.acceptedAt ? `joined ${formatDate(inv.acceptedAt)}` : state === 'open' ? `valid until ${formatDate(inv.expiresAt)}` : `expired ${formatDate(inv.expiresAt)}`;
        return (
          <ListRow
            key={inv.id}
            title={`${inv.name} · ${ROLE_LABELS[inv.role]}`}
            subtitle={`${inv.email} — ${when}, by ${inv.invitedBy}`}
            leading={<Icon name={state === 'accepted' ? 'user-check' : 'send'} size={18} color="#8AA0B4" />}
            trailing={<Badge label={badge.label} tone={badge.tone} />}
          />
        );
      })}
    </View>
  );
}
