/**
 * GET /api/motion/:versionId — everything the 3D rehearsal view needs for one sequence version:
 * the body (segment table), the engine's samples, step boundaries with cues, and the target attitude.
 * Angles in degrees, times in seconds, attitudes {w,x,y,z} rotate body (root-segment) vectors into
 * the inertial frame (which coincides with the root frame at t = 0).
 */
import { z } from 'zod';

import type { Body } from './body.ts';
import type { SequenceTarget, VersionHeading } from './maneuver.ts';
import type { Attitude, SimulationResult } from './result.ts';
import type { Step } from './sequence.ts';

/** Sample-rate bounds of the motion endpoint, Hz (the view interpolates between samples). */
export const MOTION_RATE = { min: 5, max: 120 } as const;

/** Query of GET /api/motion/:versionId. */
export const motionQuerySchema = z.object({
  /**
   * Samples per second, Hz (5–120). Omitted: the verified samples exactly as stored with the version
   * (the verification's rate); another rate is derived from them, never simulated again.
   */
  rate: z.coerce.number().int('rate must be a whole number of samples per second')
    .min(MOTION_RATE.min, `rate must be at least ${MOTION_RATE.min} Hz`)
    .max(MOTION_RATE.max, `rate must be at most ${MOTION_RATE.max} Hz`)
    .optional(),
});

/**
 * One step of the sequence on the timeline: a step as the composer lists it (DECISIONS.md "Steps");
 * composer, review, player, cue card and rehearsal log number the same steps.
 */
export interface MotionStep {
  /** Index in the composer's step list (0-based). */
  index: number;
  /** Engine kind of the step's own motion (after any lead-in). */
  kind: Step['kind'];
  /** Start (of the lead-in, when there is one) and end, seconds from the sequence start. */
  start: number;
  end: number;
  /** The joining move into the step's start posture: from `start` to `leadIn.end`, a cue of a few words; null when none is needed. */
  leadIn: { end: number; cue: string } | null;
  /** Where the step's own motion (and its cycles) begins, s: `leadIn.end`, or `start`. */
  cycleStart: number;
  /** Cyclic steps: number of cycles (may be fractional) and seconds per cycle; null otherwise. */
  cycles: number | null;
  period: number | null;
  /** What to do, in words for the trainee. */
  cue: string;
}

/** Response of GET /api/motion/:versionId: the version named as the trainee's screens name it, then its motion. */
export interface MotionResponse extends VersionHeading {
  /** The body contract of the version's profile version (segment table the view draws). */
  body: Body;
  /** Engine version that verified the version and produced the samples (the one its approval binds to). */
  engineVersion: string;
  /** When that verification ran (ISO-8601). */
  verifiedAt: string;
  /** Engine version this server runs now. */
  runningEngineVersion: string;
  /** True when the server now runs another engine version than the one that verified this version (the samples stay the verified ones). */
  verifiedByOtherEngine: boolean;
  /** Total duration, seconds. */
  duration: number;
  /** The verified samples (first at t = 0, last at `duration`); joint angles in the order of `dofs`. */
  samples: SimulationResult['samples'];
  /** Steps in order, covering [0, duration]. */
  steps: MotionStep[];
  /** The target this version was composed and verified for. */
  target: SequenceTarget;
  /** The target as an attitude {w,x,y,z}, w ≥ 0 (the view's target ghost). */
  targetAttitude: Attitude;
  /** The verified end state. */
  final: SimulationResult['final'];
}

/**
 * Response of GET /api/sequences/:sequenceId/plans/:planId/candidates/:rank/motion: a planner
 * suggestion's motion for the 3D preview before it is used. Not a saved version: simulated on the
 * plan's profile version body by the running engine, with the candidate's compiled steps and cues.
 */
export interface CandidateMotionResponse extends Omit<MotionResponse, 'versionId' | 'version' | 'status' | 'verifiedAt'> {
  planId: string;
  /** The candidate's rank in its plan (1 = best). */
  rank: number;
  /** When this motion was simulated (ISO-8601). */
  computedAt: string;
}

/** What the 3D player draws: a saved version's motion or a suggestion's. */
export type PlayerMotion = MotionResponse | CandidateMotionResponse;
