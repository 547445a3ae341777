/**
 * Momentum audit at one sample (track-audit.ts runs it over a track). It poses the body by forward
 * kinematics from the prescribed joint angles at two or three instants a few microseconds apart,
 * differences those segment poses, and sums the total angular momentum about the system CoM,
 * H = Σ R J Rᵀ Ω + m (x − x_c) × (ẋ − ẋ_c), for a given rate of the root, together with the locked
 * inertia from the same poses (so a caller can add what a different root rate would contribute).
 *
 * It works in the root frame: a segment's world pose is A(t)·P(t), with A the root attitude and P
 * the segment's pose relative to the root, so its world rates are A([Ω]×P + Ṗ) with Ω the root's
 * rate. The audit differences P and applies Ω as given, and H in the world frame is A·H_root: the
 * same norm, without turning every segment by the attitude at every stencil point. The attitude
 * enters through Ω (track-audit.ts: the rate the integrated attitudes actually have).
 *
 * None of the engine's I_lock / h / analytic-velocity code (locked-momentum.ts,
 * segmentVelocities, the folding of still subtrees) is used, so a wrong formula there shows up as
 * H ≠ 0; a correct rate gives ‖H‖ at the rounding/truncation floor (≈1e-11 relative).
 */
import type { BodyModel } from '../../shared/kinematics/body-model.ts';
import { type BodyPose, createBodyPose, forwardKinematics, segmentMotion } from '../../shared/kinematics/forward-kinematics.ts';
import { float64Block } from '../../shared/math/float64-block.ts';
import { evalMoving, evalPiece, type MotionPiece } from './joint-motion.ts';

/**
 * Stencil spacing, s. The central difference's truncation (δ²/6·x⃛, x⃛ ≲ 1e2 m/s³ for limb motion)
 * and rounding over δ (≈1e-15 m / 2δ) both stay near 1e-10 m/s (common practice: δ ≈ (ε/x⃛)^⅓).
 */
export const AUDIT_DELTA_S = 5e-6;

/** Spacing of the one-sided stencil at a piece's ends, s (its rounding grows as 7ε/δ; truncation δ³/4·x⁗). */
export const AUDIT_EDGE_DELTA_S = 1e-5;

/** Preallocated audit buffers for one model. */
export interface AuditWork {
  pose: BodyPose;
  /** The central stencil's second pose (t + δ; `pose` holds t − δ): both are read directly, no accumulation. */
  poseB: BodyPose;
  /** Joint angles (rad) and rates (rad/s, unused but written) at a stencil point. */
  q: Float64Array;
  qd: Float64Array;
  /** The piece `pose` holds the still segments for (null: none yet), and the segments that move relative to the root in it (tree order). */
  piece: MotionPiece | null;
  movers: Int32Array;
  /** The still segments summed once per piece: Σm, Σm x (m), Σ R J Rᵀ + m(|x|²E − x xᵀ) (root origin, kg·m², row-major). */
  restMass: number;
  restMoment: Float64Array;
  restInertia: Float64Array;
  /** Per mover: rotation (9 per segment) and CoM (3) at the sample, and their time derivatives, from the stencil. */
  rot: Float64Array;
  com: Float64Array;
  rotD: Float64Array;
  comD: Float64Array;
  /** One-sided stencil weights (scratch). */
  weights: Float64Array;
  /** Total angular momentum about the system CoM at the last auditAt (root frame, kg·m²/s). */
  H: Float64Array;
  /** The shape part of it (the root still): H = shape + lock·ω (root frame, kg·m²/s). */
  shape: Float64Array;
  /** Locked inertia about the system CoM there (root frame, row-major, kg·m²), from the same poses. */
  lock: Float64Array;
}

/** Allocates audit buffers. */
export function createAuditWork(model: BodyModel): AuditWork {
  const n = model.segmentCount;
  const [q, qd, restMoment, restInertia, rot, com, rotD, comD, weights, H, shape, lock] = float64Block([model.dofCount, model.dofCount, 3, 9, 9 * n, 3 * n, 9 * n, 3 * n, 4, 3, 3, 9]);
  return {
    pose: createBodyPose(model), poseB: createBodyPose(model), q, qd,
    piece: null, movers: new Int32Array(0), restMass: 0, restMoment, restInertia, rot, com, rotD, comD, weights, H, shape, lock,
  };
}

