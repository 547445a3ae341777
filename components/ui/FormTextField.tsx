import type { FieldValues } from 'react-hook-form';

import { type BoundProps, useBoundField } from './form-binding';
import { TextField, type TextFieldProps } from './TextField';

/** Props of {@link FormTextField}: a react-hook-form `control` and field `name`, plus any TextField prop. */
export type FormTextFieldProps<T extends FieldValues, TOut extends FieldValues = T> = BoundProps<TextFieldProps, T, TOut>;

/**
 * A TextField bound to react-hook-form: shows the field's validation or server error beside it.
 * Values stay strings; let the zod schema coerce numbers (`z.coerce.number()`).
 */
export function FormTextField<T extends FieldValues, TOut extends FieldValues = T>({ control, name, onBlur, ...input }: FormTextFieldProps<T, TOut>) {
  const field = useBoundField(control, name);
  return (
    <TextField
      {...input}
      value={field.value == null ? '' : String(field.value)}
      onChangeText={field.onChange}
      onBlur={(e) => {
        field.onBlur();
        onBlur?.(e);
      }}
      error={field.error}
    />
  );
}
