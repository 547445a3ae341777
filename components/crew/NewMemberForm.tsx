import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import { View } from 'react-native';

import { useCreateCrewMemberMutation } from '@/components/api/use-crew';
import { useServerForm } from '@/components/api/use-server-form';
import { gaps } from '@/components/theme';
import { Button } from '@/components/ui/Button';
import { ErrorBanner } from '@/components/ui/ErrorBanner';
import { FormTextField } from '@/components/ui/FormTextField';
import { type CreateCrewMemberInput, type CreateCrewMemberRequest, createCrewMemberRequestSchema } from '@/shared/contracts/crew';

/** Adds a crew member (name, call sign); the profile is entered next, in the editor. */
export function NewMemberForm({ onCreated }: { onCreated: (id: string) => void }) {
  const form = useForm<CreateCrewMemberInput, unknown, CreateCrewMemberRequest>({
    resolver: zodResolver(createCrewMemberRequestSchema),
    defaultValues: { name: '', callSign: '', notes: '' },
  });
  const { formError, pending, submit } = useServerForm(form, {
    mutation: useCreateCrewMemberMutation(),
    toRequest: (values) => values,
    serverFields: ['name', 'callSign'],
    onSuccess: ({ member }) => onCreated(member.id),
  });
  return (
    <View style={gaps.lg} role="form" aria-label="New crew member">
      <ErrorBanner error={formError} />
      <FormTextField control={form.control} name="name" label="Full name" placeholder="First and last name" autoComplete="off" />
      <FormTextField control={form.control} name="callSign" label="Call sign (optional)" placeholder="e.g. HERON" autoCapitalize="characters" autoComplete="off" />
      <Button label="Add crew member" icon="user-plus" loading={pending} onPress={submit} />
    </View>
  );
}
