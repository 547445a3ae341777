import { z } from 'zod';

/** Every API error has this body: a machine code, a sentence for people, and the field at fault if any. */
export const apiErrorSchema = z.object({
  error: z.object({
    code: z.string(),
    message: z.string(),
    field: z.string().optional(),
  }),
});
export type ApiErrorBody = z.infer<typeof apiErrorSchema>;

