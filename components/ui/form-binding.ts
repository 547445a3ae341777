import { type Control, type FieldPath, type FieldValues, useController } from 'react-hook-form';

/**
 * Props of a control bound to react-hook-form: the form's `control` and the field's `name` take the
 * place of the control's own value, change handler and error. `TOut` is what the form's resolver
 * turns the values into (the control only reads and writes the raw field).
 */
export type BoundProps<P, T extends FieldValues, TOut extends FieldValues = T> = Omit<P, 'value' | 'onChange' | 'onChangeText' | 'error'> & {
  control: Control<T, unknown, TOut>;
  name: FieldPath<T>;
};

/** One form field as a control shows it: its value, handlers, and its validation or server error. */
export function useBoundField<T extends FieldValues, TOut extends FieldValues>(control: Control<T, unknown, TOut>, name: FieldPath<T>) {
  const { field, fieldState } = useController({ control, name });
  return { value: field.value, onChange: field.onChange, onBlur: field.onBlur, error: fieldState.error?.message };
}
