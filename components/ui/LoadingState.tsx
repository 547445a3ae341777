import { ActivityIndicator, StyleSheet, View } from 'react-native';

import { colors, spacing } from '@/components/theme';

import { Text } from './Text';

/** Props of {@link LoadingState}. */
export interface LoadingStateProps {
  /** What is loading, e.g. "Loading the team…"; default "Loading…". */
  label?: string;
  /** Fill the available space and centre (for whole screens). */
  fill?: boolean;
}

/** A spinner with words, announced politely to screen readers. */
export function LoadingState({ label = 'Loading…', fill = false }: LoadingStateProps) {
  return (
    <View style={[styles.wrap, fill && styles.fill]} role="status" aria-live="polite">
      <ActivityIndicator color={colors.accent} />
      <Text tone="muted">{label}</Text>
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { flexDirection: 'row', alignItems: 'center', justifyContent: 'center', gap: spacing.md, padding: spacing.xl },
  fill: { flex: 1 },
});
