import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { View } from 'react-native';

import { applyServerError } from '@/components/api/form-errors';
import { useCreateCrewMemberMutation } from '@/components/api/use-crew';
import { gaps } from '@/components/theme';
import { Button } from '@/components/ui/Button';
import { ErrorBanner } from '@/components/ui/ErrorBanner';
import { FormTextField } from '@/components/ui/FormTextField';
import { type CreateCrewMemberInput, type CreateCrewMemberRequest, createCrewMemberRequestSchema } from '@/shared/contracts/crew';

/** Adds a crew member (name, call sign); the profile is entered next, in the editor. */
export function NewMemberForm({ onCreated }: { onCreated: (id: string) => void }) {
  const create = useCreateCrewMemberMutation();
  const [formError, setFormError] = useState<string | null>(null);
  const { control, handleSubmit, setError } = useForm<CreateCrewMemberInput, unknown, CreateCrewMemberRequest>({
    resolver: zodResolver(createCrewMemberRequestSchema),
    defaultValues: { name: '', callSign: '', notes: '' },
  });
  const submit = handleSubmit((values) => {
    setFormError(null);
    create.mutate(values, {
      onSuccess: ({ member }) => onCreated(member.id),
      onError: (err) => setFormError(applyServerError(err, ['name', 'callSign'], setError)),
    });
  });
  return (
    <View style={gaps.lg} role="form" aria-label="New crew member">
      <ErrorBanner error={formError} />
      <FormTextField control={control} name="name" label="Full name" placeholder="First and last name" autoComplete="off" />
      <FormTextField control={control} name="callSign" label="Call sign (optional)" placeholder="e.g. HERON" autoCapitalize="characters" autoComplete="off" />
      <Button label="Add crew member" icon="user-plus" loading={create.isPending} onPress={() => void submit()} />
    </View>
  );
}
