import type { FieldValues } from 'react-hook-form';

import { type BoundProps, useBoundField } from './form-binding';
import { SegmentedControl, type SegmentedControlProps } from './SegmentedControl';

/** A SegmentedControl bound to react-hook-form, with the field's error beneath it. */
export function FormSegmentedControl<T extends FieldValues, V extends string, TOut extends FieldValues = T>({ control, name, ...segments }: BoundProps<SegmentedControlProps<V>, T, TOut>) {
  const field = useBoundField(control, name);
  return <SegmentedControl {...segments} value={field.value} onChange={field.onChange} error={field.error} />;
}
