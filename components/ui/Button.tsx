import { ActivityIndicator, Pressable, type StyleProp, StyleSheet, View, type ViewStyle } from 'react-native';

import { colors, layout, radii, spacing } from '@/components/theme';

import { Icon, type IconName } from './Icon';
import { pressStyle } from './press-state';
import { Text } from './Text';

/** Visual weight of a button. */
export type ButtonVariant = 'primary' | 'secondary' | 'ghost' | 'danger';

/** Props of {@link Button}. */
export interface ButtonProps {
  /** Visible text; also the accessible name unless `accessibilityLabel` is given. */
  label: string;
  onPress?: () => void;
  /** default `primary` (amber, one per view); `secondary` outlined; `ghost` text only; `danger` destructive. */
  variant?: ButtonVariant;
  /** Optional leading Feather icon. */
  icon?: IconName;
  /** Shows a spinner and blocks presses (e.g. while a mutation runs). */
  loading?: boolean;
  disabled?: boolean;
  /** `sm` for dense rows; default `md` (44 px high: a full touch target). */
  size?: 'sm' | 'md';
  /** Accessible name when it should differ from `label` (e.g. "Disable Orrin Vale"). */
  accessibilityLabel?: string;
  /** Stretch to the container's width. */
  block?: boolean;
  style?: StyleProp<ViewStyle>;
  testID?: string;
}

const palette: Record<ButtonVariant, { bg: string; fg: string; border: string; pressed: string }> = {
  primary: { bg: colors.accent, fg: colors.onAccent, border: colors.accent, pressed: '#E89C3C' },
  secondary: { bg: 'transparent', fg: colors.text, border: colors.borderStrong, pressed: colors.raised },
  ghost: { bg: 'transparent', fg: colors.accent, border: 'transparent', pressed: colors.raised },
  danger: { bg: 'transparent', fg: colors.danger, border: colors.danger, pressed: colors.dangerTint },
};

/** The product's button: a labelled pressable with role "button", visible focus and a loading state. */
export function Button({
  label, onPress, variant = 'primary', icon, loading = false, disabled = false, size = 'md',
  accessibilityLabel, block = false, style, testID,
}: ButtonProps) {
  const p = palette[variant];
  const inactive = disabled || loading;
  const fg = inactive && variant === 'primary' && !loading ? colors.muted : p.fg;
  return (
    <Pressable
      role="button"
      aria-label={accessibilityLabel ?? label}
      aria-disabled={inactive}
      aria-busy={loading}
      disabled={inactive}
      onPress={onPress}
      testID={testID}
      style={pressStyle(({ pressed, hovered }) => [
        styles.base,
        size === 'sm' ? styles.sm : styles.md,
        { backgroundColor: pressed || hovered ? p.pressed : p.bg, borderColor: p.border },
        inactive && (variant === 'primary' && !loading ? styles.inactivePrimary : styles.inactive),
        block && styles.block,
        style,
      ])}
    >
      <View style={styles.row}>
        {loading ? (
          <ActivityIndicator size="small" color={fg} />
        ) : icon ? (
          <Icon name={icon} size={size === 'sm' ? 15 : 17} color={fg} />
        ) : null}
        <Text variant="label" style={{ color: fg, fontFamily: 'Inter_600SemiBold' }} numberOfLines={1}>
          {label}
        </Text>
      </View>
    </Pressable>
  );
}

const styles = StyleSheet.create({
  base: { borderWidth: 1, borderRadius: radii.md, alignItems: 'center', justifyContent: 'center', alignSelf: 'flex-start' },
  md: { minHeight: layout.touchTarget, paddingHorizontal: spacing.lg },
  sm: { minHeight: 34, paddingHorizontal: spacing.md },
  row: { flexDirection: 'row', alignItems: 'center', gap: spacing.sm },
  inactive: { opacity: 0.5 },
  // A disabled amber button reads as muddy brown: show it as a quiet outline instead.
  inactivePrimary: { backgroundColor: colors.raised, borderColor: colors.border, opacity: 0.8 },
  block: { alignSelf: 'stretch' },
});
