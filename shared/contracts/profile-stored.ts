/**
 * Schemas of a profile version's stored JSON (profile_versions.inputs and .summary; the body is
 * the body contract). The server parses these columns with them where it reads a row
 * (server/crew/profile-row.ts); the types stay those of profile-version.ts, which the schemas
 * must produce (checked by `satisfies`).
 */
import { z } from 'zod';

import { profileInputsSchema } from './profile-inputs.ts';
import type { ProfileSummary, StoredProfileInputs } from './profile-version.ts';

const triple = z.tuple([z.number(), z.number(), z.number()]);

/** Whole-body mass properties in the reference posture, and one row per segment. */
export const profileSummarySchema = z.object({
  mass: z.number(),
  com: triple,
  principalMoments: triple,
  principalAxes: z.tuple([triple, triple, triple]),
  segments: z.array(z.object({ name: z.string(), mass: z.number(), com: triple, principalMoments: triple })),
  modelVersion: z.string(),
}) satisfies z.ZodType<ProfileSummary>;

/** The inputs as saved (a measured version may lack the regression's inputs) and the measured table, if any. */
export const storedProfileInputsSchema = profileInputsSchema.partial().extend({
  measuredTable: z.object({ uploadId: z.string(), fileName: z.string(), segments: z.array(z.string()) }).optional(),
}) satisfies z.ZodType<StoredProfileInputs>;
