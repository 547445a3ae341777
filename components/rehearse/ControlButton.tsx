import { Pressable, StyleSheet } from 'react-native';

import { colors, layout, radii } from '@/components/theme';
import { Icon, type IconName } from '@/components/ui/Icon';
import { pressStyle } from '@/components/ui/press-state';

/** Props of {@link ControlButton}. */
export interface ControlButtonProps {
  icon: IconName;
  /** Accessible name (the button shows only the icon). */
  label: string;
  onPress: () => void;
  /** Shown as switched on (aria-pressed); default undefined (not a toggle). */
  active?: boolean;
  /** Larger, amber (the play button); default false. */
  primary?: boolean;
  disabled?: boolean;
}

/** A round icon-only button for the player's transport row. */
export function ControlButton({ icon, label, onPress, active, primary = false, disabled = false }: ControlButtonProps) {
  return (
    <Pressable
      role="button"
      aria-label={label}
      aria-pressed={active}
      disabled={disabled}
      onPress={onPress}
      style={pressStyle(({ pressed, hovered }) => [
        styles.base,
        primary && styles.primary,
        active && styles.active,
        (pressed || hovered) && !primary && styles.hover,
        disabled && styles.disabled,
      ])}
    >
      <Icon name={icon} size={primary ? 24 : 19} color={primary ? colors.onAccent : active ? colors.accent : colors.text} />
    </Pressable>
  );
}

const styles = StyleSheet.create({
  base: {
    width: layout.touchTarget, height: layout.touchTarget, borderRadius: radii.pill, alignItems: 'center', justifyContent: 'center',
    borderWidth: 1, borderColor: colors.borderStrong, backgroundColor: 'rgba(21, 34, 50, 0.85)',
  },
  primary: { width: 56, height: 56, backgroundColor: colors.accent, borderColor: colors.accent },
  active: { borderColor: colors.accent, backgroundColor: colors.accentTint },
  hover: { backgroundColor: colors.raised },
  disabled: { opacity: 0.4 },
});
