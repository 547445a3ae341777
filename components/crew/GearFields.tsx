import { type Control, useFieldArray } from 'react-hook-form';
import { StyleSheet, View } from 'react-native';

import { colors, gaps, radii, spacing } from '@/components/theme';
import { Button } from '@/components/ui/Button';
import { FormSelect } from '@/components/ui/FormSelect';
import { FormTextField } from '@/components/ui/FormTextField';
import { Text } from '@/components/ui/Text';
import { SEGMENT_LABELS, SEGMENT_NAMES } from '@/shared/model/segment-names';

import { FormNumberField } from './FormNumberField';
import type { ProfileFormValues } from './profile-form';

const SEGMENT_OPTIONS = SEGMENT_NAMES.map((s) => ({ value: s, label: SEGMENT_LABELS[s] }));
const AXES = ['x (forward)', 'y (left)', 'z (up)'] as const;

/** Carried gear: each a rigid mass fixed to a segment at a position in that segment's frame. */
export function GearFields({ control }: { control: Control<ProfileFormValues> }) {
  const gear = useFieldArray({ control, name: 'inputs.gear' });
  return (
    <View style={gaps.md}>
      {gear.fields.length === 0 ? <Text tone="muted">No gear carried.</Text> : null}
      {gear.fields.map((f, k) => (
        <View key={f.id} style={styles.item} aria-label={`Gear item ${k + 1}`}>
          <FormTextField control={control} name={`inputs.gear.${k}.name`} label={`Gear ${k + 1} name`} placeholder="e.g. tool caddy" />
          <FormSelect control={control} name={`inputs.gear.${k}.segment`} label={`Gear ${k + 1} fixed to`} options={SEGMENT_OPTIONS} />
          <FormNumberField control={control} name={`inputs.gear.${k}.mass`} label={`Gear ${k + 1} mass`} unit="kg" />
          <View style={styles.row}>
            {AXES.map((axis, a) => (
              <View key={axis} style={styles.cell}>
                <FormNumberField control={control} name={`inputs.gear.${k}.position.${a as 0 | 1 | 2}`} label={`Position ${axis}`} unit="m" />
              </View>
            ))}
          </View>
          <Text variant="caption" tone="muted">Position of the item&apos;s centre of mass in the segment&apos;s frame; the item counts as a point mass unless it carries its own inertia.</Text>
          <Button label={`Remove gear ${k + 1}`} icon="trash-2" variant="danger" size="sm" onPress={() => gear.remove(k)} />
        </View>
      ))}
      <Button
        label="Add gear"
        icon="plus"
        variant="secondary"
        size="sm"
        onPress={() => gear.append({ name: '', segment: 'lower_trunk', mass: undefined as unknown as number, position: [0, 0, 0], inertia: [0, 0, 0] })}
      />
    </View>
  );
}

const styles = StyleSheet.create({
  item: { gap: spacing.md, padding: spacing.md, borderRadius: radii.md, borderWidth: 1, borderColor: colors.border },
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.sm },
  cell: { flexGrow: 1, minWidth: 110, flexBasis: 110 },
});
