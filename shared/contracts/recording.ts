/**
 * Recorded motion (issue 15): joint-angle tracks imported from a joint-angle CSV or a BVH
 * motion-capture file, stored as a uniform-rate track on the standard human model's dofs, ready to
 * become a `track` step. Angles in degrees, times in seconds.
 */
import { z } from 'zod';

import { DOF_NAMES } from '../model/dof-names.ts';
import { attitudeSchema } from './result.ts';
import { TRACK_LIMITS } from './sequence.ts';

/** Segments of the standard human model a BVH joint can drive (those with dofs, plus the root). */
export const MAPPED_SEGMENTS = [
  'upper_trunk', 'lower_trunk',
  'l_upper_arm', 'l_forearm', 'r_upper_arm', 'r_forearm',
  'l_thigh', 'l_shank', 'r_thigh', 'r_shank',
] as const;
/** One mappable segment. */
export type MappedSegment = (typeof MAPPED_SEGMENTS)[number];

/** Which way the recorded figure faces in the BVH file's axes (Y is up in both). */
export const BVH_FACING = ['+z', '-z'] as const;

/**
 * How a BVH skeleton drives the model: the BVH joint whose rotation is each segment's ('' leaves the
 * segment's dofs out of the track), the facing, and which dofs to keep.
 */
export const bvhMappingSchema = z.object({
  /** BVH joint name per model segment ('' = not mapped). */
  joints: z.record(z.enum(MAPPED_SEGMENTS), z.string().max(100)),
  /** Direction the figure faces in the file (its left is then +X for '+z', −X for '-z'). */
  facing: z.enum(BVH_FACING).default('+z'),
  /** Dofs to keep in the track (default: every dof of a mapped segment). */
  dofs: z.array(z.enum(DOF_NAMES)).optional(),
});
/** A BVH mapping. */
export type BvhMapping = z.infer<typeof bvhMappingSchema>;

/** Form fields of POST /api/uploads/joint-angles and /api/uploads/bvh. */
export const recordingUploadFieldsSchema = z.object({
  /** Name shown in lists (default: the file name). */
  name: z.string().trim().max(200).optional(),
  /** Rate the track is resampled to, Hz (default: the file's own rate, rounded). */
  rateHz: z.coerce.number().min(TRACK_LIMITS.minRateHz, `rateHz must be at least ${TRACK_LIMITS.minRateHz} Hz`)
    .max(TRACK_LIMITS.maxRateHz, `rateHz must be at most ${TRACK_LIMITS.maxRateHz} Hz`).optional(),
  /** Crew member the recording belongs to (optional). */
  crewMemberId: z.string().uuid('Not a valid crew member id.').optional(),
});

/** A BVH joint as the mapping screen lists it. */
export interface BvhJointInfo {
  name: string;
  parent: string | null;
  /** Rotation channels in file order, e.g. ['Zrotation', 'Xrotation', 'Yrotation']. */
  rotationChannels: string[];
}

/** Where a recording came from: a joint-angle CSV or a BVH file. */
export const RECORDING_SOURCES = ['joint_angles_csv', 'bvh'] as const;

/** A recorded track as it is described wherever it is shown (a recording, a rehearsal's capture). */
const recordedTrackSchema = z.object({
  /** The uploaded file it was read from. */
  uploadId: z.string(),
  fileName: z.string(),
  /** Uniform frame rate of the frames, Hz. */
  rateHz: z.number(),
  /** Seconds: (frames − 1)/rateHz. */
  duration: z.number(),
  dofs: z.array(z.string()),
  /** What the import assumed (resampling, BVH axes and rest pose), for people to check. */
  assumptions: z.array(z.string()),
});
type RecordedTrackDescription = z.infer<typeof recordedTrackSchema>;

/** A stored recording as the API returns it. */
export interface RecordingView extends RecordedTrackDescription {
  id: string;
  name: string;
  source: (typeof RECORDING_SOURCES)[number];
  crewMemberId: string | null;
  /** Frames (degrees, in the order of `dofs`); frame k at k/rateHz s. */
  frames: number[][];
  /** BVH only: the mapping in force and the file's joints. */
  mapping: BvhMapping | null;
  bvhJoints: BvhJointInfo[] | null;
  createdAt: string;
}

