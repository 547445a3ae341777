import { Pressable, StyleSheet, View } from 'react-native';

import { colors, radii, spacing } from '@/components/theme';

import { FieldFrame } from './FieldFrame';
import { pressStyle } from './press-state';
import { Text } from './Text';

/** One choice of a {@link SegmentedControl}. */
export interface SegmentOption<V extends string> {
  value: V;
  label: string;
}

/** Props of {@link SegmentedControl}. */
export interface SegmentedControlProps<V extends string> {
  /** Accessible name of the group (and visible label unless `hideLabel`). */
  label: string;
  /** Hide the visible label (the group keeps its accessible name). */
  hideLabel?: boolean;
  options: readonly SegmentOption<V>[];
  value: V | undefined;
  onChange: (value: V) => void;
  /** Error message under the control. */
  error?: string;
  disabled?: boolean;
}

/**
 * A row of mutually exclusive choices (2–5 short options). Exposed as a radio group, so tests can use
 * `getByRole('radio', { name })`. For longer lists use {@link Select}.
 */
export function SegmentedControl<V extends string>({
  label, hideLabel = false, options, value, onChange, error, disabled = false,
}: SegmentedControlProps<V>) {
  return (
    <FieldFrame label={label} hideLabel={hideLabel} error={error}>
      <View role="radiogroup" aria-label={label} style={styles.track}>
        {options.map((o) => {
          const selected = o.value === value;
          return (
            <Pressable
              key={o.value}
              role="radio"
              aria-checked={selected}
              aria-label={o.label}
              disabled={disabled}
              onPress={() => onChange(o.value)}
              style={pressStyle(({ hovered }) => [styles.segment, selected ? styles.selected : hovered ? styles.hovered : null])}
            >
              <Text variant="label" tone={selected ? 'default' : 'muted'} numberOfLines={1} style={selected && styles.selectedText}>
                {o.label}
              </Text>
            </Pressable>
          );
        })}
      </View>
    </FieldFrame>
  );
}

const styles = StyleSheet.create({
  track: {
    flexDirection: 'row',
    backgroundColor: colors.background,
    borderRadius: radii.md,
    borderWidth: 1,
    borderColor: colors.border,
    padding: 3,
    gap: 3,
  },
  segment: {
    flex: 1,
    minHeight: 36,
    alignItems: 'center',
    justifyContent: 'center',
    borderRadius: radii.sm + 1,
    paddingHorizontal: spacing.xs,
  },
  selected: { backgroundColor: colors.raised, borderWidth: 1, borderColor: colors.borderStrong },
  selectedText: { color: colors.accent, fontFamily: 'Inter_600SemiBold' },
  hovered: { backgroundColor: colors.surface },
});
