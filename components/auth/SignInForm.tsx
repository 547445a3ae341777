import { useForm } from 'react-hook-form';

import { useServerForm } from '@/components/api/use-server-form';
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
  const form = useForm<SignInRequest>({ resolver: signInResolver, defaultValues: { email: '', password: '' } });
  const { formError, pending, submit } = useServerForm(form, {
    mutation: useSignInMutation(),
    toRequest: (values) => values,
    serverFields: ['email', 'password'],
    onSuccess: ({ user }) => onSignedIn(user),
  });
  return (
    <AuthForm error={formError} submit={{ label: 'Sign in', icon: 'log-in', pending, onPress: submit }}>
      <FormTextField
        control={form.control}
        name="email"
        label="E-mail"
        autoComplete="email"
        inputMode="email"
        autoCapitalize="none"
        placeholder="name@example.org"
        returnKeyType="next"
      />
      <FormTextField
        control={form.control}
        name="password"
        label="Password"
        autoComplete="current-password"
        secureTextEntry
        returnKeyType="go"
        onSubmitEditing={submit}
      />
    </AuthForm>
  );
}
