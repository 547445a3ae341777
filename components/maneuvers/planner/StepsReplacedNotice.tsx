import { StyleSheet, View } from 'react-native';

import { colors, radii, spacing } from '@/components/theme';
import { Button } from '@/components/ui/Button';
import { Icon } from '@/components/ui/Icon';
import { Text } from '@/components/ui/Text';

/** What "Use these steps" replaced, so it can be undone. */
export interface ReplacedSteps<S> {
  /** The suggestion whose steps are now in the composer. */
  rank: number;
  /** Steps it brought. */
  count: number;
  /** The composer's steps before, restored by Undo. */
  previous: S[];
}

/** Props of {@link StepsReplacedNotice}. */
export interface StepsReplacedNoticeProps {
  rank: number;
  count: number;
  /** How many steps Undo brings back. */
  previousCount: number;
  onUndo: () => void;
  onDismiss: () => void;
  /** `banner` sits in the composer until dismissed; `snackbar` floats over the screen's foot for a while. */
  kind: 'banner' | 'snackbar';
  testID?: string;
}

/** "Suggestion N's steps are in the composer — Undo": the way back from "Use these steps". */
export function StepsReplacedNotice({ rank, count, previousCount, onUndo, onDismiss, kind, testID }: StepsReplacedNoticeProps) {
  const back = previousCount ? `Undo brings back your ${previousCount} earlier step${previousCount === 1 ? '' : 's'}.` : 'Undo empties the list again.';
  return (
    <View style={[styles.box, kind === 'snackbar' ? styles.snackbar : styles.banner]} role={kind === 'snackbar' ? 'alert' : 'status'} testID={testID}>
      <Icon name="zap" size={16} color={colors.teal} />
      <Text variant="caption" style={styles.text}>
        Steps of suggestion {rank} in use ({count} step{count === 1 ? '' : 's'}), not saved yet. {back}
      </Text>
      <View style={styles.buttons}>
        <Button label="Undo" icon="rotate-ccw" size="sm" variant="secondary" onPress={onUndo} accessibilityLabel={`Undo using suggestion ${rank}`} />
        <Button label="Dismiss" variant="ghost" size="sm" onPress={onDismiss} accessibilityLabel={kind === 'snackbar' ? 'Dismiss the undo message' : 'Keep these steps'} />
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  box: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', gap: spacing.sm, padding: spacing.md, borderRadius: radii.md },
  banner: { backgroundColor: colors.tealTint, borderWidth: 1, borderColor: colors.teal },
  snackbar: {
    position: 'absolute', left: spacing.md, right: spacing.md, bottom: spacing.md, maxWidth: 640, alignSelf: 'center', marginHorizontal: 'auto',
    backgroundColor: colors.raised, borderWidth: 1, borderColor: colors.borderStrong,
    shadowColor: '#000', shadowOpacity: 0.4, shadowRadius: 12, shadowOffset: { width: 0, height: 4 },
  },
  text: { flex: 1, minWidth: 180 },
  buttons: { flexDirection: 'row', gap: spacing.xs },
});
