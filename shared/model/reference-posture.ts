import { DOF_NAMES, type DofName } from './dof-names.ts';

/** Joint angles in degrees, keyed by dof name; a dof left out is at 0 (its reference value). */
export type Posture = Partial<Record<string, number>>;

/**
 * The reference posture: every dof at 0° — standing upright, arms hanging at the sides with the
 * palms forward (the anatomical position), legs straight and together at hip-joint spacing.
 */
export const REFERENCE_POSTURE: Readonly<Record<DofName, number>> = Object.freeze(
  Object.fromEntries(DOF_NAMES.map((name) => [name, 0])) as Record<DofName, number>,
);

/** Both arms straight overhead (shoulders flexed 180°), the rest as in the reference posture. */
export const ARMS_OVERHEAD_POSTURE: Readonly<Posture> = Object.freeze({ l_sh_flex: 180, r_sh_flex: 180 });

/**
 * A tucked posture: hips and knees flexed, arms forward around the shins, trunk bent forward.
 * Angles stay within the unsuited ranges.
 */
export const TUCKED_POSTURE: Readonly<Posture> = Object.freeze({
  waist_flex: 40,
  l_hip_flex: 120,
  r_hip_flex: 120,
  l_knee_flex: 130,
  r_knee_flex: 130,
  l_sh_flex: 60,
  r_sh_flex: 60,
  l_elbow_flex: 90,
  r_elbow_flex: 90,
});
