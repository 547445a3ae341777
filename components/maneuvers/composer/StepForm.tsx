import { type Control, Controller, type FieldErrors, useFieldArray } from 'react-hook-form';
import { StyleSheet, View } from 'react-native';

import { gaps, spacing } from '@/components/theme';
import { Button } from '@/components/ui/Button';
import { FormTextField } from '@/components/ui/FormTextField';
import { SegmentedControl } from '@/components/ui/SegmentedControl';
import { Select } from '@/components/ui/Select';
import { Text } from '@/components/ui/Text';
import { TextField } from '@/components/ui/TextField';
import { DOF_LABELS, DOF_NAMES } from '@/shared/model/dof-names';
import type { Primitive } from '@/shared/primitives/primitive-schemas';

import { type CustomAngleRow, type FieldSpec, PRIMITIVE_FIELDS, type StepFormValues } from './primitive-fields';

/** Props of {@link StepForm}. */
export interface StepFormProps {
  control: Control<StepFormValues, unknown, Primitive>;
  /** Current values (from `watch()`), for fields shown only for some choices. */
  values: StepFormValues;
  errors: FieldErrors<StepFormValues>;
}

const DOF_CHOICES = DOF_NAMES.map((d) => ({ value: d, label: DOF_LABELS[d] }));

/** The fields of one primitive kind, each with its unit, hint and the schema's error beside it. */
export function StepForm({ control, values, errors }: StepFormProps) {
  const fields = PRIMITIVE_FIELDS[values.kind] ?? [];
  return (
    <View style={gaps.lg}>
      {fields.filter((f) => !f.showIf || f.showIf(values)).map((f) => (
        <StepField key={`${values.kind}-${f.name}`} spec={f} control={control} />
      ))}
      {values.kind === 'pose_shift' && values.posture === 'custom' ? <CustomAngles control={control} errors={errors} /> : null}
    </View>
  );
}

function StepField({ spec, control }: { spec: FieldSpec; control: StepFormProps['control'] }) {
  const name = spec.name;
  if (spec.type === 'number') {
    return <FormTextField control={control as never} name={name} label={spec.label} unit={spec.unit} hint={spec.hint} inputMode="decimal" />;
  }
  return (
    <Controller
      control={control}
      name={name}
      render={({ field, fieldState }) =>
        // Short choices as a segmented row; long labels would be cut off there, so they get a drop-down.
        spec.choices.length <= 3 && spec.choices.every((c) => c.label.length <= 14) ? (
          <SegmentedControl label={spec.label} options={spec.choices} value={field.value as string} onChange={field.onChange} error={fieldState.error?.message} />
        ) : (
          <Select label={spec.label} options={spec.choices} value={(field.value as string) ?? ''} onChange={field.onChange} error={fieldState.error?.message} hint={spec.hint} />
        )
      }
    />
  );
}

/** Dof + angle rows of a custom pose shift. */
function CustomAngles({ control, errors }: { control: StepFormProps['control']; errors: FieldErrors<StepFormValues> }) {
  const { fields, append, remove } = useFieldArray({ control: control as unknown as Control<{ customRows: CustomAngleRow[] }>, name: 'customRows' });
  const customError = errors.custom as { message?: string } | Record<string, { message?: string }> | undefined;
  const messages: string[] = [];
  if (customError) {
    if (typeof customError.message === 'string') messages.push(customError.message);
    else for (const [dof, e] of Object.entries(customError as Record<string, { message?: string } | undefined>)) if (e?.message) messages.push(`${dof}: ${e.message}`);
  }
  return (
    <View style={gaps.sm}>
      <Text variant="label" tone="muted">
        Joint angles (only these joints move; the rest stay)
      </Text>
      {fields.map((row, i) => (
        <View key={row.id} style={styles.customRow}>
          <View style={styles.customDof}>
            <Controller
              control={control}
              name={`customRows.${i}.dof`}
              render={({ field }) => <Select label={`Joint ${i + 1}`} options={DOF_CHOICES} value={field.value ?? ''} onChange={field.onChange} placeholder="Choose a joint" />}
            />
          </View>
          <View style={styles.customAngle}>
            <Controller
              control={control}
              name={`customRows.${i}.angle`}
              render={({ field }) => <TextField label={`Angle ${i + 1}`} unit="°" value={field.value ?? ''} onChangeText={field.onChange} inputMode="decimal" />}
            />
          </View>
          <Button label="Remove" variant="ghost" size="sm" icon="x" accessibilityLabel={`Remove joint ${i + 1}`} onPress={() => remove(i)} />
        </View>
      ))}
      {messages.map((m) => (
        <Text key={m} variant="caption" tone="danger" role="alert">
          {m}
        </Text>
      ))}
      <Button label="Add a joint" variant="secondary" size="sm" icon="plus" onPress={() => append({ dof: '', angle: '0' })} />
    </View>
  );
}

const styles = StyleSheet.create({
  customRow: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'flex-end', gap: spacing.sm },
  customDof: { flexGrow: 2, flexBasis: 180 },
  customAngle: { flexGrow: 1, flexBasis: 90 },
});