/**
 * A ratio that may not be computable (NaN): JSON has no NaN, so it is written as null and read back
 * as NaN, the value that was computed.
 */
const ratioSchema = z.number().nullable().transform((v) => v ?? Number.NaN);

const yprDegSchema = z.object({ yaw: z.number(), pitch: z.number(), roll: z.number() });

/** One simulated outcome of a rehearsal recording on one profile version. */
export const captureOutcomeSchema = z.object({
  profileVersionId: z.string(),
  profileVersion: z.number(),
  /** `plan`: the profile version the plan was verified for; `current`: the trainee's current one. */
  role: z.enum(['plan', 'current']),
  /** Attitude the recorded motion would have reached in free fall, {w,x,y,z}. */
  reached: attitudeSchema,
  reachedYprDeg: yprDegSchema,
  /** Angle from the reached attitude to the plan's target, and to the plan's own simulated result, degrees. */
  errorToTargetDeg: z.number(),
  errorToPlanDeg: z.number(),
});
export type CaptureOutcome = z.infer<typeof captureOutcomeSchema>;

/** A recorded sweep against the planned one: period and amplitude as recorded ÷ planned, and how late it ran, s. */
const sweepTimingSchema = z.object({ periodRatio: z.number(), amplitudeRatio: ratioSchema, phaseLagS: z.number() });

/** Per plan sweep step, the recorded timing and amplitude (see server/recordings/compare-execution.ts). */
export const captureStepTimingSchema = sweepTimingSchema.extend({
  /** The step's number as the composer, player and rehearsal log list it (1-based). */
  step: z.number(),
  cue: z.string(),
  startS: z.number(),
  endS: z.number(),
  /** Per dof of the sweep (amplitude-weighted into the step's figures), with the sinusoid fit's RMS residual, degrees. */
  dofs: z.array(sweepTimingSchema.extend({ dof: z.string(), fitRmsDeg: z.number() })),
});
export type CaptureStepTiming = z.infer<typeof captureStepTimingSchema>;

/** Planned and executed series for the overlay plot (same times). */
export const captureOverlaySchema = z.object({
  t: z.array(z.number()),
  /** Joint angles by dof, degrees. */
  planned: z.record(z.string(), z.array(z.number())),
  executed: z.record(z.string(), z.array(z.number())),
  /** Rotation angle from the start attitude, degrees. */
  plannedTurnDeg: z.array(z.number()),
  executedTurnDeg: z.array(z.number()),
});
export type CaptureOverlay = z.infer<typeof captureOverlaySchema>;

/** A rehearsal's recording and what it would have done, as stored (the sign-off is kept in its own columns). */
export const storedCaptureSchema = recordedTrackSchema.extend({
  rehearsalId: z.string(),
  /** Plan: the target and the plan's own result. */
  targetYprDeg: yprDegSchema.nullable(),
  planReachedYprDeg: yprDegSchema,
  outcomes: z.array(captureOutcomeSchema),
  steps: z.array(captureStepTimingSchema),
  overlay: captureOverlaySchema,
  createdAt: z.string(),
});
export type StoredCapture = z.infer<typeof storedCaptureSchema>;
/** What is written (a NaN ratio goes in as a number and comes back as null). */
export type StoredCaptureInput = z.input<typeof storedCaptureSchema>;

/** A rehearsal's recording and what it would have done, with its sign-off. */
export type RehearsalCapture = StoredCapture & { signedOff: { by: string; byName: string; at: string; note: string } | null };

/** The executed joint-angle track kept with a capture: dof names, and frames in their order (degrees). */
export const captureTrackSchema = z.object({ dofs: z.array(z.string()), frames: z.array(z.array(z.number())) });
export type CaptureTrack = z.infer<typeof captureTrackSchema>;

/** One rehearsal in a trainee's trend of recorded figures. */
export interface CaptureTrendPoint {
  rehearsalId: string;
  performedAt: string;
  sequenceName: string;
  version: number;
  errorToTargetDeg: number;
  meanPhaseLagS: number | null;
  meanAmplitudeRatio: number | null;
  meanPeriodRatio: number | null;
  signedOff: boolean;
}

/** Body of POST /api/rehearsals/:id/recording/sign-off. */
export const captureSignOffSchema = z.object({ note: z.string().trim().max(2000).default('') });
