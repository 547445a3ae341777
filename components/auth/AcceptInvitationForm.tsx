import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';

import { applyServerError } from '@/components/api/form-errors';
import { useAcceptInvitationMutation } from '@/components/api/use-invitation';
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
  const accept = useAcceptInvitationMutation(token);
  const [formError, setFormError] = useState<string | null>(null);
  const { control, handleSubmit, setError } = useForm({
    resolver: zodResolver(acceptInvitationFormSchema),
    defaultValues: { password: '', confirm: '' },
  });
  const submit = handleSubmit(({ password }) => {
    setFormError(null);
    accept.mutate(
      { password },
      {
        onSuccess: ({ user }) => onAccepted(user),
        onError: (err) => setFormError(applyServerError(err, ['password'], setError)),
      },
    );
  });
  return (
    <AuthForm error={formError} submit={{ label: 'Set password and sign in', icon: 'check', pending: accept.isPending, onPress: () => void submit() }}>
      <NewPasswordFields
        control={control}
        name="password"
        label="Choose a password"
        confirmName="confirm"
        confirmLabel="Repeat the password"
        onSubmitEditing={() => void submit()}
      />
    </AuthForm>
  );
}
