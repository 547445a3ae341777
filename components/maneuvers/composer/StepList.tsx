import { Pressable, StyleSheet, View } from 'react-native';

import { colors, gaps, radii, spacing } from '@/components/theme';
import { Button } from '@/components/ui/Button';
import { EmptyState } from '@/components/ui/EmptyState';
import { Text } from '@/components/ui/Text';
import { cueFor } from '@/shared/primitives/primitive-cues';
import { type Primitive, PRIMITIVE_LABELS } from '@/shared/primitives/primitive-schemas';

/** Props of {@link StepList}. */
export interface StepListProps {
  steps: readonly Primitive[];
  /** Highlighted step (the one in the editor), if any. */
  selected?: number | null;
  /** Read-only: no edit/reorder/remove buttons (cleared versions, reviewers). */
  readOnly?: boolean;
  onEdit?: (i: number) => void;
  onMove?: (i: number, by: -1 | 1) => void;
  onRemove?: (i: number) => void;
}

/** Seconds a primitive lasts on its own (blends the compiler inserts come on top). */
export function primitiveSeconds(p: Primitive): number {
  if (p.kind === 'recorded_sweep') return (p.trimEndS - p.trimStartS) * p.repeat;
  return 'cycles' in p ? p.cycles * p.periodS : p.durationS;
}

/** The composed steps in order, each with its cue; edit, move up/down and remove per row. */
export function StepList({ steps, selected, readOnly = false, onEdit, onMove, onRemove }: StepListProps) {
  if (steps.length === 0) {
    return <EmptyState icon="list" title="No steps yet" body="Add a limb sweep, a pose shift or a pause. Blends between steps are inserted for you." />;
  }
  return (
    <View role="list" aria-label="Steps" style={gaps.sm}>
      {steps.map((p, i) => {
        const label = `Step ${i + 1}: ${PRIMITIVE_LABELS[p.kind]}`;
        return (
          <View key={i} role="listitem" aria-label={label} style={[styles.row, selected === i && styles.rowSelected]} testID={`step-row-${i}`}>
            <Pressable
              role="button"
              aria-label={readOnly ? label : `Edit step ${i + 1}`}
              disabled={readOnly || !onEdit}
              onPress={() => onEdit?.(i)}
              style={({ pressed, focused }: { pressed: boolean; focused?: boolean }) => [styles.main, pressed && styles.pressed, focused && styles.focused]}
            >
              <View style={styles.index}>
                <Text variant="label" tone="accent">
                  {i + 1}
                </Text>
              </View>
              <View style={styles.texts}>
                <Text variant="bodyStrong">
                  {PRIMITIVE_LABELS[p.kind]} <Text variant="caption" tone="muted">· {primitiveSeconds(p).toFixed(1)} s</Text>
                </Text>
                <Text variant="caption" tone="muted">
                  {cueFor(p)}
                </Text>
              </View>
            </Pressable>
            {readOnly ? null : (
              <View style={styles.actions}>
                <Button label="Up" icon="arrow-up" size="sm" variant="ghost" accessibilityLabel={`Move step ${i + 1} up`} disabled={i === 0} onPress={() => onMove?.(i, -1)} />
                <Button label="Down" icon="arrow-down" size="sm" variant="ghost" accessibilityLabel={`Move step ${i + 1} down`} disabled={i === steps.length - 1} onPress={() => onMove?.(i, 1)} />
                <Button label="Remove" icon="trash-2" size="sm" variant="ghost" accessibilityLabel={`Remove step ${i + 1}`} onPress={() => onRemove?.(i)} />
              </View>
            )}
          </View>
        );
      })}
    </View>
  );
}

const styles = StyleSheet.create({
  row: { borderRadius: radii.md, borderWidth: 1, borderColor: colors.border, backgroundColor: colors.surface, padding: spacing.sm, gap: spacing.xs },
  rowSelected: { borderColor: colors.accent },
  main: { flexDirection: 'row', gap: spacing.md, alignItems: 'flex-start', borderRadius: radii.sm, padding: spacing.xs },
  pressed: { backgroundColor: colors.raised },
  focused: { outlineColor: colors.accent, outlineWidth: 2, outlineStyle: 'solid' },
  index: { width: 28, height: 28, borderRadius: radii.pill, backgroundColor: colors.accentTint, alignItems: 'center', justifyContent: 'center' },
  texts: { flex: 1, gap: 2 },
  actions: { flexDirection: 'row', flexWrap: 'wrap', justifyContent: 'flex-end' },
});
