/**
 * Each segment's pose in the inertial frame for the 3D view: forward kinematics in the root frame
 * (shared with the engine), shifted so the system centre of mass sits at the origin, then rotated by
 * the attitude. Allocation-free after createWorldPose.
 */
import { type BodyModel } from '@/shared/kinematics/body-model';
import { type BodyPose, createBodyPose, forwardKinematics } from '@/shared/kinematics/forward-kinematics';
import { matrixToQuat, quatToMatrix } from '@/shared/math/quaternion';

/** Preallocated world pose of one body. */
export interface WorldPose {
  /** Root-frame pose (forward kinematics). */
  readonly body: BodyPose;
  /** Segment → inertial rotation, row-major 3×3; 9 per segment. */
  readonly rot: Float64Array;
  /** The same rotations as unit quaternions [w,x,y,z] (w ≥ 0); 4 per segment. */
  readonly quat: Float64Array;
  /** Segment frame origin (joint centre) in the inertial frame, m, system CoM at the origin; 3 per segment. */
  readonly pos: Float64Array;
  /** System CoM in the root frame, m (3). */
  readonly comRoot: Float64Array;
  /** Attitude as a matrix and scratch. */
  readonly att: Float64Array;
  readonly tmp: Float64Array;
  readonly tmpQ: Float64Array;
}

/** Allocates the buffers for a model. */
export function createWorldPose(model: BodyModel): WorldPose {
  const n = model.segmentCount;
  return {
    body: createBodyPose(model), rot: new Float64Array(9 * n), quat: new Float64Array(4 * n), pos: new Float64Array(3 * n),
    comRoot: new Float64Array(3), att: new Float64Array(9), tmp: new Float64Array(9), tmpQ: new Float64Array(4),
  };
}

/** Fills `out` for attitude [w,x,y,z] (body → inertial) and joint angles q (rad, model dof order). */
export function computeWorldPose(model: BodyModel, attitude: ArrayLike<number>, q: ArrayLike<number>, out: WorldPose): void {
  const { body, rot, quat, pos, comRoot, att, tmp, tmpQ } = out;
  forwardKinematics(model, q, body);
  // System CoM in the root frame.
  let cx = 0, cy = 0, cz = 0;
  for (let i = 0; i < model.segmentCount; i++) {
    const m = model.mass[i];
    cx += m * body.comPos[3 * i]; cy += m * body.comPos[3 * i + 1]; cz += m * body.comPos[3 * i + 2];
  }
  cx /= model.totalMass; cy /= model.totalMass; cz /= model.totalMass;
  comRoot[0] = cx; comRoot[1] = cy; comRoot[2] = cz;
  quatToMatrix(attitude, att);
  for (let i = 0; i < model.segmentCount; i++) {
    // World rotation = attitude · segment→root rotation.
    const r = 9 * i;
    for (let a = 0; a < 3; a++) {
      for (let b = 0; b < 3; b++) {
        tmp[3 * a + b] = att[3 * a] * body.rot[r + b] + att[3 * a + 1] * body.rot[r + 3 + b] + att[3 * a + 2] * body.rot[r + 6 + b];
      }
    }
    for (let e = 0; e < 9; e++) rot[r + e] = tmp[e];
    matrixToQuat(tmp, tmpQ);
    quat[4 * i] = tmpQ[0]; quat[4 * i + 1] = tmpQ[1]; quat[4 * i + 2] = tmpQ[2]; quat[4 * i + 3] = tmpQ[3];
    // World origin = attitude · (origin − CoM).
    const px = body.pos[3 * i] - cx, py = body.pos[3 * i + 1] - cy, pz = body.pos[3 * i + 2] - cz;
    pos[3 * i] = att[0] * px + att[1] * py + att[2] * pz;
    pos[3 * i + 1] = att[3] * px + att[4] * py + att[5] * pz;
    pos[3 * i + 2] = att[6] * px + att[7] * py + att[8] * pz;
  }
}

/** out = world position of point p (segment frame, m) on segment i, after computeWorldPose. */
export function segmentPointToWorld(pose: WorldPose, i: number, px: number, py: number, pz: number, out: Float64Array | number[], oo = 0): void {
  const r = 9 * i, R = pose.rot;
  out[oo] = pose.pos[3 * i] + R[r] * px + R[r + 1] * py + R[r + 2] * pz;
  out[oo + 1] = pose.pos[3 * i + 1] + R[r + 3] * px + R[r + 4] * py + R[r + 5] * pz;
  out[oo + 2] = pose.pos[3 * i + 2] + R[r + 6] * px + R[r + 7] * py + R[r + 8] * pz;
}