/** Poses the still segments of a piece once and sums them (they keep that pose relative to the root throughout it). */
function enterPiece(model: BodyModel, piece: MotionPiece, work: AuditWork): void {
  const { pose, restMoment: mx, restInertia: L } = work;
  evalPiece(piece, piece.t0, work.q, work.qd);
  forwardKinematics(model, work.q, pose);
  // The still segments' poses in the second buffer too (the movers' FK reads their parents there).
  forwardKinematics(model, work.q, work.poseB);
  // Every segment not still relative to the root (moving or carried by a moving one), in tree order.
  const moves = new Uint8Array(model.segmentCount).fill(1);
  for (const i of segmentMotion(model, piece.moving).still) moves[i] = 0;
  const movers = Int32Array.from(moves.keys()).filter((i) => moves[i] === 1);
  const { rot, comPos } = pose, J = model.inertia;
  let M = 0;
  mx.fill(0); L.fill(0);
  for (let i = 0; i < model.segmentCount; i++) {
    if (moves[i]) continue;
    const m = model.mass[i], o = 9 * i, x = comPos[3 * i], y = comPos[3 * i + 1], z = comPos[3 * i + 2];
    M += m; mx[0] += m * x; mx[1] += m * y; mx[2] += m * z;
    const x2 = x * x + y * y + z * z;
    for (let r = 0; r < 3; r++) {
      for (let c = 0; c < 3; c++) {
        let s = 0;
        for (let a = 0; a < 3; a++) for (let b = 0; b < 3; b++) s += rot[o + 3 * r + a] * J[o + 3 * a + b] * rot[o + 3 * c + b];
        const xr = r === 0 ? x : r === 1 ? y : z, xc = c === 0 ? x : c === 1 ? y : z;
        L[3 * r + c] += s + m * ((r === c ? x2 : 0) - xr * xc);
      }
    }
  }
  work.restMass = M;
  work.movers = movers;
  work.piece = piece;
}

/** Adds weight × (the movers' rotations and CoMs in `pose`) to the value and derivative accumulators. */
function accumulate(work: AuditWork, valueWeight: number, rateWeight: number, first: boolean): void {
  const { movers, pose, rot: R, com: X, rotD: RD, comD: XD } = work;
  const { rot, comPos } = pose;
  for (let j = 0; j < movers.length; j++) {
    const i = movers[j];
    for (let e = 9 * i; e < 9 * i + 9; e++) {
      const v = rot[e];
      if (first) { R[e] = valueWeight * v; RD[e] = rateWeight * v; } else { R[e] += valueWeight * v; RD[e] += rateWeight * v; }
    }
    for (let e = 3 * i; e < 3 * i + 3; e++) {
      const v = comPos[e];
      if (first) { X[e] = valueWeight * v; XD[e] = rateWeight * v; } else { X[e] += valueWeight * v; XD[e] += rateWeight * v; }
    }
  }
}

/** Poses the movers at time t of the current piece into `pose` (default work.pose; the still segments keep their pose). */
function poseAt(model: BodyModel, t: number, work: AuditWork, pose: BodyPose = work.pose): void {
  evalMoving(work.piece as MotionPiece, t, work.q, work.qd);
  forwardKinematics(model, work.q, pose, work.movers);
}

/**
 * ‖H‖ (kg·m²/s) at time t of a piece for the root's body-frame rate ω (rad/s); also leaves H, its
 * shape part and the locked inertia (root frame) in `work`.
 */
