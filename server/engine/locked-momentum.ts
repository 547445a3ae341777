/**
 * Locked inertia and shape momentum about the system CoM, in the root frame (DESIGN.md):
 * I_lock = Σ R_i J_i R_iᵀ + m_i(|d_i|²E − d_i d_iᵀ), h = Σ R_i J_i R_iᵀ w_i + m_i d_i × (v_i − ċ),
 * and the body rate ω = −I_lock⁻¹ h that keeps the total angular momentum zero.
 */
import type { BodyModel } from '../../shared/kinematics/body-model.ts';
import { type BodyPose, createBodyPose, forwardKinematics, segmentMotion, segmentVelocities } from '../../shared/kinematics/forward-kinematics.ts';
import { solveSpd3 } from '../../shared/math/mat3.ts';
import { evalPiece, type MotionPiece } from './joint-motion.ts';

/** Preallocated work buffers for one model (the mutable side of the (model, state) split). */
export interface MomentumWork {
  pose: BodyPose;
  /** Joint-centre velocities, 3 per segment (scratch). */
  originVel: Float64Array;
  /** Locked inertia about the system CoM, root frame, kg·m², row-major. */
  lock: Float64Array;
  /** Shape momentum, root frame, kg·m²/s. */
  h: Float64Array;
  /** ω, root frame, rad/s. */
  omega: Float64Array;
  /** System CoM in the root frame, m. */
  c: Float64Array;
  /** Segments recomputed at each evaluation (tree order): all of them until restricted to a piece. */
  moving: Int32Array;
  /** The piece the work is restricted to (null: none, every segment is recomputed). */
  piece: MotionPiece | null;
  /** Composite of the segments at rest within that piece: mass, kg (0 when none). */
  restMass: number;
  /** Its CoM in the root frame, m. */
  restCom: Float64Array;
  /** Its inertia about restCom in the root frame, kg·m², row-major. */
  restInertia: Float64Array;
  /**
   * The model as bodyRate sees it within that piece (null: the model itself): each moving segment
   * carries, as one rigid body, the still subtrees hanging from it (mass, CoM, inertia replaced).
   */
  pieceModel: BodyModel | null;
  /** Scratch angles and rates (rad, rad/s), one per dof. */
  q: Float64Array;
  qd: Float64Array;
}

/** Allocates work buffers for a model. */
export function createMomentumWork(model: BodyModel): MomentumWork {
  return {
    pose: createBodyPose(model), originVel: new Float64Array(3 * model.segmentCount),
    lock: new Float64Array(9), h: new Float64Array(3), omega: new Float64Array(3), c: new Float64Array(3),
    moving: Int32Array.from(model.parent.keys()), piece: null,
    restMass: 0, restCom: new Float64Array(3), restInertia: new Float64Array(9), pieceModel: null,
    q: new Float64Array(model.dofCount), qd: new Float64Array(model.dofCount),
  };
}

/**
 * Restricts the work to one motion piece. Segments whose own and ancestors' dofs stay still over
 * the piece keep one pose and zero velocity relative to the root, so they are posed once here and
 * summed once into a rigid composite (mass, CoM, inertia about its CoM). A still subtree hanging
 * from a moving segment (e.g. forearm and hand while only the shoulder moves) moves rigidly with it,
 * so it is folded into that segment (summed mass, CoM and inertia in its frame). bodyRate then
 * recomputes only the moving segments that remain. Exact: the same sums, grouped differently
 * (round-off only). bodyRate must then be called only with angles and rates of that piece.
 */
