import { z } from 'zod';

import { checkInertia } from '../math/inertia.ts';
import { DOF_NAMES } from './dof-names.ts';
import { SEGMENT_NAMES } from './segment-names.ts';

/** A segment name of the standard human model. */
export const segmentNameSchema = z.enum(SEGMENT_NAMES);

/** A dof name of the standard human model. */
export const dofNameSchema = z.enum(DOF_NAMES);

/** A finite 3-vector [x, y, z] (m unless stated). */
export const vec3Schema = z.tuple([z.number().finite(), z.number().finite(), z.number().finite()]);

/**
 * An added inertia tensor about the added item's own CoM, in the segment frame, kg·m²:
 * [Ixx, Iyy, Izz] or [Ixx, Iyy, Izz, Ixy, Ixz, Iyz] (the tensor's own off-diagonal entries).
 * Zero is allowed (a point mass); otherwise it must be positive semi-definite and its principal
 * moments must satisfy the triangle inequality, as every rigid body's do.
 */
export const addedInertiaSchema = z
  .union([z.array(z.number().finite()).length(3), z.array(z.number().finite()).length(6)])
  .superRefine((list, ctx) => {
    const { problem } = checkInertia(list, 'semidefinite');
    if (problem === 'not_positive') {
      ctx.addIssue({ code: 'custom', message: 'inertia must be positive semi-definite (a principal moment is negative)' });
    } else if (problem === 'triangle') {
      ctx.addIssue({ code: 'custom', message: 'inertia breaks the triangle inequality (I1 + I2 < I3)' });
    }
  });

/** A joint range in degrees, min < max. */
export const dofRangeSchema = z
  .object({ min: z.number().finite().min(-360), max: z.number().finite().max(360) })
  .refine((r) => r.min < r.max, { message: 'min must be less than max' });
