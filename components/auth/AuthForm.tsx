import type { ReactNode } from 'react';
import { View } from 'react-native';

import { gaps } from '@/components/theme';
import { Button } from '@/components/ui/Button';
import { ErrorBanner } from '@/components/ui/ErrorBanner';
import type { SubmitAction } from '@/components/ui/FormSheet';

/** Props of {@link AuthForm}. */
export interface AuthFormProps {
  /** The server's sentence when the whole form was refused (wrong password, expired invitation…). */
  error: string | null;
  submit: SubmitAction;
  /** The fields. */
  children: ReactNode;
}

/** A form on the sign-in card: the server's sentence above, the fields, and one full-width submit button. */
export function AuthForm({ error, submit, children }: AuthFormProps) {
  return (
    <View style={gaps.lg}>
      <ErrorBanner error={error} />
      {children}
      <Button label={submit.label} icon={submit.icon} block loading={submit.pending} onPress={submit.onPress} />
    </View>
  );
}
