/**
 * Forward kinematics of the body tree in the root segment's frame: each segment's rotation, origin
 * and CoM for given joint angles, and (optionally) their velocities for given joint rates.
 * Allocation-free: results go into a preallocated BodyPose.
 */
import { mat3FromAxisAngle, mat3Multiply, mat3MulVec } from '../math/mat3.ts';
import type { BodyModel } from './body-model.ts';

/** Mutable pose buffers for one body, all in the root segment's frame. */
export interface BodyPose {
  /** Segment → root rotation per segment, row-major 3×3; 9 per segment. */
  rot: Float64Array;
  /** Segment frame origin (joint centre), m; 3 per segment. */
  pos: Float64Array;
  /** Segment CoM, m; 3 per segment. */
  comPos: Float64Array;
  /** Each dof's unit axis in the root frame at the current pose; 3 per dof. */
  dofAxisRoot: Float64Array;
  /** Segment angular velocity relative to the root frame, rad/s; 3 per segment (filled by segmentVelocities). */
  angVel: Float64Array;
  /** Segment CoM velocity relative to the root frame, m/s; 3 per segment (filled by segmentVelocities). */
  comVel: Float64Array;
  /** Scratch. */
  tmpRot: Float64Array;
  tmpRot2: Float64Array;
  tmpVec: Float64Array;
}

/** Allocates pose buffers for a model. */
export function createBodyPose(model: BodyModel): BodyPose {
  const n = model.segmentCount;
  return {
    rot: new Float64Array(9 * n), pos: new Float64Array(3 * n), comPos: new Float64Array(3 * n),
    dofAxisRoot: new Float64Array(3 * Math.max(1, model.dofCount)),
    angVel: new Float64Array(3 * n), comVel: new Float64Array(3 * n),
    tmpRot: new Float64Array(9), tmpRot2: new Float64Array(9), tmpVec: new Float64Array(3),
  };
}

/**
 * Fills pose.rot, pos, comPos and dofAxisRoot for joint angles q (rad, one per dof).
 * Child frame = parent frame moved by joint.origin, then rotated by Rot(a₁,θ₁)·Rot(a₂,θ₂)·….
 */
export function forwardKinematics(model: BodyModel, q: ArrayLike<number>, pose: BodyPose): void {
  const { parent, origin, com, dofStart, dofAxis } = model;
  const { rot, pos, comPos, dofAxisRoot, tmpRot, tmpRot2, tmpVec } = pose;
  for (let i = 0; i < model.segmentCount; i++) {
    const p = parent[i];
    if (p < 0) {
      // Root: identity rotation at the origin.
      rot.fill(0, 9 * i, 9 * i + 9); rot[9 * i] = 1; rot[9 * i + 4] = 1; rot[9 * i + 8] = 1;
      pos[3 * i] = 0; pos[3 * i + 1] = 0; pos[3 * i + 2] = 0;
    } else {
      // Origin: parent position + parent rotation · joint origin.
      mat3MulVec(rot, origin, tmpVec, 9 * p, 3 * i, 0);
      pos[3 * i] = pos[3 * p] + tmpVec[0]; pos[3 * i + 1] = pos[3 * p + 1] + tmpVec[1]; pos[3 * i + 2] = pos[3 * p + 2] + tmpVec[2];
      // Rotation: start from the parent's, then apply each dof in order.
      for (let r = 0; r < 9; r++) rot[9 * i + r] = rot[9 * p + r];
      for (let k = dofStart[i]; k < dofStart[i + 1]; k++) {
        // The dof axis in the root frame uses the rotation left by the previous dofs.
        mat3MulVec(rot, dofAxis, dofAxisRoot, 9 * i, 3 * k, 3 * k);
        mat3FromAxisAngle(dofAxis, q[k], tmpRot, 3 * k, 0);
        mat3Multiply(rot, tmpRot, tmpRot2, 9 * i, 0, 0);
        for (let r = 0; r < 9; r++) rot[9 * i + r] = tmpRot2[r];
      }
    }
    // CoM: origin + rotation · com.
    mat3MulVec(rot, com, tmpVec, 9 * i, 3 * i, 0);
    comPos[3 * i] = pos[3 * i] + tmpVec[0]; comPos[3 * i + 1] = pos[3 * i + 1] + tmpVec[1]; comPos[3 * i + 2] = pos[3 * i + 2] + tmpVec[2];
  }
}

/**
 * Fills pose.angVel and pose.comVel (relative to the root frame) for joint rates qd (rad/s),
 * after forwardKinematics for the same angles. Analytic: ω_i = ω_parent + Σ axis_k·θ̇_k,
 * v_origin_i = v_origin_parent + ω_parent × (pos_i − pos_parent), v_com_i = v_origin_i + ω_i × (com_i − pos_i).
 * `originVel` is scratch of 3 per segment (joint-centre velocities).
 */
export function segmentVelocities(model: BodyModel, qd: ArrayLike<number>, pose: BodyPose, originVel: Float64Array): void {
  const { parent, dofStart } = model;
  const { pos, comPos, dofAxisRoot, angVel, comVel } = pose;
  for (let i = 0; i < model.segmentCount; i++) {
    const p = parent[i];
    let wx = 0, wy = 0, wz = 0, vx = 0, vy = 0, vz = 0;
    if (p >= 0) {
      const pwx = angVel[3 * p], pwy = angVel[3 * p + 1], pwz = angVel[3 * p + 2];
      const rx = pos[3 * i] - pos[3 * p], ry = pos[3 * i + 1] - pos[3 * p + 1], rz = pos[3 * i + 2] - pos[3 * p + 2];
      vx = originVel[3 * p] + pwy * rz - pwz * ry;
      vy = originVel[3 * p + 1] + pwz * rx - pwx * rz;
      vz = originVel[3 * p + 2] + pwx * ry - pwy * rx;
      wx = pwx; wy = pwy; wz = pwz;
      for (let k = dofStart[i]; k < dofStart[i + 1]; k++) {
        wx += dofAxisRoot[3 * k] * qd[k]; wy += dofAxisRoot[3 * k + 1] * qd[k]; wz += dofAxisRoot[3 * k + 2] * qd[k];
      }
    }
    angVel[3 * i] = wx; angVel[3 * i + 1] = wy; angVel[3 * i + 2] = wz;
    originVel[3 * i] = vx; originVel[3 * i + 1] = vy; originVel[3 * i + 2] = vz;
    const cx = comPos[3 * i] - pos[3 * i], cy = comPos[3 * i + 1] - pos[3 * i + 1], cz = comPos[3 * i + 2] - pos[3 * i + 2];
    comVel[3 * i] = vx + wy * cz - wz * cy;
    comVel[3 * i + 1] = vy + wz * cx - wx * cz;
    comVel[3 * i + 2] = vz + wx * cy - wy * cx;
  }
}
