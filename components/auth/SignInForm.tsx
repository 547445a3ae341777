import { useState } from 'react';
import { useForm } from 'react-hook-form';

import { applyServerError } from '@/components/api/form-errors';
import { useSignInMutation } from '@/components/api/use-session';
import { FormTextField } from '@/components/ui/FormTextField';
import type { SessionUser, SignInRequest } from '@/shared/contracts/auth';

import { AuthForm } from './AuthForm';
import { signInResolver } from './sign-in-check';

/** Props of {@link SignInForm}. */
export interface SignInFormProps {
  /** Called with the signed-in user once the server accepted the password. */
  onSignedIn: (user: SessionUser) => void;
}

/** E-mail and password form; wrong credentials and rate limits show the server's sentence above the form. */
export function SignInForm({ onSignedIn }: SignInFormProps) {
  const signIn = useSignInMutation();
  const [formError, setFormError] = useState<string | null>(null);
  const { control, handleSubmit, setError } = useForm<SignInRequest>({
    resolver: signInResolver,
    defaultValues: { email: '', password: '' },
  });
  const submit = handleSubmit((values) => {
    setFormError(null);
    signIn.mutate(values, {
      onSuccess: ({ user }) => onSignedIn(user),
      onError: (err) => setFormError(applyServerError(err, ['email', 'password'], setError)),
    });
  });
  return (
    <AuthForm error={formError} submit={{ label: 'Sign in', icon: 'log-in', pending: signIn.isPending, onPress: () => void submit() }}>
      <FormTextField
        control={control}
        name="email"
        label="E-mail"
        autoComplete="email"
        inputMode="email"
        autoCapitalize="none"
        placeholder="name@example.org"
        returnKeyType="next"
      />
      <FormTextField
        control={control}
        name="password"
        label="Password"
        autoComplete="current-password"
        secureTextEntry
        returnKeyType="go"
        onSubmitEditing={() => void submit()}
      />
    </AuthForm>
  );
}
