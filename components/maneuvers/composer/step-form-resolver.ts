import { zodResolver } from '@hookform/resolvers/zod';
import type { Resolver } from 'react-hook-form';
import { z } from 'zod';

import { type Primitive, primitiveSchema } from '@/shared/primitives/primitive-schemas';

import { formToPrimitiveInput, type StepFormValues } from './primitive-fields';

/**
 * react-hook-form resolver for the step editor: converts the form's text to numbers, then validates
 * with the shared primitive schema (the same one the server applies), so errors land beside the
 * field they name.
 */
const stepFormSchema = z.preprocess((values) => formToPrimitiveInput(values as StepFormValues), primitiveSchema) as unknown as z.ZodType<Primitive, StepFormValues>;

export const stepFormResolver: Resolver<StepFormValues, unknown, Primitive> = zodResolver(stepFormSchema);

/** Parses form values into a primitive without raising errors (for the live cue preview). */
export function tryParseStep(values: StepFormValues): Primitive | null {
  const r = primitiveSchema.safeParse(formToPrimitiveInput(values));
  return r.success ? r.data : null;
}
