import { useState } from 'react';
import { StyleSheet, View } from 'react-native';

import { useCrewListQuery } from '@/components/api/use-crew';
import { useSessionQuery } from '@/components/api/use-session';
import { useTeamUsersQuery, useUpdateUserMutation } from '@/components/api/use-team';
import { formatDate } from '@/components/format/date-time';
import { colors, gaps, spacing } from '@/components/theme';
import { Avatar } from '@/components/ui/Avatar';
import { Badge } from '@/components/ui/Badge';
import { Button } from '@/components/ui/Button';
import { Card } from '@/components/ui/Card';
import { EmptyState } from '@/components/ui/EmptyState';
import { ErrorBanner } from '@/components/ui/ErrorBanner';
import { SegmentedControl } from '@/components/ui/SegmentedControl';
import { Sheet } from '@/components/ui/Sheet';
import { Text } from '@/components/ui/Text';
import { type Role, ROLE_LABELS } from '@/shared/contracts/roles';

import { CrewMemberPicker } from './CrewMemberPicker';
import { ROLE_OPTIONS } from './role-options';

/** Props of {@link TeamMemberDetail}. */
export interface TeamMemberDetailProps {
  userId: string;
}

/** One person: role change and disable/enable (with a confirmation), never for oneself. */
export function TeamMemberDetail({ userId }: TeamMemberDetailProps) {
  const users = useTeamUsersQuery();
  const me = useSessionQuery().data;
  const update = useUpdateUserMutation();
  const member = users.data?.find((u) => u.id === userId);
  // The crew member picked but not saved yet (null: showing the saved link).
  const [pendingCrew, setPendingCrew] = useState<string | null>(null);
  const crew = useCrewListQuery('');
  // The role picked but not saved yet (null: showing the saved role). The parent keys this component by user id.
  const [pendingRole, setPendingRole] = useState<Role | null>(null);
  const [confirming, setConfirming] = useState(false);
  const [saved, setSaved] = useState<string | null>(null);

  if (!member) {
    return users.isPending ? null : <EmptyState icon="user-x" title="This person is not in the list" body="They may have been removed. Pick someone else." />;
  }
  const isMe = member.id === me?.id;
  const role = pendingRole ?? member.role;
  const toggleDisabled = () =>
    update.mutate(
      { id: member.id, change: { disabled: !member.disabled } },
      {
        onSuccess: ({ user }) => {
          setConfirming(false);
          setSaved(user.disabled ? `${user.name} is disabled and signed out everywhere.` : `${user.name} can sign in again.`);
        },
        onError: () => setConfirming(false),
      },
    );

  return (
    <View style={gaps.lg}>
      <View style={styles.head}>
        <Avatar name={member.name} size={52} dimmed={member.disabled} />
        <View style={styles.titles}>
          <Text variant="title" role="heading" aria-level={2}>
            {member.name}
          </Text>
          <Text tone="muted">{member.email}</Text>
          <View style={styles.badges}>
            <Badge label={ROLE_LABELS[member.role]} tone={member.role === 'admin' ? 'accent' : 'teal'} />
            {member.disabled ? <Badge label="Disabled" tone="danger" icon="slash" /> : <Badge label="Active" tone="success" />}
            {isMe ? <Badge label="You" /> : null}
          </View>
          <Text variant="caption" tone="muted">
            Member since {formatDate(member.createdAt)}
          </Text>

        </View>
      </View>

      {saved ? (
        <View role="status">
          <Text tone="success">{saved}</Text>
        </View>
      ) : null}
      <ErrorBanner error={update.error} />

      <Card title="Role" subtitle={isMe ? 'You cannot change your own role.' : 'Changing the role signs the person out; they sign in again with the new access.'}>
        <SegmentedControl label="Role" hideLabel options={ROLE_OPTIONS} value={role} onChange={setPendingRole} disabled={isMe || update.isPending} />
        <Button
          label="Save role"
          size="sm"
          disabled={isMe || role === member.role}
          loading={update.isPending && update.variables?.change.role !== undefined}
          onPress={() =>
            update.mutate(
              { id: member.id, change: { role } },
              {
                onSuccess: ({ user }) => {
                  setPendingRole(null);
                  setSaved(`${user.name} is now ${ROLE_LABELS[user.role]}.`);
                },
              },
            )
          }
        />
      </Card>

      {member.role === 'trainee' ? (
        <Card
          title="Crew member"
          subtitle={member.crewMemberId ? 'The profile and cleared maneuvers this trainee sees. Changing it takes effect at once.' : 'Not linked yet, so this trainee has nothing to rehearse.'}
        >
          <CrewMemberPicker value={pendingCrew ?? member.crewMemberId ?? ''} onChange={(id) => setPendingCrew(id)} exceptUserId={member.id} />
          <Button
            label="Save crew member"
            size="sm"
            disabled={!pendingCrew || pendingCrew === member.crewMemberId}
            loading={update.isPending && update.variables?.change.crewMemberId !== undefined}
            onPress={() =>
              pendingCrew &&
              update.mutate(
                { id: member.id, change: { crewMemberId: pendingCrew } },
                {
                  onSuccess: ({ user }) => {
                    setPendingCrew(null);
                    setSaved(`${user.name} now sees ${crew.data?.find((m) => m.id === user.crewMemberId)?.name ?? 'the chosen crew member'}.`);
                  },
                },
              )
            }
          />
        </Card>
      ) : null}

      <Card
        title="Access"
        subtitle={
          member.disabled
            ? 'This account cannot sign in. Enabling it lets the person sign in with their password again.'
            : 'Disabling signs the person out at once and blocks sign-in. Their work and the audit trail stay.'
        }
      >
        {member.disabled ? (
          <Button label="Enable account" icon="unlock" variant="secondary" size="sm" disabled={isMe} loading={update.isPending} onPress={toggleDisabled} accessibilityLabel={`Enable ${member.name}`} />
        ) : (
          <Button label="Disable account" icon="slash" variant="danger" size="sm" disabled={isMe} onPress={() => setConfirming(true)} accessibilityLabel={`Disable ${member.name}`} />
        )}
      </Card>

      <Sheet
        visible={confirming}
        onClose={() => setConfirming(false)}
        title={`Disable ${member.name}?`}
        footer={
          <>
            <Button label="Keep active" variant="ghost" onPress={() => setConfirming(false)} />
            <Button label="Disable" variant="danger" icon="slash" loading={update.isPending} onPress={toggleDisabled} />
          </>
        }
      >
        <Text>
          {member.name} is signed out on every device and cannot sign in until an administrator enables the account again.
        </Text>
      </Sheet>
    </View>
  );
}

const styles = StyleSheet.create({
  head: { flexDirection: 'row', gap: spacing.lg, alignItems: 'flex-start', paddingBottom: spacing.sm, borderBottomWidth: 1, borderBottomColor: colors.border },
  titles: { flex: 1, gap: spacing.xs },
  badges: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.xs, marginTop: spacing.xs },
});