export function auditAt(model: BodyModel, piece: MotionPiece, t: number, omega: ArrayLike<number>, work: AuditWork): number {
  if (work.piece !== piece) enterPiece(model, piece, work);
  const span = piece.t1 - piece.t0;
  const delta = Math.min(AUDIT_DELTA_S, span / 8);
  // Offsets as the clock represents them (t ± δ rounds): the weights use the actual differences.
  if (t - delta >= piece.t0 && t + delta <= piece.t1) {
    // Central: value (s₊f₋ − s₋f₊)/(s₊ − s₋), derivative (f₊ − f₋)/(s₊ − s₋).
    const tm = t - delta, tp = t + delta, sm = tm - t, sp = tp - t, width = tp - tm;
    poseAt(model, tm, work);
    poseAt(model, tp, work, work.poseB);
    const wt = work.weights;
    wt[0] = sp / width; wt[1] = -sm / width; wt[2] = -1 / width; wt[3] = 1 / width;
    return momentumFromStencil(model, omega, work, delta);
  }
  // One-sided into the piece, four points 0, s₁, s₂, s₃ (third order: its rounding, ≈7ε/δ, needs a wider spacing).
  const wide = Math.min(AUDIT_EDGE_DELTA_S, span / 8);
  const dir = t - wide >= piece.t0 ? -1 : 1;
  const s1 = t + dir * wide - t, s2 = t + 2 * dir * wide - t, s3 = t + 3 * dir * wide - t;
  oneSidedWeights(s1, s2, s3, work.weights);
  const wts = work.weights;
  poseAt(model, t, work);
  accumulate(work, 1, wts[0], true);
  poseAt(model, t + s1, work);
  accumulate(work, 0, wts[1], false);
  poseAt(model, t + s2, work);
  accumulate(work, 0, wts[2], false);
  poseAt(model, t + s3, work);
  accumulate(work, 0, wts[3], false);
  return momentumFromStencil(model, omega, work, 0);
}

/** First-derivative weights at 0 of the cubic through 0, s₁, s₂, s₃ (Lagrange basis derivatives). */
function oneSidedWeights(s1: number, s2: number, s3: number, out: Float64Array): void {
  out[1] = (s2 * s3) / (s1 * (s1 - s2) * (s1 - s3));
  out[2] = (s1 * s3) / (s2 * (s2 - s1) * (s2 - s3));
  out[3] = (s1 * s2) / (s3 * (s3 - s1) * (s3 - s2));
  out[0] = -(out[1] + out[2] + out[3]);
}

/**
 * H = shape + lock·ω from the movers' differenced poses and the still segments' sums. Central
 * stencil (centralDelta > 0): value and rate straight from the two poses with work.weights [value
 * weights at t − δ and t + δ, rate weights at t − δ and t + δ]; otherwise from the accumulators.
 */
