import { StyleSheet, View } from 'react-native';

import { colors, radii, spacing } from '@/components/theme';
import { Icon } from '@/components/ui/Icon';
import { Text } from '@/components/ui/Text';
import { MANEUVER_CAUTIONS } from '@/shared/product/cautions';

export { MANEUVER_CAUTIONS };

/** Props of {@link ManeuverCautions}. */
export interface ManeuverCautionsProps {
  /** Show only the first line (for lists and compact panels); default false. */
  compact?: boolean;
}

/** An amber note listing the maneuver cautions. */
export function ManeuverCautions({ compact = false }: ManeuverCautionsProps) {
  const lines = compact ? MANEUVER_CAUTIONS.slice(0, 1) : MANEUVER_CAUTIONS;
  return (
    <View style={styles.box} role="note" aria-label="Cautions">
      <Icon name="alert-circle" size={16} color={colors.accent} />
      <View style={styles.lines}>
        {lines.map((l) => (
          <Text key={l} variant="caption" style={styles.text}>
            {l}
          </Text>
        ))}
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  box: {
    flexDirection: 'row',
    gap: spacing.sm,
    padding: spacing.md,
    borderRadius: radii.md,
    backgroundColor: colors.accentTint,
    borderWidth: 1,
    borderColor: 'rgba(255, 180, 84, 0.3)',
  },
  lines: { flex: 1, gap: spacing.xs },
  text: { color: '#E3CBA5' },
});
