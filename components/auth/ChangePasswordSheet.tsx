import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';

import { useServerForm } from '@/components/api/use-server-form';
import { useChangePasswordMutation } from '@/components/api/use-session';
import { ErrorBanner } from '@/components/ui/ErrorBanner';
import { FormSheet } from '@/components/ui/FormSheet';
import { FormTextField } from '@/components/ui/FormTextField';
import { Text } from '@/components/ui/Text';

import { NewPasswordFields } from './NewPasswordFields';
import { changePasswordFormSchema } from './password-confirmation';

/** Props of {@link ChangePasswordSheet}. */
export interface ChangePasswordSheetProps {
  visible: boolean;
  onClose: () => void;
  /** Called after the server changed the password (it also signed the user out everywhere). */
  onChanged: () => void;
}

/** Current password, new password twice; a wrong current password shows beside its field. */
export function ChangePasswordSheet({ visible, onClose, onChanged }: ChangePasswordSheetProps) {
  const form = useForm({
    resolver: zodResolver(changePasswordFormSchema),
    defaultValues: { currentPassword: '', newPassword: '', confirm: '' },
  });
  const { formError, pending, submit, reset } = useServerForm(form, {
    mutation: useChangePasswordMutation(),
    toRequest: ({ currentPassword, newPassword }) => ({ currentPassword, newPassword }),
    serverFields: ['currentPassword', 'newPassword'],
    onSuccess: onChanged,
    resetOnSuccess: true,
  });
  const cancel = () => {
    reset();
    onClose();
  };
  return (
    <FormSheet visible={visible} onCancel={cancel} title="Change password" submit={{ label: 'Change password', pending, onPress: submit }}>
      <Text tone="muted">You will be signed out on every device and sign in again with the new password.</Text>
      <ErrorBanner error={formError} />
      <FormTextField control={form.control} name="currentPassword" label="Current password" secureTextEntry autoComplete="current-password" />
      <NewPasswordFields control={form.control} name="newPassword" label="New password" confirmName="confirm" confirmLabel="Repeat new password" />
    </FormSheet>
  );
}
