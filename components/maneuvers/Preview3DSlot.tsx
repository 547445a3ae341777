import { StyleSheet, View } from 'react-native';

import { colors, radii, spacing } from '@/components/theme';
import { Icon } from '@/components/ui/Icon';
import { Text } from '@/components/ui/Text';

/** Props of {@link Preview3DSlot}. */
export interface Preview3DSlotProps {
  /** The version whose motion the preview would play. */
  versionId: string;
}

/**
 * ── 3D PREVIEW SLOT ──
 * Where the rehearsal player goes in the verification report. The rehearsal area provides a lazily
 * loaded player (planned: `components/rehearse/LazyPlayer.tsx`, taking the version id); it was not
 * in the tree when this report was built, so this placeholder says where to look instead. Swap the
 * body of this component for `<LazyPlayer versionId={versionId} />` once that file exists — the
 * report needs no other change, and three.js stays out of the report's bundle.
 */
export function Preview3DSlot({ versionId }: Preview3DSlotProps) {
  return (
    <View style={styles.slot} testID="preview-3d-slot" data-version={versionId}>
      <Icon name="box" size={20} color={colors.muted} />
      <Text variant="caption" tone="muted" style={styles.text}>
        3D preview: a cleared version plays in the Rehearse tab with cues and timing.
      </Text>
    </View>
  );
}

const styles = StyleSheet.create({
  slot: {
    flexDirection: 'row',
    alignItems: 'center',
    gap: spacing.sm,
    padding: spacing.md,
    borderRadius: radii.md,
    borderWidth: 1,
    borderStyle: 'dashed',
    borderColor: colors.borderStrong,
  },
  text: { flex: 1 },
});
