import { StyleSheet, View } from 'react-native';

import { colors, radii, spacing } from '@/components/theme';

import { Icon, type IconName } from './Icon';
import { Text } from './Text';

/** Colour meaning of a badge. */
export type BadgeTone = 'neutral' | 'accent' | 'teal' | 'danger' | 'success';

const tones: Record<BadgeTone, { bg: string; fg: string }> = {
  neutral: { bg: colors.mutedTint, fg: colors.muted },
  accent: { bg: colors.accentTint, fg: colors.accent },
  teal: { bg: colors.tealTint, fg: colors.teal },
  danger: { bg: colors.dangerTint, fg: colors.danger },
  success: { bg: colors.successTint, fg: colors.success },
};

/** Props of {@link Badge}. */
export interface BadgeProps {
  label: string;
  /** default `neutral`. */
  tone?: BadgeTone;
  /** Optional leading Feather icon. */
  icon?: IconName;
}

/** A small pill for a status or a role ("Cleared", "Disabled", "Flight planner"). */
export function Badge({ label, tone = 'neutral', icon }: BadgeProps) {
  const t = tones[tone];
  return (
    <View style={[styles.badge, { backgroundColor: t.bg }]}>
      {icon ? <Icon name={icon} size={12} color={t.fg} /> : null}
      <Text variant="caption" style={[styles.text, { color: t.fg }]} numberOfLines={1}>
        {label}
      </Text>
    </View>
  );
}

const styles = StyleSheet.create({
  badge: {
    flexDirection: 'row',
    alignItems: 'center',
    alignSelf: 'flex-start',
    gap: spacing.xs,
    borderRadius: radii.pill,
    paddingHorizontal: spacing.sm + 2,
    paddingVertical: 2,
  },
  text: { fontFamily: 'Inter_500Medium', fontSize: 12, lineHeight: 18 },
});
