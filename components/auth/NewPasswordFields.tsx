import type { Control, FieldPath, FieldValues } from 'react-hook-form';

import { FormTextField } from '@/components/ui/FormTextField';
import { PASSWORD_MIN_LENGTH } from '@/shared/contracts/auth';

/** Props of {@link NewPasswordFields}. */
export interface NewPasswordFieldsProps<T extends FieldValues> {
  control: Control<T>;
  /** The new password's field and the field that repeats it (checked by ./password-confirmation). */
  name: FieldPath<T>;
  confirmName: FieldPath<T>;
  label: string;
  confirmLabel: string;
  /** Enter in the second field submits the form. */
  onSubmitEditing?: () => void;
}

/** A new password typed twice, with the length rule beside the first field. */
export function NewPasswordFields<T extends FieldValues>({ control, name, confirmName, label, confirmLabel, onSubmitEditing }: NewPasswordFieldsProps<T>) {
  return (
    <>
      <FormTextField
        control={control}
        name={name}
        label={label}
        secureTextEntry
        autoComplete="new-password"
        hint={`At least ${PASSWORD_MIN_LENGTH} characters.`}
      />
      <FormTextField control={control} name={confirmName} label={confirmLabel} secureTextEntry autoComplete="new-password" onSubmitEditing={onSubmitEditing} />
    </>
  );
}
