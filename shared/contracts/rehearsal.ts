/**
 * Rehearsals: a trainee's logged run of a cleared sequence version (POST/GET /api/rehearsals),
 * and the list of versions a trainee can rehearse (GET /api/rehearsals/available).
 */
import { z } from 'zod';

import type { RecheckInfo } from '../product/recheck-status.ts';
import type { SequenceTarget, VersionHeading } from './maneuver.ts';
import { PLAYBACK_SPEED_RANGE, PLAYBACK_SPEEDS } from './playback-speeds.ts';

export { PLAYBACK_SPEED_RANGE, PLAYBACK_SPEEDS };

/** POST /api/rehearsals body. */
export const logRehearsalSchema = z.object({
  /** The cleared sequence version rehearsed. */
  sequenceVersionId: z.string().uuid('sequenceVersionId must be a version id'),
  /** Playback speed used, × real time (0.25–2). */
  playbackSpeed: z.number().finite()
    .min(PLAYBACK_SPEED_RANGE.min, `playbackSpeed must be at least ${PLAYBACK_SPEED_RANGE.min}×`)
    .max(PLAYBACK_SPEED_RANGE.max, `playbackSpeed must be at most ${PLAYBACK_SPEED_RANGE.max}×`),
  /** Steps completed (0 … the version's step count; the server checks the upper bound). */
  completedSteps: z.number().int('completedSteps must be a whole number').min(0, 'completedSteps must be at least 0'),
  /** How it went, 1 (struggled) … 5 (confident). */
  selfRating: z.number().int('selfRating must be a whole number').min(1, 'selfRating must be 1–5').max(5, 'selfRating must be 1–5'),
  /** Free text, at most 2000 characters. */
  notes: z.string().max(2000, 'notes must be at most 2000 characters').default(''),
});
/** POST /api/rehearsals body. */
export type LogRehearsalRequest = z.input<typeof logRehearsalSchema>;

/** Query of GET /api/rehearsals. */
export const rehearsalListQuerySchema = z.object({
  /** Only rehearsals of this version. */
  versionId: z.string().uuid('versionId must be a version id').optional(),
});

/** One logged rehearsal as the API returns it. */
export interface Rehearsal {
  id: string;
  sequenceVersionId: string;
  /** Sequence name and version number of the rehearsed version. */
  sequenceName: string;
  version: number;
  traineeId: string;
  traineeName: string;
  /** ISO 8601 time of the log. */
  performedAt: string;
  /** × real time. */
  playbackSpeed: number;
  completedSteps: number;
  totalSteps: number;
  /** 1–5. */
  selfRating: number;
  notes: string;
  /** The engine version that verified the rehearsed version (what its approval binds to); null before verification. */
  engineVersion: string | null;
}

/**
 * A version the trainee may rehearse (status `cleared`: playable), or one they rehearsed that now
 * needs a re-check (`recheck`: its profile changed, shown with a notice until re-cleared).
 */
export interface RehearsableVersion extends VersionHeading {
  /** The target this version was composed and verified for. */
  target: SequenceTarget;
  /** Target in words, e.g. "yaw 90°, pitch 0°, roll 0°". */
  targetLabel: string;
  /** Total duration of the verified run, seconds. */
  duration: number;
  /** Number of steps as the composer lists them (joining moves are lead-ins, not steps). */
  stepCount: number;
  /** The engine version that verified this version (what its approval binds to); null before verification. */
  engineVersion: string | null;
  /** True when the server now runs another engine version (the player still shows the verified result). */
  verifiedByOtherEngine: boolean;
  /** ISO 8601 time of clearance. */
  clearedAt: string | null;
  /** The trainee's latest rehearsal of this version, if any. */
  lastRehearsal: { performedAt: string; selfRating: number; completedSteps: number; totalSteps: number } | null;
  /** Number of logged rehearsals of this version by this trainee. */
  rehearsalCount: number;
  /** A `recheck` version: what its re-check waits for (message: shared/product/recheck-status.ts); null otherwise. */
  recheck: RecheckInfo | null;
}
