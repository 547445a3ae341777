import { type Control, Controller, type FieldPath, type FieldValues } from 'react-hook-form';

import { NumberField, type NumberFieldProps } from './NumberField';

/** Props of {@link FormNumberField}: a react-hook-form `control` and field `name`, plus the NumberField's label, unit and hint. */
export type FormNumberFieldProps<T extends FieldValues> = Omit<NumberFieldProps, 'value' | 'onChange' | 'onBlur' | 'error'> & {
  control: Control<T>;
  name: FieldPath<T>;
};

/** A NumberField bound to react-hook-form: the form holds the parsed number and shows its validation error beside the field. */
export function FormNumberField<T extends FieldValues>({ control, name, ...field }: FormNumberFieldProps<T>) {
  return (
    <Controller
      control={control}
      name={name}
      render={({ field: f, fieldState }) => (
        <NumberField {...field} value={f.value} onChange={f.onChange} onBlur={f.onBlur} error={fieldState.error?.message} />
      )}
    />
  );
}
