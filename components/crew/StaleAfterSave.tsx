import { useRouter } from 'expo-router';
import { StyleSheet, View } from 'react-native';

import { colors, radii, spacing } from '@/components/theme';
import { Button } from '@/components/ui/Button';
import { Icon } from '@/components/ui/Icon';
import { Text } from '@/components/ui/Text';
import type { StaleVersion } from '@/shared/contracts/profile-version';

/** Props of {@link StaleAfterSave}. */
export interface StaleAfterSaveProps {
  /** The profile version just saved. */
  version: number;
  /** The maneuver versions the save made stale (from the save's answer). */
  stale: readonly StaleVersion[];
  onDismiss: () => void;
}

/**
 * Right after a profile save: which maneuvers it made stale, each with what happens next (a cleared
 * one is re-verified and goes to the reviewer as a re-check; one under review must be saved again).
 */
export function StaleAfterSave({ version, stale, onDismiss }: StaleAfterSaveProps) {
  const router = useRouter();
  const cleared = stale.filter((s) => s.onceCleared);
  return (
    <View style={[styles.box, stale.length ? styles.warn : styles.ok]} role="status" testID="stale-after-save">
      <View style={styles.head}>
        <Icon name={stale.length ? 'alert-triangle' : 'check'} size={16} color={stale.length ? colors.danger : colors.success} />
        <Text variant="bodyStrong" style={styles.flex}>
          {stale.length
            ? `Profile v${version} saved. ${stale.length} maneuver version${stale.length === 1 ? '' : 's'} became stale${cleared.length ? `, ${cleared.length} of them cleared` : ''}.`
            : `Profile v${version} saved. No cleared or reviewed maneuver depended on the old profile.`}
        </Text>
        <Button label="Dismiss" variant="ghost" size="sm" onPress={onDismiss} />
      </View>
      {stale.map((s) => (
        <View key={s.versionId} style={styles.row}>
          <Text variant="caption" style={styles.flex}>
            {s.sequenceName} v{s.version} ({s.was === 'cleared' ? 'cleared' : s.was === 'under_review' ? 'under review' : 'already waiting for a re-check'}):{' '}
            {s.onceCleared
              ? 'the crew member can no longer rehearse it; it is being re-verified on the new profile and goes to the reviewer as a re-check.'
              : 'its review is withdrawn; it is re-verified for the record, and needs a new save to go to review again.'}
          </Text>
          <Button label="Open" size="sm" variant="secondary" onPress={() => router.push(`/maneuvers/${s.sequenceId}`)} accessibilityLabel={`Open ${s.sequenceName}`} />
        </View>
      ))}
    </View>
  );
}

const styles = StyleSheet.create({
  box: { gap: spacing.sm, padding: spacing.md, borderRadius: radii.md, borderWidth: 1, backgroundColor: colors.surface },
  warn: { borderColor: colors.danger },
  ok: { borderColor: colors.success },
  head: { flexDirection: 'row', alignItems: 'center', gap: spacing.sm, flexWrap: 'wrap' },
  row: { flexDirection: 'row', alignItems: 'center', gap: spacing.sm, flexWrap: 'wrap' },
  flex: { flex: 1, minWidth: 200 },
});
