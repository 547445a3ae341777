import { type Control, Controller, type FieldPath, type FieldValues } from 'react-hook-form';

import { TextField, type TextFieldProps } from './TextField';

/** Props of {@link FormTextField}: a react-hook-form `control` and field `name`, plus any TextField prop. */
export type FormTextFieldProps<T extends FieldValues> = Omit<TextFieldProps, 'value' | 'onChangeText' | 'error'> & {
  control: Control<T>;
  name: FieldPath<T>;
};

/**
 * A TextField bound to react-hook-form: shows the field's validation or server error beside it.
 * Values stay strings; let the zod schema coerce numbers (`z.coerce.number()`).
 */
export function FormTextField<T extends FieldValues>({ control, name, onBlur, ...field }: FormTextFieldProps<T>) {
  return (
    <Controller
      control={control}
      name={name}
      render={({ field: f, fieldState }) => (
        <TextField
          {...field}
          value={f.value == null ? '' : String(f.value)}
          onChangeText={f.onChange}
          onBlur={(e) => {
            f.onBlur();
            onBlur?.(e);
          }}
          error={fieldState.error?.message}
        />
      )}
    />
  );
}
