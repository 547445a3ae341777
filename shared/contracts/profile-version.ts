import type { Body } from './body.ts';
import type { ProfileInputs } from './profile-inputs.ts';

/** A 3-vector [x, y, z]. */
export type Triple = [number, number, number];

/** One segment's row of the derived table (what the screens list). */
export interface SegmentSummary {
  /** Segment name as in the body contract. */
  name: string;
  /** kg */
  mass: number;
  /** CoM in the segment frame, m. */
  com: Triple;
  /** Principal moments about the segment CoM, ascending, kg·m². */
  principalMoments: Triple;
}

/**
 * Whole-body mass properties of a profile version in the reference posture (every dof at 0°),
 * in the root segment's frame (x anterior, y left, z up).
 */
export interface ProfileSummary {
  /** Total mass, kg. */
  mass: number;
  /** System CoM in the root frame, m. */
  com: Triple;
  /** Principal moments about the system CoM, ascending, kg·m². */
  principalMoments: Triple;
  /** Unit principal axes in the root frame; principalAxes[k] belongs to principalMoments[k]. */
  principalAxes: [Triple, Triple, Triple];
  /** Per segment, in body order. */
  segments: SegmentSummary[];
  /** Version of the derivation rules (the standard human model) or `measured`. */
  modelVersion: string;
}

/**
 * Where a version's body came from: `regression` (the standard human model from the inputs) or
 * `measured` (an uploaded segment table replaced the regression).
 */
export const PROFILE_SOURCES = ['regression', 'measured'] as const;
export type ProfileSource = (typeof PROFILE_SOURCES)[number];

/** The measured-table reference kept in the inputs of a `measured` version. */
export interface MeasuredTableRef {
  uploadId: string;
  fileName: string;
  /** Segments whose mass properties came from the file. */
  segments: string[];
}

/** Stored inputs of a version: the profile inputs (suit snapshot embedded) and, for measured versions, the table. */
export type StoredProfileInputs = Partial<ProfileInputs> & { measuredTable?: MeasuredTableRef };

/** A profile version without its body (history lists). */
export interface ProfileVersionHeader {
  id: string;
  crewMemberId: string;
  version: number;
  source: ProfileSource;
  note: string;
  engineVersion: string;
  authorName: string | null;
  createdAt: string;
  /** Whole-body mass, kg. */
  mass: number;
  /** True for the member's current version. */
  current: boolean;
}

/** One full profile version. */
export interface ProfileVersionView extends ProfileVersionHeader {
  inputs: StoredProfileInputs;
  body: Body;
  summary: ProfileSummary;
}

/** One line of a comparison: a value in version a and in version b. */
export interface ComparisonRow {
  /** Stable key, e.g. `inputs.stature` or `segments.l_thigh.mass`. */
  key: string;
  /** Label for people. */
  label: string;
  /** Unit for display ('' when none). */
  unit: string;
  /** Value in version a (null when absent there). */
  a: string | number | null;
  b: string | number | null;
  /** True when the two differ (numbers: beyond 1e-9 relative and 1e-12 absolute). */
  changed: boolean;
}

/** GET /api/crew/:id/compare?a=&b= — inputs and derived values side by side. */
export interface ProfileComparison {
  a: ProfileVersionHeader;
  b: ProfileVersionHeader;
  inputs: ComparisonRow[];
  wholeBody: ComparisonRow[];
  segments: ComparisonRow[];
  /** Number of changed rows over all three groups. */
  changedCount: number;
}

/**
 * A sequence version that a profile save made stale (DECISIONS.md "Re-check creates the next
 * version"): listed in the save's response so the planner sees at once what must be re-checked.
 */
export interface StaleVersion {
  versionId: string;
  sequenceId: string;
  sequenceName: string;
  version: number;
  /** What it was before the save: `cleared` (trainees rehearsed it) or `under_review`; `recheck` when it was already waiting. */
  was: 'cleared' | 'under_review' | 'recheck';
  /** True when it had been cleared: the re-verification saves its re-check version for the reviewer. */
  onceCleared: boolean;
}

/** Response of POST /api/crew/:id/versions. */
export interface SaveProfileResponse {
  version: ProfileVersionView;
  /** Versions flagged for a re-check by this save, by maneuver name (empty when none). */
  staleVersions: StaleVersion[];
}
