/**
 * Named postures a pose shift can blend to, as joint angles in degrees on the standard human
 * model's dofs (0 = reference posture; positive = flexion, abduction, medial rotation).
 * A named posture sets every dof: those not listed go to 0°.
 */
import type { PostureName } from './primitive-schemas.ts';

/** Angles by dof name, degrees. */
export type PostureAngles = Readonly<Record<string, number>>;

/** The angles of each named posture. */
export const NAMED_POSTURES: Record<PostureName, PostureAngles> = {
  // Standing upright, arms at the sides, palms forward.
  reference: {},
  // A relaxed floating posture: limbs partly flexed, as people settle in weightlessness.
  // Approximate angles, from memory; illustrative, not a published table.
  relaxed_float: {
    l_sh_flex: 35, r_sh_flex: 35, l_sh_abd: 40, r_sh_abd: 40, l_elbow_flex: 50, r_elbow_flex: 50,
    waist_flex: 10, l_hip_flex: 45, r_hip_flex: 45, l_hip_abd: 10, r_hip_abd: 10, l_knee_flex: 50, r_knee_flex: 50,
  },
  // Both arms straight forward at shoulder height.
  arms_forward: { l_sh_flex: 90, r_sh_flex: 90 },
  // Both arms straight overhead.
  arms_overhead: { l_sh_flex: 180, r_sh_flex: 180 },
  // Both arms straight out to the sides at shoulder height.
  arms_out: { l_sh_abd: 90, r_sh_abd: 90 },
  // Hips and knees drawn up, arms forward around the shins, trunk bent forward.
  tuck: {
    waist_flex: 40, l_hip_flex: 120, r_hip_flex: 120, l_knee_flex: 130, r_knee_flex: 130,
    l_sh_flex: 60, r_sh_flex: 60, l_elbow_flex: 90, r_elbow_flex: 90,
  },
};

/** Display names of the named postures. */
export const POSTURE_LABELS: Record<PostureName | 'custom', string> = {
  reference: 'reference posture',
  relaxed_float: 'relaxed float',
  arms_forward: 'arms forward',
  arms_overhead: 'arms overhead',
  arms_out: 'arms out to the sides',
  tuck: 'tuck',
  custom: 'custom posture',
};
