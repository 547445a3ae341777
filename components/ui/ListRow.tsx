import type { ReactNode } from 'react';
import { Pressable, StyleSheet, View } from 'react-native';

import { colors, radii, spacing } from '@/components/theme';

import { Icon } from './Icon';
import { pressStyle } from './press-state';
import { Text } from './Text';

/** Props of {@link ListRow}. */
export interface ListRowProps {
  /** Main line (a name). */
  title: string;
  /** Second line (an e-mail, a summary). */
  subtitle?: string;
  /** Element at the left (an avatar or icon). */
  leading?: ReactNode;
  /** Elements at the right (badges). */
  trailing?: ReactNode;
  /** Marks the row as the one shown in the detail pane. */
  selected?: boolean;
  /** Makes the row a button; rows without it are plain. */
  onPress?: () => void;
  /** Lines the title may take before it is cut with an ellipsis; default 1 (a name). */
  titleLines?: number;
  /** Accessible name; default the title. */
  accessibilityLabel?: string;
  testID?: string;
}

/** A list row for SplitView lists: title, subtitle, leading and trailing slots, selected highlight. */
export function ListRow({ title, subtitle, leading, trailing, selected = false, onPress, titleLines = 1, accessibilityLabel, testID }: ListRowProps) {
  const body = (
    <>
      {leading}
      <View style={styles.text}>
        <Text variant="bodyStrong" numberOfLines={titleLines}>
          {title}
        </Text>
        {subtitle ? (
          <Text variant="caption" tone="muted" numberOfLines={1}>
            {subtitle}
          </Text>
        ) : null}
      </View>
      {trailing ? <View style={styles.trailing}>{trailing}</View> : null}
      {onPress ? <Icon name="chevron-right" size={16} color={colors.muted} /> : null}
    </>
  );
  if (!onPress) {
    return (
      <View style={styles.row} testID={testID}>
        {body}
      </View>
    );
  }
  return (
    <Pressable
      role="button"
      aria-label={accessibilityLabel ?? title}
      aria-current={selected ? 'true' : undefined}
      onPress={onPress}
      testID={testID}
      style={pressStyle(({ hovered }) => [styles.row, hovered && styles.hovered, selected && styles.selected])}
    >
      {body}
    </Pressable>
  );
}

const styles = StyleSheet.create({
  row: {
    flexDirection: 'row',
    alignItems: 'center',
    gap: spacing.md,
    paddingHorizontal: spacing.md,
    paddingVertical: spacing.md - 2,
    borderRadius: radii.md,
    borderWidth: 1,
    borderColor: 'transparent',
    minHeight: 56,
  },
  hovered: { backgroundColor: colors.surface },
  selected: { backgroundColor: colors.raised, borderColor: colors.borderStrong },
  text: { flex: 1, minWidth: 0, gap: 1 },
  trailing: { flexDirection: 'row', gap: spacing.xs, alignItems: 'center' },
});
