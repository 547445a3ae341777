import { useState } from 'react';
import { StyleSheet, TextInput, type TextInputProps, View } from 'react-native';

import { colors, fonts, layout, radii, spacing } from '@/components/theme';

import { FieldFrame } from './FieldFrame';
import { Text } from './Text';

/** Props of {@link TextField}: React Native TextInput props plus a label, an optional unit, hint and error. */
export interface TextFieldProps extends Omit<TextInputProps, 'style'> {
  /** Visible label; also the input's accessible name (so `getByLabel(label)` finds it). */
  label: string;
  /** Unit shown inside the field on the right, e.g. "kg", "m", "°". */
  unit?: string;
  /** Help text under the field (hidden while an error shows). */
  hint?: string;
  /** Error message under the field, in red; marks the input invalid. */
  error?: string;
}

/** A labelled text input with unit, hint and error beside the field. */
export function TextField({ label, unit, hint, error, editable = true, onFocus, onBlur, ...input }: TextFieldProps) {
  const [focused, setFocused] = useState(false);
  return (
    <FieldFrame label={label} error={error} hint={hint}>
      <View
        style={[
          styles.box,
          focused && styles.boxFocused,
          !!error && styles.boxError,
          !editable && styles.boxDisabled,
        ]}
      >
        <TextInput
          {...input}
          editable={editable}
          aria-label={label}
          aria-invalid={!!error}
          placeholderTextColor="#5F7487"
          onFocus={(e) => {
            setFocused(true);
            onFocus?.(e);
          }}
          onBlur={(e) => {
            setFocused(false);
            onBlur?.(e);
          }}
          style={styles.input}
        />
        {unit ? (
          <Text variant="numeric" tone="muted" style={styles.unit}>
            {unit}
          </Text>
        ) : null}
      </View>
    </FieldFrame>
  );
}

const styles = StyleSheet.create({
  box: {
    flexDirection: 'row',
    alignItems: 'center',
    minHeight: layout.touchTarget,
    borderWidth: 1,
    borderColor: colors.border,
    borderRadius: radii.md,
    backgroundColor: colors.raised,
    paddingHorizontal: spacing.md,
  },
  boxFocused: { borderColor: colors.accent },
  boxError: { borderColor: colors.danger },
  boxDisabled: { opacity: 0.6 },
  input: {
    flex: 1,
    minWidth: 0,
    color: colors.text,
    fontFamily: fonts.regular,
    fontSize: 15,
    paddingVertical: spacing.sm + 2,
    // No browser focus ring inside the box: the box itself shows focus.
    outlineWidth: 0,
  },
  unit: { marginLeft: spacing.sm },
});
