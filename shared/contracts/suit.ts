import { z } from 'zod';

import { addedInertiaSchema, dofNameSchema, dofRangeSchema, segmentNameSchema, vec3Schema } from '../model/model-schemas.ts';

/**
 * What a suit adds to one segment: a rigid mass fixed to it. Combined with the segment by the
 * parallel-axis theorem.
 */
export const suitSegmentAdditionSchema = z.object({
  /** Added mass, kg (≥ 0). */
  mass: z.number().finite().min(0, 'added mass must not be negative'),
  /** CoM of the added mass in the segment frame, m; default: the segment's own CoM. */
  com: vec3Schema.optional(),
  /** Inertia of the added mass about its own CoM, segment frame, kg·m²; default: zero (point mass). */
  inertia: addedInertiaSchema.optional(),
});
export type SuitSegmentAddition = z.infer<typeof suitSegmentAdditionSchema>;

/**
 * A suit configuration: added mass and inertia per segment, suited joint ranges that replace the
 * unsuited ones for the dofs listed, and the dofs the suit locks (their joints lose those dofs; the
 * segment stays at the reference angle). Planners may edit configurations.
 */
export const suitConfigSchema = z.object({
  /** Stable id, lower-case letters, digits and hyphens (e.g. `pressurised-suit`). */
  id: z.string().regex(/^[a-z0-9][a-z0-9-]{0,62}$/, 'use lower-case letters, digits and hyphens'),
  /** Display name. */
  name: z.string().trim().min(1, 'Enter a name.').max(120),
  /** True when the values are illustrative rather than measured; shown beside every value. */
  illustrative: z.boolean(),
  /** Where the values come from, or why they are what they are. */
  note: z.string().max(4000).default(''),
  /** Added mass per segment (segments left out get nothing). */
  segments: z.partialRecord(segmentNameSchema, suitSegmentAdditionSchema).default({}),
  /** Suited ranges in degrees, replacing the unsuited range of each dof listed. */
  ranges: z.partialRecord(dofNameSchema, dofRangeSchema).default({}),
  /** Dofs the suit locks at 0°. */
  lockedDofs: z.array(dofNameSchema).default([]),
});
/** A validated suit configuration. */
export type SuitConfig = z.infer<typeof suitConfigSchema>;
/** A suit configuration before defaults are applied (what a client may send). */
export type SuitConfigInput = z.input<typeof suitConfigSchema>;

/** PUT /api/suits/:id: the edited configuration and the stored version the edit started from. */
export const updateSuitRequestSchema = suitConfigSchema.extend({
  baseVersion: z.number().int().min(1, 'baseVersion: the suit version your edit started from (1 or more).'),
});
export type UpdateSuitRequest = z.input<typeof updateSuitRequestSchema>;

/**
 * A carried gear item: a rigid mass with its own inertia, fixed to a segment at a position.
 */
export const gearItemSchema = z.object({
  /** Display name, e.g. "tool caddy". */
  name: z.string().trim().min(1, 'Enter a name.').max(120),
  /** Segment it is fixed to. */
  segment: segmentNameSchema,
  /** Mass, kg (> 0). */
  mass: z.number().finite().positive('mass must be positive'),
  /** Its CoM in the segment frame, m. */
  position: vec3Schema,
  /** Its inertia about its own CoM in the segment frame, kg·m²; default zero (a point mass). */
  inertia: addedInertiaSchema.default([0, 0, 0]),
});
/** A validated gear item. */
export type GearItem = z.infer<typeof gearItemSchema>;
/** A gear item before defaults are applied. */
export type GearItemInput = z.input<typeof gearItemSchema>;
