import type { FieldValues } from 'react-hook-form';

import { type BoundProps, useBoundField } from '@/components/ui/form-binding';

import { NumberField, type NumberFieldProps } from './NumberField';

/** A NumberField bound to react-hook-form: the form holds the parsed number and shows its validation error beside the field. */
export function FormNumberField<T extends FieldValues, TOut extends FieldValues = T>({ control, name, ...number }: BoundProps<Omit<NumberFieldProps, 'onBlur'>, T, TOut>) {
  const field = useBoundField(control, name);
  // The field starts empty unless the form holds a number for it (the schema reports anything else).
  return <NumberField {...number} value={typeof field.value === 'number' ? field.value : undefined} onChange={field.onChange} onBlur={field.onBlur} error={field.error} />;
}
