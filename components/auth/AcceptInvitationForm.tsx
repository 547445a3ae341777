import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';

import { useAcceptInvitationMutation } from '@/components/api/use-invitation';
import { useServerForm } from '@/components/api/use-server-form';
import type { SessionUser } from '@/shared/contracts/auth';

import { AuthForm } from './AuthForm';
import { NewPasswordFields } from './NewPasswordFields';
import { acceptInvitationFormSchema } from './password-confirmation';

/** Props of {@link AcceptInvitationForm}. */
export interface AcceptInvitationFormProps {
  /** The token from the e-mailed link. */
  token: string;
  /** Called once the account exists and the invitee is signed in. */
  onAccepted: (user: SessionUser) => void;
}

/** Choose a password (twice) to accept an invitation; the server signs the invitee in. */
export function AcceptInvitationForm({ token, onAccepted }: AcceptInvitationFormProps) {
  const form = useForm({ resolver: zodResolver(acceptInvitationFormSchema), defaultValues: { password: '', confirm: '' } });
  const { formError, pending, submit } = useServerForm(form, {
    mutation: useAcceptInvitationMutation(token),
    toRequest: ({ password }) => ({ password }),
    serverFields: ['password'],
    onSuccess: ({ user }) => onAccepted(user),
  });
  return (
    <AuthForm error={formError} submit={{ label: 'Set password and sign in', icon: 'check', pending, onPress: submit }}>
      <NewPasswordFields
        control={form.control}
        name="password"
        label="Choose a password"
        confirmName="confirm"
        confirmLabel="Repeat the password"
        onSubmitEditing={submit}
      />
    </AuthForm>
  );
}
