import { useEffect } from 'react';
import { useForm, useWatch } from 'react-hook-form';
import { StyleSheet, View } from 'react-native';

import { RecordedSweepPreview } from '@/components/recordings/RecordedSweepPreview';
import { colors, gaps, radii, spacing } from '@/components/theme';
import { Button } from '@/components/ui/Button';
import { Select } from '@/components/ui/Select';
import { Text } from '@/components/ui/Text';
import { cueFor } from '@/shared/primitives/primitive-cues';
import { defaultPrimitive, type Primitive, PRIMITIVE_LABELS, type PrimitiveKind } from '@/shared/primitives/primitive-schemas';

import { primitiveToForm, type StepFormValues } from './primitive-fields';
import { stepFormResolver, tryParseStep } from './step-form-resolver';
import { StepForm } from './StepForm';

/** Kinds made from scratch here (a recorded sweep comes from an imported recording). */
type FormKind = Exclude<PrimitiveKind, 'recorded_sweep'>;
const KIND_CHOICES = (Object.keys(PRIMITIVE_LABELS) as PrimitiveKind[]).filter((k): k is FormKind => k !== 'recorded_sweep').map((k) => ({ value: k, label: PRIMITIVE_LABELS[k] }));

/** Props of {@link StepEditor}. */
export interface StepEditorProps {
  /** The step being edited (a new step starts from the kind's defaults). */
  initial: Primitive;
  /** 1-based position, for the heading. */
  position: number;
  /** Called with the validated step. */
  onApply: (step: Primitive) => void;
  onCancel: () => void;
  /** Whether the buttons sit inside the editor (inline, wide screens) — the sheet has its own footer. */
  inlineButtons?: boolean;
  /** Register the form's submit so a sheet footer can call it. */
  submitRef?: { current: (() => void) | null };
  /** The maneuver's crew member (a recorded sweep is plotted against their joint ranges). */
  crewMemberId?: string;
  /** A new recorded sweep's channels that were left out (the body has no such dof). */
  droppedChannels?: readonly string[];
}

/**
 * Edits one step: its kind and the kind's fields (react-hook-form, validated by the shared primitive
 * schema), with a live preview of the trainee's cue.
 */
export function StepEditor({ initial, position, onApply, onCancel, inlineButtons = false, submitRef, crewMemberId, droppedChannels }: StepEditorProps) {
  const { control, handleSubmit, reset, formState } = useForm<StepFormValues, unknown, Primitive>({
    resolver: stepFormResolver,
    defaultValues: primitiveToForm(initial),
    mode: 'onTouched',
  });
  const values = useWatch({ control }) as StepFormValues;
  const preview = tryParseStep(values);
  const apply = handleSubmit((step) => onApply(step));
  // Hand the sheet footer the latest submit after each render.
  useEffect(() => {
    if (submitRef) submitRef.current = () => void apply();
  });
  return (
    <View style={gaps.lg} testID="step-editor">
      <Select<FormKind>
        label={`Step ${position} kind`}
        options={values.kind === 'recorded_sweep' ? [{ value: 'recorded_sweep' as FormKind, label: PRIMITIVE_LABELS.recorded_sweep }] : KIND_CHOICES}
        value={values.kind as FormKind}
        onChange={(k) => k && k !== ('recorded_sweep' as string) && reset(primitiveToForm(defaultPrimitive(k)))}
      />
      <StepForm control={control} values={values} errors={formState.errors} />
      {initial.kind === 'recorded_sweep' ? (
        <RecordedSweepPreview step={preview?.kind === 'recorded_sweep' ? preview : initial} crewMemberId={crewMemberId} dropped={droppedChannels} />
      ) : null}
      <View style={styles.cue} role="status" aria-live="polite" aria-label="Cue preview">
        <Text variant="overline" tone="muted">
          Cue the trainee reads
        </Text>
        <Text testID="cue-preview" tone={preview ? 'default' : 'muted'}>
          {preview ? cueFor(preview) : 'Fix the fields above to see the cue.'}
        </Text>
      </View>
      {inlineButtons ? (
        <View style={styles.buttons}>
          <Button label="Cancel" variant="secondary" onPress={onCancel} />
          <Button label="Apply step" icon="check" onPress={() => void apply()} />
        </View>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  cue: { padding: spacing.md, borderRadius: radii.md, backgroundColor: colors.raised, gap: spacing.xs },
  buttons: { flexDirection: 'row', justifyContent: 'flex-end', gap: spacing.sm },
});
