import { StyleSheet, View } from 'react-native';

import { colors, radii, spacing } from '@/components/theme';
import { Badge } from '@/components/ui/Badge';
import { Text } from '@/components/ui/Text';
import { ROLE_LABELS } from '@/shared/contracts/role-labels';
import type { InvitationPreview } from '@/shared/contracts/team';

/** Props of {@link InvitationSummary}. */
export interface InvitationSummaryProps {
  invitation: InvitationPreview;
}

/** Who the invitation is for: e-mail (the future sign-in name) and the role it grants. */
export function InvitationSummary({ invitation }: InvitationSummaryProps) {
  return (
    <View style={styles.box}>
      <View style={styles.row}>
        <Text variant="caption" tone="muted" style={styles.key}>
          Sign-in e-mail
        </Text>
        <Text variant="label" style={styles.value} testID="invitation-email">
          {invitation.email}
        </Text>
      </View>
      <View style={styles.row}>
        <Text variant="caption" tone="muted" style={styles.key}>
          Role
        </Text>
        <Badge label={ROLE_LABELS[invitation.role]} tone="teal" />
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  box: { borderRadius: radii.md, backgroundColor: colors.raised, padding: spacing.md, gap: spacing.sm },
  row: { flexDirection: 'row', alignItems: 'center', gap: spacing.md },
  // The key keeps its width; a long e-mail wraps inside the box (minWidth 0 lets the flex item shrink).
  key: { width: 100, flexShrink: 0 },
  value: { flex: 1, minWidth: 0 },
});
