import type { ReactNode } from 'react';
import { type StyleProp, StyleSheet, View, type ViewStyle } from 'react-native';

import { colors, radii, spacing } from '@/components/theme';

import { Titles } from './Titles';

/** Props of {@link Card}. */
export interface CardProps {
  /** Optional heading at the top of the card. */
  title?: string;
  /** Optional line under the title. */
  subtitle?: string;
  /** Element on the right of the title row (a Badge or a small Button). */
  trailing?: ReactNode;
  children?: ReactNode;
  /** default `md` (16 px); `none` for edge-to-edge lists inside. */
  padding?: 'none' | 'md' | 'lg';
  style?: StyleProp<ViewStyle>;
}

/** A surface panel that groups related content, with an optional heading row. */
export function Card({ title, subtitle, trailing, children, padding = 'md', style }: CardProps) {
  const pad = padding === 'none' ? 0 : padding === 'lg' ? spacing.xl : spacing.lg;
  return (
    <View style={[styles.card, { padding: pad }, style]}>
      {title || trailing ? (
        <View style={[styles.head, padding === 'none' && { padding: spacing.lg, paddingBottom: spacing.sm }]}>
          <Titles title={title} subtitle={subtitle} level={2} />
          {trailing}
        </View>
      ) : null}
      {children}
    </View>
  );
}

const styles = StyleSheet.create({
  card: {
    backgroundColor: colors.surface,
    borderRadius: radii.lg,
    borderWidth: 1,
    borderColor: colors.border,
    gap: spacing.md,
  },
  head: { flexDirection: 'row', alignItems: 'flex-start', gap: spacing.md },
});
