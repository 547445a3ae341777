import type { BodyShape, Vec3 } from './body-shape.ts';
import { add3, inertiaTensor, mulVec3, pointMassTensor, rotateTensor, type Mat3 } from './mat3.ts';
import type { Posture } from './reference-posture.ts';
import { segmentPoses } from './segment-poses.ts';
import { symmetricEigen3 } from './symmetric-eigen.ts';

/** Whole-body mass properties in one posture, expressed in the root segment's frame. */
export interface WholeBodyInertia {
  /** Total mass, kg. */
  mass: number;
  /** System centre of mass in the root frame, m. */
  com: Vec3;
  /** Inertia tensor about the system CoM in the root frame, kg·m² (rows). */
  inertia: Mat3;
  /** Principal moments about the system CoM, ascending, kg·m². */
  principalMoments: Vec3;
  /** Unit principal axes in the root frame; principalAxes[k] belongs to principalMoments[k]. */
  principalAxes: [Vec3, Vec3, Vec3];
}

/**
 * Whole-body mass, CoM and inertia of a contract body in a posture (degrees by dof name; omitted
 * dofs at 0, the reference posture): I = Σ R_i J_i R_iᵀ + m_i(|d_i|²E − d_i d_iᵀ), d_i = segment
 * CoM − system CoM (the locked inertia of DESIGN.md, "The computation").
 */
export function wholeBodyInertia(body: BodyShape, posture: Posture = {}): WholeBodyInertia {
  const poses = segmentPoses(body, posture);
  let mass = 0;
  const weighted: Vec3 = [0, 0, 0];
  const coms: Vec3[] = [];
  body.segments.forEach((seg, i) => {
    const local = mulVec3(poses[i].rotation, seg.com);
    const c: Vec3 = [poses[i].origin[0] + local[0], poses[i].origin[1] + local[1], poses[i].origin[2] + local[2]];
    coms.push(c);
    mass += seg.mass;
    for (let k = 0; k < 3; k++) weighted[k] += seg.mass * c[k];
  });
  const com: Vec3 = [weighted[0] / mass, weighted[1] / mass, weighted[2] / mass];
  let inertia: Mat3 = [
    [0, 0, 0],
    [0, 0, 0],
    [0, 0, 0],
  ];
  body.segments.forEach((seg, i) => {
    const d: Vec3 = [coms[i][0] - com[0], coms[i][1] - com[1], coms[i][2] - com[2]];
    inertia = add3(inertia, rotateTensor(poses[i].rotation, inertiaTensor(seg.inertia)));
    inertia = add3(inertia, pointMassTensor(seg.mass, d));
  });
  const eig = symmetricEigen3(inertia);
  return { mass, com, inertia, principalMoments: eig.values, principalAxes: eig.vectors };
}
