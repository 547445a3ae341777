/**
 * What a robustness run stores as JSON (db/schema/robustness.ts): the inputs snapshot every chunk
 * computes from, each chunk's per-sample errors and the merged figures. The job code parses these
 * columns with the schemas here where it reads them, so a malformed row is an error that names the
 * field, never a silent default.
 */
import { z } from 'zod';

import { bodySchema } from './body.ts';
import { robustnessStatsSchema } from './robustness.ts';
import { sequenceSchema } from './sequence.ts';

/** The snapshot on the run: the body, the nominal compiled sequence and the target attitude [w,x,y,z]. */
export const robustnessRunInputsSchema = z.object({
  body: bodySchema,
  sequence: sequenceSchema,
  target: z.array(z.number()).length(4),
});
export type RobustnessRunInputs = z.infer<typeof robustnessRunInputsSchema>;

/** Final attitude error of one sample in each execution model, degrees. */
export const robustnessSampleSchema = z.object({
  index: z.number().int().min(0),
  openLoopErrorDeg: z.number(),
  feedbackErrorDeg: z.number(),
});
export type RobustnessSample = z.infer<typeof robustnessSampleSchema>;

/** The figures merged from every sample of a finished run. */
export const robustnessFiguresSchema = robustnessStatsSchema.extend({
  /** Final error with feedback of every sample, degrees, in sample order (for the histogram). */
  feedbackErrorsDeg: z.array(z.number()),
});
export type RobustnessFigures = z.infer<typeof robustnessFiguresSchema>;
