/**
 * What the engine, the CLI and the API return for one simulation (DESIGN.md "Result").
 * Angles in degrees, times in seconds, attitude quaternions rotate body (root-segment) frame
 * vectors into the inertial frame, which coincides with the root frame at t = 0.
 */
import { z } from 'zod';

/** Unit quaternion {w,x,y,z}, body → inertial. */
export const attitudeSchema = z.object({ w: z.number(), x: z.number(), y: z.number(), z: z.number() });
/** Attitude quaternion as JSON. */
export type Attitude = z.infer<typeof attitudeSchema>;

/** One out-of-range stretch of one dof within one step. */
export const rangeViolationSchema = z.object({
  /** Dof name. */
  dof: z.string(),
  /** Index of the step in which it happens. */
  step: z.number().int(),
  /** Which limit is crossed. */
  bound: z.enum(['min', 'max']),
  /** The limit, degrees. */
  limitDeg: z.number(),
  /** Start and end of the stretch beyond the limit, seconds from the sequence start. */
  from: z.number(),
  to: z.number(),
  /** Time of the worst excursion, seconds. */
  worstTime: z.number(),
  /** Angle at the worst excursion, degrees. */
  worstAngleDeg: z.number(),
  /** How far beyond the limit at worst, degrees (> 0). */
  marginDeg: z.number(),
});
/** A range violation. */
export type RangeViolation = z.infer<typeof rangeViolationSchema>;

/** One sample for the 3D view. */
export const sampleSchema = z.object({
  /** Seconds from the sequence start. */
  t: z.number(),
  /** Root-segment attitude {w,x,y,z}, body → inertial. */
  attitude: attitudeSchema,
  /** Joint angles, degrees, in the order of `samples.dofs`. */
  jointsDeg: z.array(z.number()),
});

/** Intrinsic z-y′-x″ yaw, pitch, roll of a computed attitude, degrees (yaw and roll may be unwrapped). */
export const yprSchema = z.object({ yaw: z.number(), pitch: z.number(), roll: z.number() });

/** A rotation as angle (degrees, 0–180) and unit axis. */
export const angleAxisSchema = z.object({ angleDeg: z.number(), axis: z.tuple([z.number(), z.number(), z.number()]) });

/** Where a run ends: the engine's result and the stored verification report give it alike. */
export const finalStateSchema = z.object({
  /** Final attitude {w,x,y,z}, body → inertial, with w ≥ 0. */
  attitude: attitudeSchema,
  /** The same rotation as angle and unit axis (inertial = initial root frame). */
  rotation: angleAxisSchema,
  yprDeg: yprSchema,
  /** Final joint angles by dof name, degrees. */
  jointsDeg: z.record(z.string(), z.number()),
});

/** The full result of one simulation. */
export const simulationResultSchema = z.object({
  /** Engine version that computed this result. */
  engineVersion: z.string(),
  /** Total duration of the sequence, seconds. */
  duration: z.number(),
  /**
   * Rotation travelled, ∫|ω| dt, degrees: the sum of the angles between successive samples (a lower
   * bound that converges as the sample rate grows; includes the to-and-fro within every cycle).
   */
  pathDeg: z.number(),
  final: finalStateSchema,
  /** Momentum audit: max ‖H‖ over the samples from differenced world-frame segment poses. */
  momentumResidual: z.object({
    /** Max ‖H‖ about the system CoM, kg·m²/s. */
    maxAbs: z.number(),
    /** maxAbs divided by the peak shape momentum ‖h‖ (dimensionless; 0 if nothing moves). */
    relative: z.number(),
    /** Peak ‖h‖ (momentum of the shape motion alone), kg·m²/s. */
    peakShapeMomentum: z.number(),
    /** Time of the max ‖H‖, seconds. */
    atTime: z.number(),
    /** Number of audited instants. */
    points: z.number().int(),
  }),
  /** Angles beyond a dof's [min, max]. */
  rangeViolations: z.array(rangeViolationSchema),
  /** Peak |joint rate| over the sequence, deg/s, and where it occurs. */
  peakJointRateDegS: z.object({
    max: z.number(),
    dof: z.string().nullable(),
    time: z.number(),
    /** Peak |rate| per dof, deg/s. */
    byDof: z.record(z.string(), z.number()),
  }),
  /** Samples at `rateHz`, first at t = 0, last at the end. */
  samples: z.object({
    rateHz: z.number(),
    /** Dof names, the order of every sample's `jointsDeg`. */
    dofs: z.array(z.string()),
    frames: z.array(sampleSchema),
  }),
  /** Integrator statistics. */
  solver: z.object({
    method: z.string(),
    rhsEvaluations: z.number().int(),
    steps: z.number().int(),
    rejectedSteps: z.number().int(),
    pieces: z.number().int(),
    tolerances: z.object({ relative: z.number(), absolute: z.number() }),
  }),
});

/** The full result of one simulation. */
export type SimulationResult = z.infer<typeof simulationResultSchema>;
