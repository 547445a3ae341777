/** Joint angles in degrees, keyed by dof name; a dof left out is at 0 (its reference value). */
export type Posture = Partial<Record<string, number>>;

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
