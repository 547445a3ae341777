import { useState } from 'react';
import { StyleSheet, View } from 'react-native';

import { useInvitationActionMutation, useTeamInvitationsQuery } from '@/components/api/use-team';
import { formatDate, formatDateTime } from '@/components/format/date-time';
import { colors, gaps, spacing } from '@/components/theme';
import { Badge } from '@/components/ui/Badge';
import { Button } from '@/components/ui/Button';
import { EmptyState } from '@/components/ui/EmptyState';
import { ErrorBanner } from '@/components/ui/ErrorBanner';
import { Icon } from '@/components/ui/Icon';
import { ListRow } from '@/components/ui/ListRow';
import { LoadingState } from '@/components/ui/LoadingState';
import { Text } from '@/components/ui/Text';
import { ROLE_LABELS } from '@/shared/contracts/roles';
import type { Invitation } from '@/shared/contracts/team';

import { INVITATION_STATE_BADGE, invitationState, MAIL_STATE_BADGE } from './invitation-state';

/** What the admin reads about the e-mail of an open invitation. */
function mailLine(inv: Invitation): string {
  if (inv.mailState === 'sent') return inv.mailSentAt ? `Handed to the mail server ${formatDateTime(inv.mailSentAt)}.` : 'Handed to the mail server.';
  if (inv.mailState === 'failed') return `The e-mail could not be sent after ${inv.mailAttempts} attempts${inv.mailError ? ` (${inv.mailError})` : ''}. Resend it once mail works, or revoke it.`;
  return inv.mailAttempts > 0 && inv.mailError
    ? `Sending: attempt ${inv.mailAttempts} failed (${inv.mailError}); trying again shortly.`
    : 'Sending the e-mail…';
}

/** One open invitation's delivery, with resend and revoke (revoke asks first). */
function OpenInvitationActions({ inv }: { inv: Invitation }) {
  const action = useInvitationActionMutation();
  const [confirmRevoke, setConfirmRevoke] = useState(false);
  const mail = MAIL_STATE_BADGE[inv.mailState];
  return (
    <View style={styles.actions}>
      <View style={styles.mailLine}>
        <Badge label={mail.label} tone={mail.tone} />
        <Text variant="caption" tone={inv.mailState === 'failed' ? 'danger' : 'muted'} style={styles.flex}>{mailLine(inv)}</Text>
      </View>
      {confirmRevoke ? (
        <View style={styles.buttons}>
          <Text variant="caption">Revoke the invitation for {inv.email}? Its link stops working.</Text>
          <Button label="Revoke" size="sm" variant="danger" loading={action.isPending} onPress={() => action.mutate({ id: inv.id, action: 'revoke' }, { onSuccess: () => setConfirmRevoke(false) })} />
          <Button label="Keep" size="sm" variant="secondary" onPress={() => setConfirmRevoke(false)} />
        </View>
      ) : (
        <View style={styles.buttons}>
          <Button label="Resend" icon="refresh-cw" size="sm" variant="secondary" loading={action.isPending && action.variables?.action === 'resend'}
            onPress={() => action.mutate({ id: inv.id, action: 'resend' })} accessibilityLabel={`Resend the invitation to ${inv.email}`} />
          <Button label="Revoke" icon="x-circle" size="sm" variant="ghost" onPress={() => setConfirmRevoke(true)} accessibilityLabel={`Revoke the invitation to ${inv.email}`} />
        </View>
      )}
      {action.isError ? <ErrorBanner error={action.error} /> : null}
    </View>
  );
}

/** Invitations, newest first, with their state, the delivery of their e-mail, and resend / revoke. */
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
    <View style={gaps.xxs} role="list" aria-label="Invitations">
      {invitations.data.map((inv) => {
        const state = invitationState(inv);
        const badge = INVITATION_STATE_BADGE[state];
        const when = state === 'accepted' && inv.acceptedAt ? `joined ${formatDate(inv.acceptedAt)}`
          : state === 'revoked' && inv.revokedAt ? `revoked ${formatDate(inv.revokedAt)}`
          : state === 'open' ? `valid until ${formatDate(inv.expiresAt)}` : `expired ${formatDate(inv.expiresAt)}`;
        return (
          <View key={inv.id} role="listitem" aria-label={`Invitation for ${inv.email}`} style={styles.item}>
            <ListRow
              title={`${inv.name} · ${ROLE_LABELS[inv.role]}`}
              subtitle={`${inv.email} — ${when}, by ${inv.invitedBy}`}
              leading={<Icon name={state === 'accepted' ? 'user-check' : 'send'} size={18} color="#8AA0B4" />}
              trailing={<Badge label={badge.label} tone={badge.tone} />}
            />
            {state === 'open' ? <OpenInvitationActions inv={inv} /> : null}
          </View>
        );
      })}
    </View>
  );
}

const styles = StyleSheet.create({
  item: { gap: spacing.xs, paddingBottom: spacing.xs, borderBottomWidth: StyleSheet.hairlineWidth, borderBottomColor: colors.border },
  actions: { gap: spacing.xs, paddingLeft: spacing.xl },
  mailLine: { flexDirection: 'row', alignItems: 'center', gap: spacing.sm, flexWrap: 'wrap' },
  buttons: { flexDirection: 'row', alignItems: 'center', gap: spacing.sm, flexWrap: 'wrap' },
  flex: { flexShrink: 1 },
});
