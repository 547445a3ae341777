import type { ReactNode } from 'react';
import { StyleSheet, View } from 'react-native';

import { spacing } from '@/components/theme';

import { FieldMessage } from './FieldMessage';
import { Text } from './Text';

/** Props of {@link FieldFrame}. */
export interface FieldFrameProps {
  /** Visible label above the control (the control itself carries the accessible name). */
  label: string;
  /** Leave the visible label out (the control keeps its accessible name). */
  hideLabel?: boolean;
  error?: string;
  hint?: string;
  /** The control. */
  children: ReactNode;
}

/** What every form control shares: its label above, the control, and its error or hint beneath. */
export function FieldFrame({ label, hideLabel = false, error, hint, children }: FieldFrameProps) {
  return (
    <View style={styles.wrap}>
      {hideLabel ? null : (
        <Text variant="label" tone="muted">
          {label}
        </Text>
      )}
      {children}
      <FieldMessage error={error} hint={hint} />
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: spacing.xs + 2, alignSelf: 'stretch' },
});
