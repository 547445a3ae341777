import type { ReactNode } from 'react';
import { StyleSheet, View } from 'react-native';

import { colors, radii, spacing } from '@/components/theme';

import { Icon, type IconName } from './Icon';
import { Text } from './Text';

/** Props of {@link EmptyState}. */
export interface EmptyStateProps {
  /** Feather icon in the medallion; default `inbox`. */
  icon?: IconName;
  /** One short sentence: what is missing ("No crew members yet"). */
  title: string;
  /** What will appear here and how it gets here. */
  body?: string;
  /** Optional action (usually a Button). */
  action?: ReactNode;
}

/** An honest empty state: says what is missing, what will appear, and offers the next step. */
export function EmptyState({ icon = 'inbox', title, body, action }: EmptyStateProps) {
  return (
    <View style={styles.wrap} role="status">
      <View style={styles.medallion}>
        <Icon name={icon} size={26} color={colors.teal} />
      </View>
      <Text variant="heading" style={styles.center} role="heading" aria-level={2}>
        {title}
      </Text>
      {body ? (
        <Text tone="muted" style={[styles.center, styles.body]}>
          {body}
        </Text>
      ) : null}
      {action ? <View style={styles.action}>{action}</View> : null}
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { alignItems: 'center', justifyContent: 'center', padding: spacing.xxl, gap: spacing.sm },
  medallion: {
    width: 64,
    height: 64,
    borderRadius: radii.pill,
    backgroundColor: colors.tealTint,
    borderWidth: 1,
    borderColor: 'rgba(79, 209, 197, 0.35)',
    alignItems: 'center',
    justifyContent: 'center',
    marginBottom: spacing.sm,
  },
  center: { textAlign: 'center' },
  body: { maxWidth: 420 },
  action: { marginTop: spacing.md },
});
