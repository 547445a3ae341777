import type { DofName } from '../../../shared/model/dof-names.ts';

/**
 * Typical active ranges of motion of healthy adults (degrees from neutral), copied from the
 * project's shared table ../shared/data/joint-ranges-unsuited.csv (copied verbatim beside this file):
 * - upper limb: AAOS values as tabulated in Norkin C.C. & White D.J., Measurement of Joint Motion:
 *   A Guide to Goniometry (F.A. Davis), Table A.1;
 * - lower limb: the range-of-motion table of the Merck Manual (professional edition).
 * The tests compare these with that copy.
 */
export const UNSUITED_ROM_DEG = {
  shoulder: { flexion: 180, extension: 60, abduction: 180, medial_rotation: 70, lateral_rotation: 90 },
  elbow: { flexion: 150 },
  forearm: { pronation: 80, supination: 80 },
  wrist: { flexion: 80, extension: 70 },
  hip: { flexion: 125, hyperextension: 15, abduction: 45, adduction: 45, lateral_rotation: 45, medial_rotation: 45 },
  knee: { flexion: 130 },
  ankle: { plantarflexion: 50, dorsiflexion: 20 },
} as const;

/**
 * Thoracolumbar (waist) ranges: not in the shared table. AAOS thoracolumbar values as commonly
 * reproduced — flexion 80°, extension 25°, rotation 45° each way — typed from memory. The model's
 * single waist joint carries the whole thoracolumbar range.
 */
export const WAIST_ROM_DEG_FROM_MEMORY = { flexion: 80, extension: 25, rotation: 45 } as const;

const r = UNSUITED_ROM_DEG;

/**
 * Unsuited [min, max] per dof in degrees, in the model's sign convention (positive = flexion,
 * abduction, medial rotation). Shoulder adduction below 0 is blocked by the trunk in the reference
 * posture and the table gives no value, so the abduction minimum is 0.
 */
export const UNSUITED_DOF_RANGES: Record<DofName, { min: number; max: number }> = {
  waist_rot: { min: -WAIST_ROM_DEG_FROM_MEMORY.rotation, max: WAIST_ROM_DEG_FROM_MEMORY.rotation },
  waist_flex: { min: -WAIST_ROM_DEG_FROM_MEMORY.extension, max: WAIST_ROM_DEG_FROM_MEMORY.flexion },
  l_sh_flex: { min: -r.shoulder.extension, max: r.shoulder.flexion },
  l_sh_abd: { min: 0, max: r.shoulder.abduction },
  l_sh_rot: { min: -r.shoulder.lateral_rotation, max: r.shoulder.medial_rotation },
  l_elbow_flex: { min: 0, max: r.elbow.flexion },
  r_sh_flex: { min: -r.shoulder.extension, max: r.shoulder.flexion },
  r_sh_abd: { min: 0, max: r.shoulder.abduction },
  r_sh_rot: { min: -r.shoulder.lateral_rotation, max: r.shoulder.medial_rotation },
  r_elbow_flex: { min: 0, max: r.elbow.flexion },
  l_hip_flex: { min: -r.hip.hyperextension, max: r.hip.flexion },
  l_hip_abd: { min: -r.hip.adduction, max: r.hip.abduction },
  l_hip_rot: { min: -r.hip.lateral_rotation, max: r.hip.medial_rotation },
  l_knee_flex: { min: 0, max: r.knee.flexion },
  r_hip_flex: { min: -r.hip.hyperextension, max: r.hip.flexion },
  r_hip_abd: { min: -r.hip.adduction, max: r.hip.abduction },
  r_hip_rot: { min: -r.hip.lateral_rotation, max: r.hip.medial_rotation },
  r_knee_flex: { min: 0, max: r.knee.flexion },
};
