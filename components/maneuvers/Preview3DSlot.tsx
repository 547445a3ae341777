import { useState } from 'react';
import { StyleSheet, useWindowDimensions, View } from 'react-native';

import { LazyPlayer } from '@/components/rehearse/LazyPlayer';
import { colors, radii, spacing } from '@/components/theme';
import { Button } from '@/components/ui/Button';
import { Text } from '@/components/ui/Text';

/** Props of {@link Preview3DSlot}. */
export interface Preview3DSlotProps {
  /** The version whose motion the preview plays. */
  versionId: string;
}

/**
 * ── 3D PREVIEW SLOT ──
 * The report's 3D preview: the rehearsal area's lazily loaded player (components/rehearse/LazyPlayer),
 * mounted only when asked for, so the report itself never loads three.js or computes the motion.
 */
export function Preview3DSlot({ versionId }: Preview3DSlotProps) {
  const [shown, setShown] = useState(false);
  // the player's controls take about 290 px: the rest of nearly a screen's height goes to the body
  const { height: screenHeight } = useWindowDimensions();
  const height = Math.round(Math.min(820, Math.max(560, screenHeight - 60)));
  if (shown) {
    return (
      <View style={styles.player} testID="preview-3d">
        <LazyPlayer versionId={versionId} height={height} compact />
        <Button label="Hide 3D preview" icon="eye-off" variant="ghost" size="sm" onPress={() => setShown(false)} />
      </View>
    );
  }
  return (
    <View style={styles.slot} testID="preview-3d-slot">
      <Text variant="caption" tone="muted" style={styles.text}>
        Watch the body perform this version in 3D, with cues and timing.
      </Text>
      <Button label="Show 3D preview" icon="box" variant="secondary" size="sm" onPress={() => setShown(true)} />
    </View>
  );
}

const styles = StyleSheet.create({
  slot: {
    flexDirection: 'row',
    flexWrap: 'wrap',
    alignItems: 'center',
    gap: spacing.sm,
    padding: spacing.md,
    borderRadius: radii.md,
    borderWidth: 1,
    borderStyle: 'dashed',
    borderColor: colors.borderStrong,
  },
  text: { flex: 1, minWidth: 180 },
  player: { gap: spacing.sm, borderRadius: radii.md, overflow: 'hidden' },
});
