import { useState } from 'react';
import { StyleSheet, View } from 'react-native';

import { useMemberArchiveMutation } from '@/components/api/use-crew';
import { formatDateTime } from '@/components/format/date-time';
import { colors, radii, spacing } from '@/components/theme';
import { Button } from '@/components/ui/Button';
import { ErrorBanner } from '@/components/ui/ErrorBanner';
import { Text } from '@/components/ui/Text';
import type { CrewMemberView } from '@/shared/contracts/crew';

/**
 * Archive (with an in-place confirmation) or restore a crew member. Archiving keeps every profile
 * version, maneuver and approval; it only takes the member and their maneuvers out of the lists in use.
 */
export function MemberArchive({ member }: { member: CrewMemberView }) {
  const action = useMemberArchiveMutation(member.id);
  const [asking, setAsking] = useState(false);
  if (member.archivedAt) {
    return (
      <View style={styles.box} testID="archived-notice">
        <Text variant="label">Archived {formatDateTime(member.archivedAt)}</Text>
        <Text variant="caption" tone="muted">
          Read-only: no new profile versions or maneuvers. Their maneuvers wait under Maneuvers → Archived. Restore to work with {member.name} again.
        </Text>
        <View style={styles.row}>
          <Button label="Restore" icon="rotate-ccw" size="sm" variant="secondary" loading={action.isPending} onPress={() => action.mutate('restore')} />
        </View>
        {action.isError ? <ErrorBanner error={action.error} /> : null}
      </View>
    );
  }
  if (!asking) {
    return (
      <View style={styles.row}>
        <Button label="Archive" icon="archive" size="sm" variant="ghost" onPress={() => setAsking(true)} accessibilityLabel={`Archive ${member.name}`} />
      </View>
    );
  }
  return (
    <View style={styles.box} role="alert">
      <Text variant="label">Archive {member.name}?</Text>
      <Text variant="caption" tone="muted">
        {member.name} and their maneuvers leave the lists in use; nothing is deleted, and Restore brings everything back.
      </Text>
      <View style={styles.row}>
        <Button label="Archive" icon="archive" size="sm" variant="danger" loading={action.isPending} onPress={() => action.mutate('archive', { onSuccess: () => setAsking(false) })} />
        <Button label="Keep" size="sm" variant="secondary" onPress={() => setAsking(false)} />
      </View>
      {action.isError ? <ErrorBanner error={action.error} /> : null}
    </View>
  );
}

const styles = StyleSheet.create({
  row: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', gap: spacing.sm },
  box: { gap: spacing.xs, padding: spacing.md, borderRadius: radii.md, borderWidth: 1, borderColor: colors.border, backgroundColor: colors.mutedTint },
});
