import { Image, StyleSheet, View } from 'react-native';

import { spacing } from '@/components/theme';
import { Text } from '@/components/ui/Text';

/** The product's own icon (assets/icon.svg rendered by server/scripts/render-assets.ts). */
const ICON = require('@/assets/icon.png') as number;

/** Props of {@link ProductMark}. */
export interface ProductMarkProps {
  /** `lg` for the sign-in page; default `md` for the header. */
  size?: 'md' | 'lg';
}

/**
 * The Holonaut mark: the app icon (a closed limb loop whose traversal leaves the body turned) and
 * the word mark. The same image is the favicon and the splash, so the product looks the same everywhere.
 */
export function ProductMark({ size = 'md' }: ProductMarkProps) {
  const side = size === 'lg' ? 40 : 28;
  return (
    <View style={styles.row} aria-label="Holonaut" role="img">
      <Image source={ICON} style={{ width: side, height: side }} accessibilityIgnoresInvertColors />
      <Text variant={size === 'lg' ? 'title' : 'heading'} style={[styles.word, size === 'lg' && styles.wordLg]}>
        holonaut
      </Text>
    </View>
  );
}

const styles = StyleSheet.create({
  row: { flexDirection: 'row', alignItems: 'center', gap: spacing.sm + 2 },
  word: { fontFamily: 'Inter_700Bold', letterSpacing: 0.2 },
  wordLg: { fontSize: 28, lineHeight: 34 },
});
