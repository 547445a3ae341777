/**
 * The joint degrees of freedom of the standard human model, in the order the derived body lists
 * them. Angles in degrees; 0 is the reference posture (standing, arms at the sides, palms forward).
 * Positive values are anatomical on both sides: flexion, abduction, medial (internal) rotation;
 * `waist_rot` positive turns the chest to the person's left relative to the pelvis.
 */
export const DOF_NAMES = [
  'l_sh_flex',
  'l_sh_abd',
  'l_sh_rot',
  'l_elbow_flex',
  'r_sh_flex',
  'r_sh_abd',
  'r_sh_rot',
  'r_elbow_flex',
  'waist_rot',
  'waist_flex',
  'l_hip_flex',
  'l_hip_abd',
  'l_hip_rot',
  'l_knee_flex',
  'r_hip_flex',
  'r_hip_abd',
  'r_hip_rot',
  'r_knee_flex',
] as const;

/** One dof name of the standard human model. */
export type DofName = (typeof DOF_NAMES)[number];

/** Display labels for screens, the composer and cue cards. */
export const DOF_LABELS: Record<DofName, string> = {
  waist_rot: 'Waist rotation (chest to the left +)',
  waist_flex: 'Waist flexion',
  l_sh_flex: 'Left shoulder flexion',
  l_sh_abd: 'Left shoulder abduction',
  l_sh_rot: 'Left shoulder medial rotation',
  l_elbow_flex: 'Left elbow flexion',
  r_sh_flex: 'Right shoulder flexion',
  r_sh_abd: 'Right shoulder abduction',
  r_sh_rot: 'Right shoulder medial rotation',
  r_elbow_flex: 'Right elbow flexion',
  l_hip_flex: 'Left hip flexion',
  l_hip_abd: 'Left hip abduction',
  l_hip_rot: 'Left hip medial rotation',
  l_knee_flex: 'Left knee flexion',
  r_hip_flex: 'Right hip flexion',
  r_hip_abd: 'Right hip abduction',
  r_hip_rot: 'Right hip medial rotation',
  r_knee_flex: 'Right knee flexion',
};

/** True when `name` is one of the standard human model's dofs. */
export function isDofName(name: string): name is DofName {
  return (DOF_NAMES as readonly string[]).includes(name);
}
