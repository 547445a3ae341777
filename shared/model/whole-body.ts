import type { Body } from '../contracts/body.ts';
import { compileBody } from '../kinematics/body-model.ts';
import { createBodyPose, forwardKinematics } from '../kinematics/forward-kinematics.ts';
import { pointMassTensor, rotateTensor } from '../math/inertia.ts';
import { mat3Add } from '../math/mat3.ts';
import { symmetricEigen3 } from '../math/symmetric-eigen.ts';
import type { Vec3 } from '../math/vec3.ts';
import type { Posture } from './reference-posture.ts';

/** Whole-body mass properties in one posture, expressed in the root segment's frame. */
export interface WholeBodyInertia {
  /** Total mass, kg. */
  mass: number;
  /** System centre of mass in the root frame, m. */
  com: Vec3;
  /** Inertia tensor about the system CoM in the root frame, kg·m² (flat, row-major). */
  inertia: number[];
  /** Principal moments about the system CoM, ascending, kg·m². */
  principalMoments: Vec3;
  /** Unit principal axes in the root frame; principalAxes[k] belongs to principalMoments[k]. */
  principalAxes: [Vec3, Vec3, Vec3];
}

/**
 * Whole-body mass, CoM and inertia of a validated contract body in a posture (degrees by dof name;
 * omitted dofs at 0, the reference posture): I = Σ R_i J_i R_iᵀ + m_i(|d_i|²E − d_i d_iᵀ),
 * d_i = segment CoM − system CoM (the locked inertia of DESIGN.md, "The computation"). Segment poses
 * come from the shared forward kinematics. A non-zero angle for a dof the body lacks throws.
 */
export function wholeBodyInertia(body: Body, posture: Posture = {}): WholeBodyInertia {
  const model = compileBody(body);
  const q = new Float64Array(model.dofCount);
  for (const [name, deg] of Object.entries(posture)) {
    if (deg === undefined || deg === 0) continue;
    const k = model.dofIndex.get(name);
    if (k === undefined) throw new Error(`posture: dof "${name}" is not in body "${body.name}"`);
    if (!Number.isFinite(deg)) throw new Error(`posture: dof "${name}" is not a finite number`);
    q[k] = (deg * Math.PI) / 180;
  }
  const pose = createBodyPose(model);
  forwardKinematics(model, q, pose);

  // system CoM
  const com: Vec3 = [0, 0, 0];
  for (let i = 0; i < model.segmentCount; i++)
    for (let k = 0; k < 3; k++) com[k] += (model.mass[i] * pose.comPos[3 * i + k]) / model.totalMass;

  // each segment's own inertia turned into the root frame, plus its parallel-axis term
  let inertia = new Array<number>(9).fill(0);
  for (let i = 0; i < model.segmentCount; i++) {
    const d = [0, 1, 2].map((k) => pose.comPos[3 * i + k] - com[k]);
    inertia = mat3Add(inertia, rotateTensor(pose.rot.subarray(9 * i, 9 * i + 9), model.inertia.subarray(9 * i, 9 * i + 9)));
    inertia = mat3Add(inertia, pointMassTensor(model.mass[i], d));
  }
  const eig = symmetricEigen3(inertia);
  return { mass: model.totalMass, com, inertia, principalMoments: eig.values, principalAxes: eig.vectors };
}
