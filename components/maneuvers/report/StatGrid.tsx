import { StyleSheet, View } from 'react-native';

import { colors, radii, spacing } from '@/components/theme';
import { Text, type TextTone } from '@/components/ui/Text';

/** One figure of a {@link StatGrid}. */
export interface Stat {
  /** Short label, e.g. "Error to target". */
  label: string;
  /** Formatted value with its unit, e.g. "0.8°". */
  value: string;
  /** Optional line under the value (e.g. "limit 120 °/s"). */
  note?: string;
  /** Colour of the value; default `default`. */
  tone?: TextTone;
  testID?: string;
}

/** Props of {@link StatGrid}. */
export interface StatGridProps {
  stats: readonly Stat[];
}

/** Key figures as tiles that wrap: two per row on a phone, more on a wide screen. */
export function StatGrid({ stats }: StatGridProps) {
  return (
    <View style={styles.grid}>
      {stats.map((s) => (
        <View key={s.label} style={styles.tile} testID={s.testID}>
          <Text variant="overline" tone="muted">
            {s.label}
          </Text>
          <Text variant="heading" tone={s.tone ?? 'default'} style={styles.value}>
            {s.value}
          </Text>
          {s.note ? (
            <Text variant="caption" tone="muted">
              {s.note}
            </Text>
          ) : null}
        </View>
      ))}
    </View>
  );
}

const styles = StyleSheet.create({
  grid: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.sm },
  tile: {
    flexGrow: 1,
    flexBasis: 140,
    padding: spacing.md,
    borderRadius: radii.md,
    backgroundColor: colors.raised,
    gap: 2,
  },
  value: { fontVariant: ['tabular-nums'] },
});