function momentumFromStencil(model: BodyModel, omega: ArrayLike<number>, work: AuditWork, centralDelta: number): number {
  const { movers, rot: R, com: X, rotD: RD, comD: XD, restMoment, restInertia: L } = work;
  const J = model.inertia, M = model.totalMass;
  const central = centralDelta > 0;
  const A = work.pose.rot, B = work.poseB.rot, XA = work.pose.comPos, XB = work.poseB.comPos;
  const va = work.weights[0], vb = work.weights[1], ra = work.weights[2], rb = work.weights[3];
  // Σm x, Σm ẋ; Σ R J Rᵀ Ω_rel + m x × ẋ; Σ R J Rᵀ + m(|x|²E − x xᵀ) (root origin; moved to the CoM below).
  let mx = restMoment[0], my = restMoment[1], mz = restMoment[2], mvx = 0, mvy = 0, mvz = 0;
  let hx = 0, hy = 0, hz = 0;
  let L00 = L[0], L01 = L[1], L02 = L[2], L11 = L[4], L12 = L[5], L22 = L[8];
  for (let j = 0; j < movers.length; j++) {
    const i = movers[j], o = 9 * i, i3 = 3 * i, m = model.mass[i];
    let r0, r1, r2, r3, r4, r5, r6, r7, r8, d0, d1, d2, d3, d4, d5, d6, d7, d8, x, y, z, vx, vy, vz;
    if (central) {
      r0 = va * A[o] + vb * B[o]; r1 = va * A[o + 1] + vb * B[o + 1]; r2 = va * A[o + 2] + vb * B[o + 2];
      r3 = va * A[o + 3] + vb * B[o + 3]; r4 = va * A[o + 4] + vb * B[o + 4]; r5 = va * A[o + 5] + vb * B[o + 5];
      r6 = va * A[o + 6] + vb * B[o + 6]; r7 = va * A[o + 7] + vb * B[o + 7]; r8 = va * A[o + 8] + vb * B[o + 8];
      d0 = ra * A[o] + rb * B[o]; d1 = ra * A[o + 1] + rb * B[o + 1]; d2 = ra * A[o + 2] + rb * B[o + 2];
      d3 = ra * A[o + 3] + rb * B[o + 3]; d4 = ra * A[o + 4] + rb * B[o + 4]; d5 = ra * A[o + 5] + rb * B[o + 5];
      d6 = ra * A[o + 6] + rb * B[o + 6]; d7 = ra * A[o + 7] + rb * B[o + 7]; d8 = ra * A[o + 8] + rb * B[o + 8];
      x = va * XA[i3] + vb * XB[i3]; y = va * XA[i3 + 1] + vb * XB[i3 + 1]; z = va * XA[i3 + 2] + vb * XB[i3 + 2];
      vx = ra * XA[i3] + rb * XB[i3]; vy = ra * XA[i3 + 1] + rb * XB[i3 + 1]; vz = ra * XA[i3 + 2] + rb * XB[i3 + 2];
    } else {
      r0 = R[o]; r1 = R[o + 1]; r2 = R[o + 2]; r3 = R[o + 3]; r4 = R[o + 4]; r5 = R[o + 5]; r6 = R[o + 6]; r7 = R[o + 7]; r8 = R[o + 8];
      d0 = RD[o]; d1 = RD[o + 1]; d2 = RD[o + 2]; d3 = RD[o + 3]; d4 = RD[o + 4]; d5 = RD[o + 5]; d6 = RD[o + 6]; d7 = RD[o + 7]; d8 = RD[o + 8];
      x = X[i3]; y = X[i3 + 1]; z = X[i3 + 2]; vx = XD[i3]; vy = XD[i3 + 1]; vz = XD[i3 + 2];
    }
    // Ω_rel = vee of the skew part of Ṙ Rᵀ; A(r, c) = Σ_k Ṙ[r][k] R[c][k] (off-diagonal entries only).
    const A01 = d0 * r3 + d1 * r4 + d2 * r5, A02 = d0 * r6 + d1 * r7 + d2 * r8;
    const A10 = d3 * r0 + d4 * r1 + d5 * r2, A12 = d3 * r6 + d4 * r7 + d5 * r8;
    const A20 = d6 * r0 + d7 * r1 + d8 * r2, A21 = d6 * r3 + d7 * r4 + d8 * r5;
    let ox = (A21 - A12) / 2, oy = (A02 - A20) / 2, oz = (A10 - A01) / 2;
    if (centralDelta > 0) {
      // For a steady turn at rate Ω the central difference reads sin(Ωδ)/δ and the mean of the two poses is
      // R + (δ²/2)[Ω]²R, so Ṙ·meanᵀ reads Ω(1 − ⅔(Ωδ)²): undo that factor (series: Ωδ ≲ 1e-4).
      const phi2 = (ox * ox + oy * oy + oz * oz) * centralDelta * centralDelta, k = 1 + (2 * phi2) / 3;
      ox *= k; oy *= k; oz *= k;
      // The mean of the poses at t ± δ is R + (δ²/2)[Ω]²R for a steady turn: take that out ([Ω]² = ΩΩᵀ − |Ω|²E).
      const c = (centralDelta * centralDelta) / 2, w2 = ox * ox + oy * oy + oz * oz;
      const u0 = ox * r0 + oy * r3 + oz * r6, u1 = ox * r1 + oy * r4 + oz * r7, u2 = ox * r2 + oy * r5 + oz * r8;
      r0 -= c * (ox * u0 - w2 * r0); r1 -= c * (ox * u1 - w2 * r1); r2 -= c * (ox * u2 - w2 * r2);
      r3 -= c * (oy * u0 - w2 * r3); r4 -= c * (oy * u1 - w2 * r4); r5 -= c * (oy * u2 - w2 * r5);
      r6 -= c * (oz * u0 - w2 * r6); r7 -= c * (oz * u1 - w2 * r7); r8 -= c * (oz * u2 - w2 * r8);
    }
    // S = R J Rᵀ (symmetric): K = J Rᵀ, S = R K.
    let k00, k01, k02, k10, k11, k12, k20, k21, k22;
    const j0 = J[o], j1 = J[o + 1], j2 = J[o + 2], j4 = J[o + 4], j5 = J[o + 5], j8 = J[o + 8];
    if (j1 === 0 && j2 === 0 && j5 === 0) {
      // Principal axes (the usual segment table): the same products without their zero terms.
      k00 = j0 * r0; k01 = j0 * r3; k02 = j0 * r6; k10 = j4 * r1; k11 = j4 * r4; k12 = j4 * r7; k20 = j8 * r2; k21 = j8 * r5; k22 = j8 * r8;
    } else {
      k00 = j0 * r0 + j1 * r1 + j2 * r2; k01 = j0 * r3 + j1 * r4 + j2 * r5; k02 = j0 * r6 + j1 * r7 + j2 * r8;
      k10 = J[o + 3] * r0 + j4 * r1 + j5 * r2; k11 = J[o + 3] * r3 + j4 * r4 + j5 * r5; k12 = J[o + 3] * r6 + j4 * r7 + j5 * r8;
      k20 = J[o + 6] * r0 + J[o + 7] * r1 + j8 * r2; k21 = J[o + 6] * r3 + J[o + 7] * r4 + j8 * r5; k22 = J[o + 6] * r6 + J[o + 7] * r7 + j8 * r8;
    }
    const s00 = r0 * k00 + r1 * k10 + r2 * k20, s01 = r0 * k01 + r1 * k11 + r2 * k21, s02 = r0 * k02 + r1 * k12 + r2 * k22;
    const s11 = r3 * k01 + r4 * k11 + r5 * k21, s12 = r3 * k02 + r4 * k12 + r5 * k22, s22 = r6 * k02 + r7 * k12 + r8 * k22;
    hx += s00 * ox + s01 * oy + s02 * oz + m * (y * vz - z * vy);
    hy += s01 * ox + s11 * oy + s12 * oz + m * (z * vx - x * vz);
    hz += s02 * ox + s12 * oy + s22 * oz + m * (x * vy - y * vx);
    const x2 = x * x + y * y + z * z;
    L00 += s00 + m * (x2 - x * x); L11 += s11 + m * (x2 - y * y); L22 += s22 + m * (x2 - z * z);
    L01 += s01 - m * x * y; L02 += s02 - m * x * z; L12 += s12 - m * y * z;
    mx += m * x; my += m * y; mz += m * z; mvx += m * vx; mvy += m * vy; mvz += m * vz;
  }
  // About the system CoM: Σ m (x − x_c) × (ẋ − ẋ_c) = Σ m x × ẋ − M x_c × ẋ_c, and the parallel-axis shift.
  const cx = mx / M, cy = my / M, cz = mz / M, vcx = mvx / M, vcy = mvy / M, vcz = mvz / M;
  hx -= M * (cy * vcz - cz * vcy); hy -= M * (cz * vcx - cx * vcz); hz -= M * (cx * vcy - cy * vcx);
  const c2 = cx * cx + cy * cy + cz * cz;
  L00 -= M * (c2 - cx * cx); L11 -= M * (c2 - cy * cy); L22 -= M * (c2 - cz * cz);
  L01 += M * cx * cy; L02 += M * cx * cz; L12 += M * cy * cz;
  const { H, shape, lock } = work;
  shape[0] = hx; shape[1] = hy; shape[2] = hz;
  lock[0] = L00; lock[1] = L01; lock[2] = L02; lock[3] = L01; lock[4] = L11; lock[5] = L12; lock[6] = L02; lock[7] = L12; lock[8] = L22;
  const wx = omega[0], wy = omega[1], wz = omega[2];
  H[0] = hx + L00 * wx + L01 * wy + L02 * wz;
  H[1] = hy + L01 * wx + L11 * wy + L12 * wz;
  H[2] = hz + L02 * wx + L12 * wy + L22 * wz;
  return Math.sqrt(H[0] * H[0] + H[1] * H[1] + H[2] * H[2]);
}
