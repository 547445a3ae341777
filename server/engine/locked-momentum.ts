/**
 * Locked inertia and shape momentum about the system CoM, in the root frame (DESIGN.md):
 * I_lock = Σ R_i J_i R_iᵀ + m_i(|d_i|²E − d_i d_iᵀ), h = Σ R_i J_i R_iᵀ w_i + m_i d_i × (v_i − ċ),
 * and the body rate ω = −I_lock⁻¹ h that keeps the total angular momentum zero.
 */
import type { BodyModel } from '../../shared/kinematics/body-model.ts';
import { type BodyPose, createBodyPose, forwardKinematics, type SegmentMotion, segmentMotion, segmentVelocities } from '../../shared/kinematics/forward-kinematics.ts';
import { float64Block } from '../../shared/math/float64-block.ts';
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
   * One object per work, rewritten by each restriction (restrictions run once per piece of every
   * simulation: nothing of them is allocated again).
   */
  pieceModel: BodyModel | null;
  /** Scratch angles and rates (rad, rad/s), one per dof. */
  q: Float64Array;
  qd: Float64Array;
  /** Scratch of restrictToPiece: per segment, how it moves (0 still, 1 moving, 2 carried). */
  kind: Uint8Array;
  /** Scratch of restrictToPiece: a carried segment's rotation in its host's frame, row-major. */
  rel: Float64Array;
  /** The last classification of segments by motion, and the moving dofs it was made for (consecutive pieces often move the same dofs). */
  motion: SegmentMotion | null;
  motionDofs: Int32Array | null;
  motionModel: BodyModel | null;
  /** The folded model's arrays (what pieceModel points to) and the model they fold, once made. */
  folded: { base: BodyModel; model: BodyModel; mass: Float64Array; com: Float64Array; inertia: Float64Array } | null;
}

/** Allocates work buffers for a model. */
export function createMomentumWork(model: BodyModel): MomentumWork {
  const n = model.segmentCount;
  const all = new Int32Array(n);
  for (let i = 0; i < n; i++) all[i] = i;
  const [originVel, lock, h, omega, c, restCom, restInertia, q, qd, rel] = float64Block([3 * n, 9, 3, 3, 3, 3, 9, model.dofCount, model.dofCount, 9]);
  return {
    pose: createBodyPose(model), originVel, lock, h, omega, c, moving: all, piece: null,
    restMass: 0, restCom, restInertia, pieceModel: null, q, qd,
    kind: new Uint8Array(n), rel, motion: null, motionDofs: null, motionModel: null, folded: null,
  };
}

/** The work's folded copy of the model (made on first use; its arrays are rewritten per piece). */
function foldedModel(model: BodyModel, work: MomentumWork): NonNullable<MomentumWork['folded']> {
  if (work.folded && work.folded.base === model) return work.folded;
  const [mass, com, inertia] = float64Block([model.mass.length, model.com.length, model.inertia.length]);
  work.folded = { base: model, model: { ...model, mass, com, inertia }, mass, com, inertia };
  return work.folded;
}

/** segmentMotion for these moving dofs, reusing the work's last one when it was made for the same dofs. */
function motionOf(model: BodyModel, dofs: Int32Array, work: MomentumWork): SegmentMotion {
  const last = work.motionDofs;
  let same = last !== null && work.motion !== null && work.motionModel === model && last.length === dofs.length;
  for (let j = 0; same && j < dofs.length; j++) same = (last as Int32Array)[j] === dofs[j];
  if (!same) { work.motion = segmentMotion(model, dofs); work.motionDofs = dofs; work.motionModel = model; }
  return work.motion as SegmentMotion;
}

/**
 * Restricts the work to one motion piece. Segments whose own and ancestors' dofs stay still over
 * the piece keep one pose and zero velocity relative to the root, so they are posed once here and
 * summed once into a rigid composite (mass, CoM, inertia about its CoM). A still subtree hanging
 * from a moving segment (e.g. forearm and hand while only the shoulder moves) moves rigidly with it,
 * so it is folded into that segment (summed mass, CoM and inertia in its frame). bodyRate then
 * recomputes only the moving segments that remain. Exact: the same sums, grouped differently
 * (round-off only). bodyRate must then be called only with angles and rates of that piece.
 * Runs once per piece of every simulation (the planner's inner loop among them): it writes into the
 * work's buffers and allocates only segmentMotion's small index lists.
 */
