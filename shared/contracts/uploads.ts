import { z } from 'zod';

import type { SegmentLengthKey } from './profile-inputs.ts';
import type { StaleVersion } from './profile-version.ts';

/** Largest accepted upload, bytes (1 MiB): a measurement table for a whole crew is a few KB. */
export const UPLOAD_MAX_BYTES = 1024 * 1024;

/** What an upload holds. */
export const UPLOAD_KINDS = ['measurements_csv', 'segment_table_csv', 'segment_table_json', 'joint_angles_csv', 'bvh'] as const;
export type UploadKind = (typeof UPLOAD_KINDS)[number];

/** An upload is imported whole or rejected whole. */
export const UPLOAD_STATUSES = ['imported', 'rejected'] as const;

/** One problem in an uploaded file: the row (as numbered in the file, header = row 1), the column and why. */
export const uploadRowErrorSchema = z.object({
  /** Line in the file, 1 = header; 0 when the problem is the file as a whole. */
  row: z.number().int().min(0),
  /** Column name as in the documented header ('' when the whole row or file is at fault). */
  column: z.string(),
  /** Sentence for people. */
  reason: z.string(),
});
export type UploadRowError = z.infer<typeof uploadRowErrorSchema>;

/**
 * One data row of an imported file as the file had it, by column name: a CSV's cells as text, a
 * BVH frame's angles, a JSON segment table's fields (the importers check the values; this is the record).
 */
export const uploadRowDataSchema = z.record(z.string(), z.unknown());
export type UploadRowData = z.infer<typeof uploadRowDataSchema>;

/** An upload as the API returns it. */
export interface UploadView {
  id: string;
  kind: UploadKind;
  fileName: string;
  contentType: string;
  sizeBytes: number;
  sha256: string;
  /** Object-storage key of the raw file: uploads/<id>/<file name>. */
  objectKey: string;
  status: (typeof UPLOAD_STATUSES)[number];
  rowCount: number;
  errors: UploadRowError[];
  uploadedBy: string | null;
  createdAt: string;
}

/** What an import did per row. */
export interface ImportedRowResult {
  row: number;
  crewMemberId: string;
  name: string;
  /** `created`: a new crew member; `updated`: a new version of an existing member with that name. */
  action: 'created' | 'updated';
  version: number;
}

/** Response of an upload: the stored file's metadata and, when imported, what it created. */
export interface UploadResult {
  upload: UploadView;
  imported: ImportedRowResult[];
  /** Versions the imported profiles made stale (present for imports that save profiles). */
  staleVersions?: StaleVersion[];
}

/**
 * Columns of the measurements CSV, one row per crew member, in documented order. Required:
 * name, sex, stature_m, mass_kg. Lengths in metres, mass in kg. `suit`: the id or name of a stored
 * suit configuration, empty for none.
 */
export const MEASUREMENT_COLUMNS = [
  'name',
  'call_sign',
  'sex',
  'stature_m',
  'mass_kg',
  'suit',
  'biacromial_m',
  'hip_breadth_m',
  'head_m',
  'upper_trunk_m',
  'middle_trunk_m',
  'lower_trunk_m',
  'upper_arm_m',
  'forearm_m',
  'hand_m',
  'thigh_m',
  'shank_m',
  'foot_m',
  'ankle_height_m',
  'note',
] as const;

/** The measurements CSV columns that must be present (and non-empty in each row). */
export const MEASUREMENT_REQUIRED = ['name', 'sex', 'stature_m', 'mass_kg'] as const;

/** Which measured segment length each length column fills. */
export const MEASUREMENT_LENGTH_COLUMNS: Record<string, SegmentLengthKey> = {
  head_m: 'head',
  upper_trunk_m: 'upperTrunk',
  middle_trunk_m: 'middleTrunk',
  lower_trunk_m: 'lowerTrunk',
  upper_arm_m: 'upperArm',
  forearm_m: 'forearm',
  hand_m: 'hand',
  thigh_m: 'thigh',
  shank_m: 'shank',
  foot_m: 'foot',
  ankle_height_m: 'ankleHeight',
};

/**
 * Columns of the measured segment table CSV, one row per segment of the standard human model.
 * CoM in the segment frame (m); inertia about the segment CoM in the segment frame (kg·m²); the
 * three products of inertia are optional (0 when empty).
 */
export const SEGMENT_TABLE_COLUMNS = [
  'segment',
  'mass_kg',
  'com_x_m',
  'com_y_m',
  'com_z_m',
  'ixx_kgm2',
  'iyy_kgm2',
  'izz_kgm2',
  'ixy_kgm2',
  'ixz_kgm2',
  'iyz_kgm2',
] as const;
