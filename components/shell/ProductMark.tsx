import { StyleSheet, View } from 'react-native';

import { colors, spacing } from '@/components/theme';
import { Text } from '@/components/ui/Text';

/** Props of {@link ProductMark}. */
export interface ProductMarkProps {
  /** `lg` for the sign-in page; default `md` for the header. */
  size?: 'md' | 'lg';
}

/**
 * The Holonaut mark: a ring (the closed limb loop) with an offset dot (the body's turned attitude),
 * drawn with plain views so it needs no image asset, and the word mark.
 */
export function ProductMark({ size = 'md' }: ProductMarkProps) {
  const ring = size === 'lg' ? 34 : 24;
  return (
    <View style={styles.row} aria-label="Holonaut" role="img">
      <View style={[styles.ring, { width: ring, height: ring, borderRadius: ring / 2, borderWidth: size === 'lg' ? 3 : 2.5 }]}>
        <View style={[styles.dot, { width: ring * 0.3, height: ring * 0.3, borderRadius: ring, top: -ring * 0.12, right: -ring * 0.06 }]} />
      </View>
      <Text variant={size === 'lg' ? 'title' : 'heading'} style={[styles.word, size === 'lg' && styles.wordLg]}>
        holonaut
      </Text>
    </View>
  );
}

const styles = StyleSheet.create({
  row: { flexDirection: 'row', alignItems: 'center', gap: spacing.sm + 2 },
  ring: { borderColor: colors.teal },
  dot: { position: 'absolute', backgroundColor: colors.accent, borderWidth: 2, borderColor: colors.background },
  word: { fontFamily: 'Inter_700Bold', letterSpacing: 0.2 },
  wordLg: { fontSize: 28, lineHeight: 34 },
});