export function restrictToPiece(model: BodyModel, piece: MotionPiece, work: MomentumWork): void {
  if (work.piece === piece) return;
  const { pose, q, qd, restCom, restInertia, kind, rel } = work;
  evalPiece(piece, piece.t0, q, null);
  qd.fill(0);
  forwardKinematics(model, q, pose);
  segmentVelocities(model, qd, pose, work.originVel);
  const n = model.segmentCount, { mass, com, inertia } = model, { rot, pos, comPos } = pose;
  // 0: at rest relative to the root; 1: moving, recomputed; 2: carried by a moving host.
  const { moving: active, carried, host } = motionOf(model, piece.moving, work);
  kind.fill(0);
  for (let j = 0; j < active.length; j++) kind[active[j]] = 1;
  for (let j = 0; j < carried.length; j++) kind[carried[j]] = 2;
  // Each moving segment's group (itself and what is folded into it), in its own frame.
  let pieceModel: BodyModel | null = null;
  if (carried.length > 0) {
    const f = foldedModel(model, work), gCom = f.com, gInertia = f.inertia;
    f.mass.set(mass); gCom.set(com); gInertia.set(inertia);
    for (let ja = 0; ja < active.length; ja++) {
      const a = active[ja];
      let members = 1;
      for (let jc = 0; jc < carried.length; jc++) if (host[carried[jc]] === a) members++;
      if (members === 1) continue;
      const o = 9 * a;
      // Members in order (the host, then its carried segments): their mass-weighted CoM relative to
      // the host frame, Rₐᵀ(x − pₐ), then their inertia about it with Rₐᵀ Rᵢ.
      let M = 0, g0 = 0, g1 = 0, g2 = 0;
      for (let jm = -1; jm < carried.length; jm++) {
        const i = jm < 0 ? a : carried[jm];
        if (jm >= 0 && host[i] !== a) continue;
        const cx = comPos[3 * i] - pos[3 * a], cy = comPos[3 * i + 1] - pos[3 * a + 1], cz = comPos[3 * i + 2] - pos[3 * a + 2];
        M += mass[i];
        g0 += mass[i] * (rot[o] * cx + rot[o + 3] * cy + rot[o + 6] * cz);
        g1 += mass[i] * (rot[o + 1] * cx + rot[o + 4] * cy + rot[o + 7] * cz);
        g2 += mass[i] * (rot[o + 2] * cx + rot[o + 5] * cy + rot[o + 8] * cz);
      }
      g0 /= M; g1 /= M; g2 /= M;
      gInertia.fill(0, o, o + 9);
      for (let jm = -1; jm < carried.length; jm++) {
        const i = jm < 0 ? a : carried[jm];
        if (jm >= 0 && host[i] !== a) continue;
        const cx = comPos[3 * i] - pos[3 * a], cy = comPos[3 * i + 1] - pos[3 * a + 1], cz = comPos[3 * i + 2] - pos[3 * a + 2];
        const d0 = rot[o] * cx + rot[o + 3] * cy + rot[o + 6] * cz - g0;
        const d1 = rot[o + 1] * cx + rot[o + 4] * cy + rot[o + 7] * cz - g1;
        const d2x = rot[o + 2] * cx + rot[o + 5] * cy + rot[o + 8] * cz - g2;
        const dd = d0 * d0 + d1 * d1 + d2x * d2x;
        // R = Rₐᵀ Rᵢ: R[r][u] = Σₖ Rₐ[k][r] Rᵢ[k][u].
        for (let r = 0; r < 3; r++) {
          for (let u = 0; u < 3; u++) rel[3 * r + u] = rot[o + r] * rot[9 * i + u] + rot[o + 3 + r] * rot[9 * i + 3 + u] + rot[o + 6 + r] * rot[9 * i + 6 + u];
        }
        for (let r = 0; r < 3; r++) {
          const dr = r === 0 ? d0 : r === 1 ? d1 : d2x;
          for (let cc = 0; cc < 3; cc++) {
            const dc = cc === 0 ? d0 : cc === 1 ? d1 : d2x;
            let sum = 0;
            for (let u = 0; u < 3; u++) for (let v = 0; v < 3; v++) sum += rel[3 * r + u] * inertia[9 * i + 3 * u + v] * rel[3 * cc + v];
            gInertia[o + 3 * r + cc] += sum + mass[i] * ((r === cc ? dd : 0) - dr * dc);
          }
        }
      }
      f.mass[a] = M;
      gCom[3 * a] = g0; gCom[3 * a + 1] = g1; gCom[3 * a + 2] = g2;
    }
    pieceModel = f.model;
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
    const d2 = dx * dx + dy * dy + dz * dz;
    for (let r = 0; r < 3; r++) {
      const dr = r === 0 ? dx : r === 1 ? dy : dz;
      for (let c = 0; c < 3; c++) {
        const dc = c === 0 ? dx : c === 1 ? dy : dz;
        let s = 0;
        for (let a = 0; a < 3; a++) for (let b = 0; b < 3; b++) s += rot[9 * i + 3 * r + a] * inertia[9 * i + 3 * a + b] * rot[9 * i + 3 * c + b];
        restInertia[3 * r + c] += s + mass[i] * ((r === c ? d2 : 0) - dr * dc);
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
