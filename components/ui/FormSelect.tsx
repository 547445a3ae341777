import type { FieldValues } from 'react-hook-form';

import { type BoundProps, useBoundField } from './form-binding';
import { Select, type SelectProps } from './Select';

/** A Select bound to react-hook-form: an unset field selects the placeholder; the field's error shows beneath. */
export function FormSelect<T extends FieldValues, V extends string, TOut extends FieldValues = T>({ control, name, ...select }: BoundProps<SelectProps<V>, T, TOut>) {
  const field = useBoundField(control, name);
  return <Select {...select} value={field.value ?? ''} onChange={field.onChange} error={field.error} />;
}