export function restrictToPiece(model: BodyModel, piece: MotionPiece, work: MomentumWork): void {
  if (work.piece === piece) return;
  const { pose, q, qd, restCom, restInertia } = work;
  evalPiece(piece, piece.t0, q, null);
  qd.fill(0);
  forwardKinematics(model, q, pose);
  segmentVelocities(model, qd, pose, work.originVel);
  const n = model.segmentCount, { mass, com, inertia } = model, { rot, pos, comPos } = pose;
  // 0: at rest relative to the root; 1: moving, recomputed; 2: carried by a moving host.
  const { moving: active, carried, host } = segmentMotion(model, piece.moving);
  const kind = new Uint8Array(n);
  for (const i of active) kind[i] = 1;
  for (const i of carried) kind[i] = 2;
  // Each moving segment's group (itself and what is folded into it), in its own frame.
  let pieceModel: BodyModel | null = null;
  if (carried.length > 0) {
    const gMass = Float64Array.from(mass), gCom = Float64Array.from(com), gInertia = Float64Array.from(inertia);
    for (const a of active) {
      const members = [a];
      for (const i of carried) if (host[i] === a) members.push(i);
      if (members.length === 1) continue;
      const o = 9 * a;
      // Member CoM and rotation relative to the host frame: Rₐᵀ(x − pₐ), Rₐᵀ Rᵢ.
      const rel = members.map((i) => {
        const cx = comPos[3 * i] - pos[3 * a], cy = comPos[3 * i + 1] - pos[3 * a + 1], cz = comPos[3 * i + 2] - pos[3 * a + 2];
        const c = [0, 1, 2].map((r) => rot[o + r] * cx + rot[o + 3 + r] * cy + rot[o + 6 + r] * cz);
        const R = [0, 1, 2].flatMap((r) => [0, 1, 2].map((cc) => rot[o + r] * rot[9 * i + cc] + rot[o + 3 + r] * rot[9 * i + 3 + cc] + rot[o + 6 + r] * rot[9 * i + 6 + cc]));
        return { i, c, R };
      });
      let M = 0;
      const g = [0, 0, 0];
      for (const { i, c } of rel) { M += mass[i]; for (let r = 0; r < 3; r++) g[r] += mass[i] * c[r]; }
      for (let r = 0; r < 3; r++) g[r] /= M;
      const J = new Array<number>(9).fill(0);
      for (const { i, c, R } of rel) {
        const d = [c[0] - g[0], c[1] - g[1], c[2] - g[2]], d2 = d[0] * d[0] + d[1] * d[1] + d[2] * d[2];
        for (let r = 0; r < 3; r++) {
          for (let cc = 0; cc < 3; cc++) {
            let sum = 0;
            for (let u = 0; u < 3; u++) for (let v = 0; v < 3; v++) sum += R[3 * r + u] * inertia[9 * i + 3 * u + v] * R[3 * cc + v];
            J[3 * r + cc] += sum + mass[i] * ((r === cc ? d2 : 0) - d[r] * d[cc]);
          }
        }
      }
      gMass[a] = M;
      gCom.set(g, 3 * a);
      gInertia.set(J, o);
    }
    pieceModel = { ...model, mass: gMass, com: gCom, inertia: gInertia };
    // The moving segments' CoMs as the folded model places them.
    forwardKinematics(pieceModel, q, pose, active);
  }
  work.pieceModel = pieceModel;
  work.moving = active;
  work.piece = piece;
  let M = 0, x = 0, y = 0, z = 0;
  for (let i = 0; i < n; i++) {
    if (kind[i] !== 0) continue;
    M += mass[i]; x += mass[i] * comPos[3 * i]; y += mass[i] * comPos[3 * i + 1]; z += mass[i] * comPos[3 * i + 2];
  }
  work.restMass = M;
  restCom[0] = M > 0 ? x / M : 0; restCom[1] = M > 0 ? y / M : 0; restCom[2] = M > 0 ? z / M : 0;
  restInertia.fill(0);
  for (let i = 0; i < n; i++) {
    if (kind[i] !== 0) continue;
    // R J Rᵀ + m(|d|²E − d dᵀ), d = segment CoM − composite CoM.
    const dx = comPos[3 * i] - restCom[0], dy = comPos[3 * i + 1] - restCom[1], dz = comPos[3 * i + 2] - restCom[2];
    const d = [dx, dy, dz], d2 = dx * dx + dy * dy + dz * dz;
    for (let r = 0; r < 3; r++) {
      for (let c = 0; c < 3; c++) {
        let s = 0;
        for (let a = 0; a < 3; a++) for (let b = 0; b < 3; b++) s += rot[9 * i + 3 * r + a] * inertia[9 * i + 3 * a + b] * rot[9 * i + 3 * c + b];
        restInertia[3 * r + c] += s + mass[i] * ((r === c ? d2 : 0) - d[r] * d[c]);
      }
    }
  }
}

/**
 * From angles q (rad) and rates qd (rad/s): pose, velocities, work.lock, work.h and work.omega = −I_lock⁻¹h.
 * After restrictToPiece, q and qd must belong to that piece (only its moving segments are recomputed).
 * Throws if I_lock is not positive definite (cannot happen for a valid body).
 */
