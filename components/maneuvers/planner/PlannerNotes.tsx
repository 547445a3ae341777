import { StyleSheet, View } from 'react-native';

import { colors, radii, spacing } from '@/components/theme';
import { Icon } from '@/components/ui/Icon';
import { Text } from '@/components/ui/Text';

/** Props of {@link PlannerNotes}. */
export interface PlannerNotesProps {
  /** The planner's notes, one reason per line (which axis, which limit, which sweep). */
  notes: readonly string[];
  /** `unreachable`: no candidate was found, so the notes are why; `remarks`: notes beside candidates. */
  kind: 'unreachable' | 'remarks';
}

/**
 * What the planner says about a target: why it cannot be reached within the body's joint ranges,
 * the rate limit and the time budget (naming the axis and the limit), or, beside its candidates,
 * the sweeps it could not use and the limits its best candidate misses. Renders nothing without notes.
 */
export function PlannerNotes({ notes, kind }: PlannerNotesProps) {
  if (!notes.length) return null;
  const unreachable = kind === 'unreachable';
  return (
    <View style={[styles.box, unreachable ? styles.unreachable : styles.remarks]} role={unreachable ? 'alert' : 'note'} aria-label={unreachable ? 'Why this target cannot be reached' : 'Planner notes'} testID={`planner-notes-${kind}`}>
      <Icon name={unreachable ? 'slash' : 'info'} size={18} color={unreachable ? colors.danger : colors.accent} />
      <View style={styles.body}>
        <Text variant="bodyStrong">{unreachable ? 'This target cannot be reached within the limits' : 'Planner notes'}</Text>
        {notes.map((n, i) => (
          <Text key={i} variant="caption">
            • {n}
          </Text>
        ))}
        {unreachable ? (
          <Text variant="caption" tone="muted">
            Change the target, the tolerance, the rate limit or the time budget, or the crew member&apos;s suit, and suggest again.
          </Text>
        ) : null}
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  box: { flexDirection: 'row', alignItems: 'flex-start', gap: spacing.md, padding: spacing.md, borderRadius: radii.md, alignSelf: 'stretch' },
  unreachable: { backgroundColor: colors.dangerTint, borderWidth: 1, borderColor: 'rgba(255, 107, 107, 0.4)' },
  remarks: { backgroundColor: colors.accentTint },
  body: { flex: 1, gap: spacing.xs },
});
