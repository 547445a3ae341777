/**
 * Recorded motion (issue 15): joint-angle tracks imported from a joint-angle CSV or a BVH
 * motion-capture file, stored as a uniform-rate track on the standard human model's dofs, ready to
 * become a `track` step. Angles in degrees, times in seconds.
 */
import { z } from 'zod';

import { DOF_NAMES } from '../model/dof-names.ts';
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

/** A stored recording as the API returns it. */
export interface RecordingView {
  id: string;
  name: string;
  source: (typeof RECORDING_SOURCES)[number];
  uploadId: string;
  fileName: string;
  crewMemberId: string | null;
  /** Uniform frame rate of `frames`, Hz. */
  rateHz: number;
  /** Seconds: (frames − 1)/rateHz. */
  duration: number;
  dofs: string[];
  /** Frames (degrees, in the order of `dofs`); frame k at k/rateHz s. */
  frames: number[][];
  /** What the import assumed (resampling, BVH axes and rest pose), for people to check. */
  assumptions: string[];
  /** BVH only: the mapping in force and the file's joints. */
  mapping: BvhMapping | null;
  bvhJoints: BvhJointInfo[] | null;
  createdAt: string;
}

/** One simulated outcome of a rehearsal recording on one profile version. */
export interface CaptureOutcome {
  profileVersionId: string;
  profileVersion: number;
  /** `plan`: the profile version the plan was verified for; `current`: the trainee's current one. */
  role: 'plan' | 'current';
  /** Attitude the recorded motion would have reached in free fall, {w,x,y,z}. */
  reached: { w: number; x: number; y: number; z: number };
  reachedYprDeg: { yaw: number; pitch: number; roll: number };
  /** Angle from the reached attitude to the plan's target, and to the plan's own simulated result, degrees. */
  errorToTargetDeg: number;
  errorToPlanDeg: number;
}

/** Per plan sweep step, the recorded timing and amplitude (see server/recordings/compare-execution.ts). */
export interface CaptureStepTiming {
  /** The step's number as the composer, player and rehearsal log list it (1-based). */
  step: number;
  cue: string;
  startS: number;
  endS: number;
  periodRatio: number;
  amplitudeRatio: number;
  phaseLagS: number;
  dofs: { dof: string; periodRatio: number; amplitudeRatio: number; phaseLagS: number; fitRmsDeg: number }[];
}

/** Planned and executed series for the overlay plot (same times). */
export interface CaptureOverlay {
  t: number[];
  /** Joint angles by dof, degrees. */
  planned: Record<string, number[]>;
  executed: Record<string, number[]>;
  /** Rotation angle from the start attitude, degrees. */
  plannedTurnDeg: number[];
  executedTurnDeg: number[];
}

/** A rehearsal's recording and what it would have done. */
export interface RehearsalCapture {
  rehearsalId: string;
  uploadId: string;
  fileName: string;
  rateHz: number;
  duration: number;
  dofs: string[];
  assumptions: string[];
  /** Plan: the target and the plan's own result. */
  targetYprDeg: { yaw: number; pitch: number; roll: number } | null;
  planReachedYprDeg: { yaw: number; pitch: number; roll: number };
  outcomes: CaptureOutcome[];
  steps: CaptureStepTiming[];
  overlay: CaptureOverlay;
  signedOff: { by: string; byName: string; at: string; note: string } | null;
  createdAt: string;
}

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