export function bodyRate(body: BodyModel, q: ArrayLike<number>, qd: ArrayLike<number>, work: MomentumWork): Float64Array {
  const { pose, lock, h, c, moving, restMass: mr, restCom, restInertia: J } = work;
  const model = work.pieceModel ?? body;
  forwardKinematics(model, q, pose, moving);
  segmentVelocities(model, qd, pose, work.originVel, moving);
  const { rot, comPos, angVel, comVel } = pose;
  const { mass, inertia, totalMass } = model;
  const n = moving.length;
  // System CoM and its velocity in the root frame (the composite at rest adds mass, not velocity).
  let cx = mr * restCom[0], cy = mr * restCom[1], cz = mr * restCom[2], vcx = 0, vcy = 0, vcz = 0;
  for (let j = 0; j < n; j++) {
    const i = moving[j];
    const m = mass[i];
    cx += m * comPos[3 * i]; cy += m * comPos[3 * i + 1]; cz += m * comPos[3 * i + 2];
    vcx += m * comVel[3 * i]; vcy += m * comVel[3 * i + 1]; vcz += m * comVel[3 * i + 2];
  }
  cx /= totalMass; cy /= totalMass; cz /= totalMass; vcx /= totalMass; vcy /= totalMass; vcz /= totalMass;
  c[0] = cx; c[1] = cy; c[2] = cz;
  // The composite at rest: its inertia moved to the system CoM; momentum m d × (0 − ċ).
  const ex = restCom[0] - cx, ey = restCom[1] - cy, ez = restCom[2] - cz, e2 = ex * ex + ey * ey + ez * ez;
  let l00 = J[0] + mr * (e2 - ex * ex), l11 = J[4] + mr * (e2 - ey * ey), l22 = J[8] + mr * (e2 - ez * ez);
  let l01 = J[1] - mr * ex * ey, l02 = J[2] - mr * ex * ez, l12 = J[5] - mr * ey * ez;
  let hx = -mr * (ey * vcz - ez * vcy), hy = -mr * (ez * vcx - ex * vcz), hz = -mr * (ex * vcy - ey * vcx);
  for (let j = 0; j < n; j++) {
    const i = moving[j];
    const r = 9 * i;
    // K = R J (3×3), then S = K Rᵀ (symmetric: only the upper triangle).
    const r0 = rot[r], r1 = rot[r + 1], r2 = rot[r + 2], r3 = rot[r + 3], r4 = rot[r + 4], r5 = rot[r + 5], r6 = rot[r + 6], r7 = rot[r + 7], r8 = rot[r + 8];
    const j0 = inertia[r], j1 = inertia[r + 1], j2 = inertia[r + 2], j4 = inertia[r + 4], j5 = inertia[r + 5], j8 = inertia[r + 8];
    let k0, k1, k2, k3, k4, k5, k6, k7, k8;
    if (j1 === 0 && j2 === 0 && j5 === 0) {
      // Principal axes (the usual segment table): the same products without their zero terms.
      k0 = r0 * j0; k1 = r1 * j4; k2 = r2 * j8; k3 = r3 * j0; k4 = r4 * j4; k5 = r5 * j8; k6 = r6 * j0; k7 = r7 * j4; k8 = r8 * j8;
    } else {
      k0 = r0 * j0 + r1 * j1 + r2 * j2; k1 = r0 * j1 + r1 * j4 + r2 * j5; k2 = r0 * j2 + r1 * j5 + r2 * j8;
      k3 = r3 * j0 + r4 * j1 + r5 * j2; k4 = r3 * j1 + r4 * j4 + r5 * j5; k5 = r3 * j2 + r4 * j5 + r5 * j8;
      k6 = r6 * j0 + r7 * j1 + r8 * j2; k7 = r6 * j1 + r7 * j4 + r8 * j5; k8 = r6 * j2 + r7 * j5 + r8 * j8;
    }
    const s00 = k0 * r0 + k1 * r1 + k2 * r2, s01 = k0 * r3 + k1 * r4 + k2 * r5, s02 = k0 * r6 + k1 * r7 + k2 * r8;
    const s11 = k3 * r3 + k4 * r4 + k5 * r5, s12 = k3 * r6 + k4 * r7 + k5 * r8, s22 = k6 * r6 + k7 * r7 + k8 * r8;
    const m = mass[i];
    const dx = comPos[3 * i] - cx, dy = comPos[3 * i + 1] - cy, dz = comPos[3 * i + 2] - cz;
    const d2 = dx * dx + dy * dy + dz * dz;
    l00 += s00 + m * (d2 - dx * dx); l11 += s11 + m * (d2 - dy * dy); l22 += s22 + m * (d2 - dz * dz);
    l01 += s01 - m * dx * dy; l02 += s02 - m * dx * dz; l12 += s12 - m * dy * dz;
    // h: spin part S·w plus orbital part m d × (v − ċ).
    const wx = angVel[3 * i], wy = angVel[3 * i + 1], wz = angVel[3 * i + 2];
    const ux = comVel[3 * i] - vcx, uy = comVel[3 * i + 1] - vcy, uz = comVel[3 * i + 2] - vcz;
    hx += s00 * wx + s01 * wy + s02 * wz + m * (dy * uz - dz * uy);
    hy += s01 * wx + s11 * wy + s12 * wz + m * (dz * ux - dx * uz);
    hz += s02 * wx + s12 * wy + s22 * wz + m * (dx * uy - dy * ux);
  }
  lock[0] = l00; lock[1] = l01; lock[2] = l02; lock[3] = l01; lock[4] = l11; lock[5] = l12; lock[6] = l02; lock[7] = l12; lock[8] = l22;
  h[0] = hx; h[1] = hy; h[2] = hz;
  if (!solveSpd3(lock, h, work.omega)) throw new Error('locked inertia is not positive definite');
  work.omega[0] = -work.omega[0]; work.omega[1] = -work.omega[1]; work.omega[2] = -work.omega[2];
  return work.omega;
}
