import { StyleSheet, View } from 'react-native';

import { colors, spacing } from '@/components/theme';
import { Icon } from '@/components/ui/Icon';
import { Text } from '@/components/ui/Text';

/** The always-visible caution: Holonaut is a planning and training aid, not flight software. */
export const CAUTION_TEXT = 'Planning and training aid only — follow flight rules and certified procedures.';

/** A thin strip under the header carrying {@link CAUTION_TEXT}. */
export function CautionLine() {
  return (
    <View style={styles.strip} role="note" aria-label="Caution">
      <Icon name="alert-circle" size={13} color={colors.accent} />
      <Text variant="caption" tone="muted" style={styles.text}>
        {CAUTION_TEXT}
      </Text>
    </View>
  );
}

const styles = StyleSheet.create({
  strip: {
    flexDirection: 'row',
    alignItems: 'center',
    gap: spacing.sm,
    paddingHorizontal: spacing.lg,
    paddingVertical: spacing.xs + 2,
    backgroundColor: colors.accentTint,
    borderBottomWidth: 1,
    borderBottomColor: 'rgba(255, 180, 84, 0.25)',
  },
  text: { flex: 1, fontSize: 12, lineHeight: 16, color: '#D9C29F' },
});
