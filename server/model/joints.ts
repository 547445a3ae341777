import type { Vec3 } from '../../shared/math/vec3.ts';
import type { DofName } from '../../shared/model/dof-names.ts';
import { UNSUITED_DOF_RANGES } from './data/joint-ranges-unsuited.ts';

/** A dof as the body contract lists it: axis in the frame left by the previous rotations, degrees. */
export interface ModelDof {
  name: DofName;
  axis: Vec3;
  min: number;
  max: number;
}

/**
 * Rotation axis of each dof in the parent-side joint frame (x anterior, y left, z head in the
 * reference posture), chosen so that a positive angle is the anatomical motion on both sides:
 * - flexion of shoulder, elbow and hip swings the distal end forward: about −y; knee flexion swings
 *   it back: about +y;
 * - abduction swings the limb away from the midline: about +x on the left, −x on the right;
 * - medial rotation turns the limb's front toward the midline: about −z on the left, +z on the right;
 * - the waist joint carries the lower trunk (child) from the upper trunk (root): waist flexion
 *   (chest forward over the pelvis) is the pelvis turning about −y relative to the chest, and
 *   waist_rot (chest to the person's left) is the pelvis turning about −z.
 * Left and right axes are mirror images (an axial vector under y → −y keeps its y component and
 * flips x and z).
 */
export const DOF_AXES: Record<DofName, Vec3> = {
  waist_rot: [0, 0, -1],
  waist_flex: [0, -1, 0],
  l_sh_flex: [0, -1, 0],
  l_sh_abd: [1, 0, 0],
  l_sh_rot: [0, 0, -1],
  l_elbow_flex: [0, -1, 0],
  r_sh_flex: [0, -1, 0],
  r_sh_abd: [-1, 0, 0],
  r_sh_rot: [0, 0, 1],
  r_elbow_flex: [0, -1, 0],
  l_hip_flex: [0, -1, 0],
  l_hip_abd: [1, 0, 0],
  l_hip_rot: [0, 0, -1],
  l_knee_flex: [0, 1, 0],
  r_hip_flex: [0, -1, 0],
  r_hip_abd: [-1, 0, 0],
  r_hip_rot: [0, 0, 1],
  r_knee_flex: [0, 1, 0],
};

/** Unsuited dofs of a joint, in the order given (rotations compose in that order). */
export function unsuitedDofs(names: DofName[]): ModelDof[] {
  return names.map((name) => ({ name, axis: [...DOF_AXES[name]], ...UNSUITED_DOF_RANGES[name] }));
}
