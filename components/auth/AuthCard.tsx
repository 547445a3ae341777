import type { ReactNode } from 'react';
import { ScrollView, StyleSheet, View } from 'react-native';

import { CAUTION_TEXT } from '@/components/shell/CautionLine';
import { ProductMark } from '@/components/shell/ProductMark';
import { colors, gaps, layout, radii, spacing } from '@/components/theme';
import { Text } from '@/components/ui/Text';

/** Props of {@link AuthCard}. */
export interface AuthCardProps {
  /** Heading of the card (level 1). */
  title: string;
  /** One line under the heading. */
  subtitle?: string;
  children: ReactNode;
}

/** The signed-out page frame: mark, a centred card, and the caution under it. */
export function AuthCard({ title, subtitle, children }: AuthCardProps) {
  return (
    <ScrollView style={styles.root} contentContainerStyle={styles.content} keyboardShouldPersistTaps="handled">
      <View style={styles.column}>
        <View style={styles.brand}>
          <ProductMark size="lg" />
          <Text tone="muted" style={styles.tagline}>
            Reorientation planning and rehearsal for crews in free fall
          </Text>
        </View>
        <View style={styles.card}>
          <View style={gaps.xs}>
            <Text variant="title" role="heading" aria-level={1}>
              {title}
            </Text>
            {subtitle ? <Text tone="muted">{subtitle}</Text> : null}
          </View>
          {children}
        </View>
        <Text variant="caption" tone="muted" style={styles.caution}>
          {CAUTION_TEXT}
        </Text>
      </View>
    </ScrollView>
  );
}

const styles = StyleSheet.create({
  root: { flex: 1, backgroundColor: colors.background },
  content: { flexGrow: 1, justifyContent: 'center', padding: spacing.lg, paddingVertical: spacing.xxxl },
  column: { width: '100%', maxWidth: 420, alignSelf: 'center', gap: spacing.xl },
  brand: { alignItems: 'center', gap: spacing.sm },
  tagline: { textAlign: 'center' },
  card: {
    backgroundColor: colors.surface,
    borderRadius: radii.lg + 4,
    borderWidth: 1,
    borderColor: colors.border,
    padding: spacing.xl,
    gap: spacing.lg,
    maxWidth: layout.formMaxWidth,
  },
  caution: { textAlign: 'center', paddingHorizontal: spacing.lg },
});
