import { zodResolver } from '@hookform/resolvers/zod';
import { useForm, useWatch } from 'react-hook-form';
import { StyleSheet, View } from 'react-native';

import { useCrewListQuery } from '@/components/api/use-crew';
import { useCreateSequenceMutation } from '@/components/api/use-sequences';
import { useServerForm } from '@/components/api/use-server-form';
import { spacing } from '@/components/theme';
import { ErrorBanner } from '@/components/ui/ErrorBanner';
import { FormSegmentedControl } from '@/components/ui/FormSegmentedControl';
import { FormSelect } from '@/components/ui/FormSelect';
import { FormSheet } from '@/components/ui/FormSheet';
import { FormTextField } from '@/components/ui/FormTextField';
import { Text } from '@/components/ui/Text';
import type { SequenceSummary } from '@/shared/contracts/maneuver';

import {
  type CreateSequenceFormInput, type CreateSequenceFormOutput, createSequenceFormSchema, EMPTY_CREATE_SEQUENCE_FORM, toCreateSequenceRequest,
} from './create-sequence-form';

/** Props of {@link CreateSequenceSheet}. */
export interface CreateSequenceSheetProps {
  visible: boolean;
  onClose: () => void;
  /** Called with the new sequence (open the composer on it). */
  onCreated: (sequence: SequenceSummary) => void;
  /** Preselected crew member. */
  crewMemberId?: string;
}

/** New maneuver: crew member, name and the target reorientation (yaw/pitch/roll or axis and angle) with its limits. */
export function CreateSequenceSheet({ visible, onClose, onCreated, crewMemberId }: CreateSequenceSheetProps) {
  const crew = useCrewListQuery('');
  const form = useForm<CreateSequenceFormInput, unknown, CreateSequenceFormOutput>({
    resolver: zodResolver(createSequenceFormSchema),
    defaultValues: { ...EMPTY_CREATE_SEQUENCE_FORM, crewMemberId: crewMemberId ?? '' },
    mode: 'onTouched',
  });
  const { control } = form;
  const { formError, pending, submit, reset } = useServerForm(form, {
    mutation: useCreateSequenceMutation(),
    toRequest: toCreateSequenceRequest,
    onSuccess: onCreated,
    resetOnSuccess: true,
  });
  const mode = useWatch({ control, name: 'mode' });
  const cancel = () => {
    reset();
    onClose();
  };
  const members = (crew.data ?? []).filter((m) => m.currentVersion != null);
  return (
    <FormSheet visible={visible} onCancel={cancel} title="New maneuver" submit={{ label: 'Create', icon: 'plus', pending, onPress: submit }}>
      <ErrorBanner error={formError} title="Could not create the maneuver" />
      {crew.isError ? <ErrorBanner title="Could not load the crew" error={crew.error} onRetry={() => void crew.refetch()} /> : null}
      <FormSelect
        control={control}
        name="crewMemberId"
        label="Crew member"
        options={members.map((m) => ({ value: m.id, label: `${m.name} (profile v${m.currentVersion})` }))}
        placeholder={crew.isPending ? 'Loading…' : 'Choose a crew member'}
        hint="Only crew members with a saved inertia profile can have maneuvers."
      />
      <FormTextField control={control} name="name" label="Name" placeholder="e.g. Quarter turn left" />
      <FormSegmentedControl
        control={control}
        name="mode"
        label="Target given as"
        options={[
          { value: 'ypr', label: 'Yaw / pitch / roll' },
          { value: 'axis_angle', label: 'Axis and angle' },
        ]}
      />
      {mode === 'ypr' ? (
        <View style={styles.row}>
          <View style={styles.cell}><FormTextField control={control} name="yaw" label="Yaw" unit="°" inputMode="decimal" /></View>
          <View style={styles.cell}><FormTextField control={control} name="pitch" label="Pitch" unit="°" inputMode="decimal" /></View>
          <View style={styles.cell}><FormTextField control={control} name="roll" label="Roll" unit="°" inputMode="decimal" /></View>
        </View>
      ) : (
        <>
          <View style={styles.row}>
            <View style={styles.cell}><FormTextField control={control} name="axisX" label="Axis x" inputMode="decimal" /></View>
            <View style={styles.cell}><FormTextField control={control} name="axisY" label="Axis y" inputMode="decimal" /></View>
            <View style={styles.cell}><FormTextField control={control} name="axisZ" label="Axis z" inputMode="decimal" /></View>
          </View>
          <FormTextField control={control} name="angleDeg" label="Angle" unit="°" inputMode="decimal" hint="0°–180°, right-handed about the axis" />
        </>
      )}
      <Text variant="caption" tone="muted">
        Angles of the body frame at the start: x out of the chest, y to the left, z toward the head; yaw about z, then pitch about y′, then roll about x″.
      </Text>
      <View style={styles.row}>
        <View style={styles.cell}><FormTextField control={control} name="toleranceDeg" label="Tolerance" unit="°" inputMode="decimal" /></View>
        <View style={styles.cell}><FormTextField control={control} name="rateLimitDegS" label="Joint rate limit" unit="°/s" inputMode="decimal" /></View>
        <View style={styles.cell}><FormTextField control={control} name="timeBudgetS" label="Time budget" unit="s" inputMode="decimal" hint="Blank: none" /></View>
      </View>
    </FormSheet>
  );
}

const styles = StyleSheet.create({
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.md },
  cell: { flexGrow: 1, flexBasis: 96 },
});
