import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { Controller, useForm } from 'react-hook-form';
import { StyleSheet, View } from 'react-native';

import { ApiError, errorMessage } from '@/components/api/client';
import { useSaveProfileMutation } from '@/components/api/use-crew';
import { useSuitsQuery } from '@/components/api/use-suits';
import { colors, gaps, radii, spacing } from '@/components/theme';
import { Button } from '@/components/ui/Button';
import { Card } from '@/components/ui/Card';
import { ErrorBanner } from '@/components/ui/ErrorBanner';
import { FormSegmentedControl } from '@/components/ui/FormSegmentedControl';
import { FormTextField } from '@/components/ui/FormTextField';
import { LoadingState } from '@/components/ui/LoadingState';
import { Select } from '@/components/ui/Select';
import { Text } from '@/components/ui/Text';
import type { SuitView } from '@/shared/contracts/crew';
import type { ProfileVersionView, StaleVersion } from '@/shared/contracts/profile-version';

import { FormNumberField } from './FormNumberField';
import { GearFields } from './GearFields';
import { formValuesFrom, LENGTH_FIELDS, type ProfileFormOutput, profileFormSchema, type ProfileFormValues } from './profile-form';

/** Props of {@link ProfileEditor}. */
export interface ProfileEditorProps {
  crewMemberId: string;
  /** The version the editor starts from (null: the member has none yet). Saved with `baseVersion`. */
  current: ProfileVersionView | null;
  /** After a save: the new version number and the maneuver versions it made stale. */
  onSaved: (version: number, staleVersions: StaleVersion[]) => void;
  onCancel: () => void;
  /** Reloads the member after a 409, so the editor restarts from the newest version. */
  onReload: () => void;
}

const SEX_OPTIONS = [
  { value: 'female', label: 'Female' },
  { value: 'male', label: 'Male' },
] as const;

/** Loads the suits, then shows the form. */
export function ProfileEditor(props: ProfileEditorProps) {
  const suits = useSuitsQuery();
  if (suits.isPending) return <LoadingState label="Loading suit configurations…" />;
  if (suits.isError) return <ErrorBanner title="Could not load the suit configurations" error={suits.error} onRetry={() => void suits.refetch()} />;
  return <ProfileForm {...props} suits={suits.data} />;
}

/**
 * The profile editor: measurements with units, suit, gear and a note; validation messages beside
 * the fields (the API's own zod schema). Saving makes version N+1 on top of the version it opened;
 * if someone saved in between, the 409 message says so and nothing is lost silently.
 */
function ProfileForm({ crewMemberId, current, onSaved, onCancel, onReload, suits }: ProfileEditorProps & { suits: SuitView[] }) {
  // The base is fixed when the editor opens: a background refresh must not move it (that would hide a conflict).
  const [baseVersion] = useState(current?.version ?? 0);
  const [showLengths, setShowLengths] = useState(Object.keys(current?.inputs.lengths ?? {}).length > 0);
  const save = useSaveProfileMutation(crewMemberId);
  const [formError, setFormError] = useState<unknown>(null);
  const { control, handleSubmit, setError } = useForm<ProfileFormValues, unknown, ProfileFormOutput>({
    resolver: zodResolver(profileFormSchema),
    defaultValues: formValuesFrom(current, suits),
    mode: 'onTouched',
  });
  const stale = save.error instanceof ApiError && save.error.code === 'stale_version';

  const submit = handleSubmit((values) => {
    setFormError(null);
    save.mutate(
      { baseVersion, ...values },
      {
        onSuccess: ({ version, staleVersions }) => onSaved(version.version, staleVersions),
        onError: (err) => {
          if (err instanceof ApiError && err.field?.startsWith('inputs.')) {
            setError(err.field as 'inputs.stature', { type: 'server', message: err.message.replace(/^[\w.]+: /, '') }, { shouldFocus: true });
          } else if (!(err instanceof ApiError && err.code === 'stale_version')) setFormError(err);
        },
      },
    );
  });

  const suitOptions = suits.map((s) => ({ value: s.id, label: `${s.config.name}${s.config.illustrative ? ' (illustrative)' : ''}` }));
  return (
    <View style={gaps.md} role="form" aria-label="Profile editor">
      <Text tone="muted">
        {baseVersion ? `Editing on top of version ${baseVersion}. Saving makes version ${baseVersion + 1}; version ${baseVersion} stays as it is.` : 'The first save makes version 1.'}
      </Text>
      {current?.source === 'measured' ? (
        <Text tone="accent">
          Version {current.version} uses a measured segment table. Saving this form derives the body from the regression again; upload the table again to keep measured values.
        </Text>
      ) : null}

      <Card title="Body">
        <View style={gaps.md}>
          <FormSegmentedControl control={control} name="inputs.sex" label="Regression table (sex)" options={SEX_OPTIONS} />
          <FormNumberField control={control} name="inputs.stature" label="Stature" unit="m" hint="1.2–2.3 m" />
          <FormNumberField control={control} name="inputs.mass" label="Body mass" unit="kg" hint="Without suit or gear, 30–200 kg" />
          <FormNumberField control={control} name="inputs.biacromialBreadth" label="Biacromial breadth" unit="m" hint="Shoulder width; empty: a fraction of stature" />
          <FormNumberField control={control} name="inputs.hipBreadth" label="Hip joint spacing" unit="m" hint="Between the hip joint centres; empty: a fraction of stature" />
        </View>
      </Card>

      <Card title="Measured segment lengths" subtitle="Optional: each replaces the length scaled from stature" trailing={<Button label={showLengths ? 'Hide' : 'Show'} size="sm" variant="ghost" onPress={() => setShowLengths(!showLengths)} />}>
        {showLengths ? (
          <View style={gaps.md}>
            {LENGTH_FIELDS.map((f) => (
              <FormNumberField key={f.key} control={control} name={`inputs.lengths.${f.key}`} label={f.label} unit="m" />
            ))}
          </View>
        ) : null}
      </Card>

      <Card title="Suit and gear">
        <View style={gaps.md}>
          <Controller
            control={control}
            name="inputs.suitId"
            render={({ field, fieldState }) => (
              <Select label="Suit" placeholder="None" options={suitOptions} value={field.value ?? ''} onChange={(v) => field.onChange(v || null)} error={fieldState.error?.message} hint="The suit's values are copied into the version when you save." />
            )}
          />
          <GearFields control={control} />
        </View>
      </Card>

      <FormTextField control={control} name="note" label="Note" placeholder="What changed and why" />
      {/* Beside the Save button, where the person is looking when the conflict comes back. */}
      {stale ? (
        <View style={styles.conflict} role="alert">
          <Text variant="bodyStrong" tone="danger">Someone saved a newer version</Text>
          <Text>{errorMessage(save.error)}</Text>
          <Button label="Load the newest version (discards these edits)" variant="secondary" size="sm" onPress={onReload} />
        </View>
      ) : null}
      <ErrorBanner error={formError} />
      <View style={styles.actions}>
        <Button label={baseVersion ? `Save version ${baseVersion + 1}` : 'Save version 1'} icon="save" loading={save.isPending} onPress={() => void submit()} />
        <Button label="Cancel" variant="secondary" onPress={onCancel} />
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  actions: { flexDirection: 'row', gap: spacing.sm, flexWrap: 'wrap' },
  conflict: { gap: spacing.sm, padding: spacing.md, borderRadius: radii.md, backgroundColor: colors.dangerTint, borderWidth: 1, borderColor: colors.danger },
});
