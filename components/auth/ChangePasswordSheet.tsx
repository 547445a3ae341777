import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';

import { applyServerError } from '@/components/api/form-errors';
import { useChangePasswordMutation } from '@/components/api/use-session';
import { Button } from '@/components/ui/Button';
import { ErrorBanner } from '@/components/ui/ErrorBanner';
import { FormTextField } from '@/components/ui/FormTextField';
import { Sheet } from '@/components/ui/Sheet';
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
  const change = useChangePasswordMutation();
  const [formError, setFormError] = useState<string | null>(null);
  const { control, handleSubmit, setError, reset } = useForm({
    resolver: zodResolver(changePasswordFormSchema),
    defaultValues: { currentPassword: '', newPassword: '', confirm: '' },
  });
  const close = () => {
    reset();
    setFormError(null);
    onClose();
  };
  const submit = handleSubmit(({ currentPassword, newPassword }) => {
    setFormError(null);
    change.mutate(
      { currentPassword, newPassword },
      {
        onSuccess: () => {
          reset();
          onChanged();
        },
        onError: (err) => setFormError(applyServerError(err, ['currentPassword', 'newPassword'], setError)),
      },
    );
  });
  return (
    <Sheet
      visible={visible}
      onClose={close}
      title="Change password"
      footer={
        <>
          <Button label="Cancel" variant="ghost" onPress={close} />
          <Button label="Change password" loading={change.isPending} onPress={() => void submit()} />
        </>
      }
    >
      <Text tone="muted">You will be signed out on every device and sign in again with the new password.</Text>
      <ErrorBanner error={formError} />
      <FormTextField control={control} name="currentPassword" label="Current password" secureTextEntry autoComplete="current-password" />
      <NewPasswordFields control={control} name="newPassword" label="New password" confirmName="confirm" confirmLabel="Repeat new password" />
    </Sheet>
  );
}
