/**
 * Momentum audit at one sample (track-audit.ts runs it over a track). It builds every segment's
 * world-frame pose on a 5-point time stencil — the prescribed joint angles through forward
 * kinematics, and the root attitude moved on from the sample's attitude at a given body rate
 * (q ⊗ exp(ω s/2), exact to first order, which is all a first derivative sees) — differences those
 * poses (for segments rigid relative to the root, or to a moving segment, over the step: through
 * that frame's differenced world pose), and sums the total angular momentum about the system CoM
 * in the world frame, H = Σ R J Rᵀ Ω + m (x − x_c) × (ẋ − ẋ_c), and the world locked inertia
 * from the same poses (so a caller can add what a different root rate would contribute).
 * None of the engine's I_lock / h / analytic-velocity code is used, so a wrong formula there shows
 * up as H ≠ 0; a correct rate gives ‖H‖ at the rounding/truncation floor (≈1e-11 relative).
 */
import type { BodyModel } from '../../shared/kinematics/body-model.ts';
import { type BodyPose, createBodyPose, forwardKinematics, segmentMotion } from '../../shared/kinematics/forward-kinematics.ts';
import { quatToMatrix } from '../../shared/math/quaternion.ts';
import { evalMoving, evalPiece, type MotionPiece } from './joint-motion.ts';

/** Stencil spacing, s: δ⁴ truncation and rounding/δ both ≲ 1e-12 relative (common practice). */
export const AUDIT_DELTA_S = 1e-3;

/** Points per audit stencil. */
export const STENCIL_POINTS = 5;

/** Stencil offsets (in units of δ) and first-derivative weights (× 1/(12δ)); the evaluation point is offset 0. */
export const STENCILS = {
  central: { offsets: [-2, -1, 0, 1, 2], weights: [1, -8, 0, 8, -1] },
  forward: { offsets: [0, 1, 2, 3, 4], weights: [-25, 48, -36, 16, -3] },
  backward: { offsets: [-4, -3, -2, -1, 0], weights: [3, -16, 36, -48, 25] },
} as const;

/** Chooses a stencil for time t inside the step [t0, t1] and its spacing δ (s). */
export function chooseStencil(t: number, t0: number, t1: number): { kind: keyof typeof STENCILS; delta: number } {
  const delta = Math.min(AUDIT_DELTA_S, (t1 - t0) / 8);
  if (t - 2 * delta >= t0 && t + 2 * delta <= t1) return { kind: 'central', delta };
  return t - t0 < t1 - t ? { kind: 'forward', delta } : { kind: 'backward', delta };
}

/** Preallocated audit buffers for one model. */
export interface AuditWork {
  pose: BodyPose;
  /** Joint angles (rad) and rates (rad/s, unused but written) at a stencil point. */
  q: Float64Array;
  qd: Float64Array;
  /** World rotation (9 per segment), world CoM and world frame origin (3 per segment) at each stencil point. */
  rotW: Float64Array[];
  comW: Float64Array[];
  posW: Float64Array[];
  /** Stencil derivatives of each segment's world rotation (9 per segment, 1/s) and CoM (3, m/s). */
  rotD: Float64Array;
  vel: Float64Array;
  /** Stencil derivative of each moving segment's world frame origin, m/s (3 per segment). */
  posD: Float64Array;
  /** Root world rotation at each stencil point (9 per point, row-major). */
  rootW: Float64Array;
  Rq: Float64Array;
  att: Float64Array;
  /** Stencil weights for the current spacing, 1/s. */
  w: Float64Array;
  /** The piece `pose` holds the segments at rest for (null: none yet); its moving, carried and resting segments. */
  piece: MotionPiece | null;
  moving: Int32Array;
  resting: Int32Array;
  carried: Int32Array;
  host: Int32Array;
  /** Per carried segment: rotation (9, row-major) and CoM (3, m) relative to its host's frame. */
  carriedRot: Float64Array;
  carriedCom: Float64Array;
  /** Total angular momentum about the system CoM (world frame, kg·m²/s) at the last auditAt. */
  H: Float64Array;
  /** Locked inertia about the system CoM in the world frame there (row-major, kg·m²), from the same world poses. */
  lockW: Float64Array;
}

/** Allocates audit buffers. */
export function createAuditWork(model: BodyModel): AuditWork {
  const n = model.segmentCount;
  return {
    pose: createBodyPose(model), q: new Float64Array(model.dofCount), qd: new Float64Array(model.dofCount),
    rotW: Array.from({ length: STENCIL_POINTS }, () => new Float64Array(9 * n)),
    comW: Array.from({ length: STENCIL_POINTS }, () => new Float64Array(3 * n)),
    posW: Array.from({ length: STENCIL_POINTS }, () => new Float64Array(3 * n)),
    rotD: new Float64Array(9 * n), vel: new Float64Array(3 * n), posD: new Float64Array(3 * n),
    rootW: new Float64Array(9 * STENCIL_POINTS), Rq: new Float64Array(9), att: new Float64Array(4),
    w: new Float64Array(STENCIL_POINTS), piece: null, moving: new Int32Array(0), resting: new Int32Array(0),
    carried: new Int32Array(0), host: new Int32Array(n), carriedRot: new Float64Array(9 * n), carriedCom: new Float64Array(3 * n),
    H: new Float64Array(3), lockW: new Float64Array(9),
  };
}

/**
 * ‖H‖ (kg·m²/s) at time t of a piece, from the attitude q [w,x,y,z] there and the root's
 * body-frame rate ω (rad/s); also leaves H and the world locked inertia in `work`. `centrePose`, if given, is the body's
 * root-frame pose (forwardKinematics) at exactly t, already computed by the caller: the stencil's
 * centre point reuses it instead of posing the body again (the same numbers either way).
 */
export function auditAt(model: BodyModel, piece: MotionPiece, t: number, q: ArrayLike<number>, omega: ArrayLike<number>, work: AuditWork, centrePose?: BodyPose): number {
  const { kind, delta } = chooseStencil(t, piece.t0, piece.t1);
  const st = STENCILS[kind];
  const n = model.segmentCount;
  const { pose, rotW, comW, posW, rotD, vel, posD, rootW, Rq, att, w } = work;
  // Segments at rest over the piece keep one root-frame pose: pose them once per piece, and
  // recompute only the moving ones at each stencil point (the same forward kinematics, reused).
  // A still subtree hanging from a moving segment keeps its pose relative to that host.
  if (work.piece !== piece) {
    // Angles of the dofs at rest (and zero rates) for evalMoving below.
    evalPiece(piece, piece.t0, work.q, work.qd);
    forwardKinematics(model, work.q, pose);
    const sm = segmentMotion(model, piece.moving);
    work.moving = sm.moving; work.resting = sm.still; work.carried = sm.carried; work.host = sm.host;
    const { rot, pos, comPos } = pose;
    for (let c = 0; c < sm.carried.length; c++) {
      const i = sm.carried[c], h = sm.host[i], o = 9 * h;
      // Rₕᵀ Rᵢ and Rₕᵀ(xᵢ − pₕ).
      for (let r = 0; r < 3; r++) {
        for (let cc = 0; cc < 3; cc++) work.carriedRot[9 * c + 3 * r + cc] = rot[o + r] * rot[9 * i + cc] + rot[o + 3 + r] * rot[9 * i + 3 + cc] + rot[o + 6 + r] * rot[9 * i + 6 + cc];
        work.carriedCom[3 * c + r] = rot[o + r] * (comPos[3 * i] - pos[3 * h]) + rot[o + 3 + r] * (comPos[3 * i + 1] - pos[3 * h + 1]) + rot[o + 6 + r] * (comPos[3 * i + 2] - pos[3 * h + 2]);
      }
    }
    work.piece = piece;
  }
  const { moving, resting, carried, host, carriedRot, carriedCom } = work;
  const wn = Math.hypot(omega[0], omega[1], omega[2]);
  let centre = 0;
  for (let j = 0; j < STENCIL_POINTS; j++) {
    const s = st.offsets[j] * delta;
    if (s === 0) centre = j;
    w[j] = st.weights[j] / (12 * delta);
    // Root attitude q ⊗ exp(ω s / 2).
    const half = (wn * s) / 2, k = wn > 0 ? Math.sin(half) / wn : s / 2, c = Math.cos(half);
    const ex = omega[0] * k, ey = omega[1] * k, ez = omega[2] * k;
    att[0] = q[0] * c - q[1] * ex - q[2] * ey - q[3] * ez;
    att[1] = q[0] * ex + q[1] * c + q[2] * ez - q[3] * ey;
    att[2] = q[0] * ey - q[1] * ez + q[2] * c + q[3] * ex;
    att[3] = q[0] * ez + q[1] * ey - q[2] * ex + q[3] * c;
    quatToMatrix(att, Rq);
    const a0 = Rq[0], a1 = Rq[1], a2 = Rq[2], a3 = Rq[3], a4 = Rq[4], a5 = Rq[5], a6 = Rq[6], a7 = Rq[7], a8 = Rq[8];
    const r = 9 * j;
    rootW[r] = a0; rootW[r + 1] = a1; rootW[r + 2] = a2; rootW[r + 3] = a3; rootW[r + 4] = a4; rootW[r + 5] = a5; rootW[r + 6] = a6; rootW[r + 7] = a7; rootW[r + 8] = a8;
    // Moving segments' poses from the prescribed joint angles, then to the world frame.
    let from = pose;
    if (s === 0 && centrePose) from = centrePose;
    else { evalMoving(piece, t + s, work.q, work.qd); forwardKinematics(model, work.q, pose, moving); }
    const { rot, pos, comPos } = from;
    const R = rotW[j], X = comW[j], P = posW[j];
    for (let m = 0; m < moving.length; m++) {
      const i = moving[m], o = 9 * i, i3 = 3 * i;
      const px = pos[i3], py = pos[i3 + 1], pz = pos[i3 + 2];
      P[i3] = a0 * px + a1 * py + a2 * pz; P[i3 + 1] = a3 * px + a4 * py + a5 * pz; P[i3 + 2] = a6 * px + a7 * py + a8 * pz;
      const b0 = rot[o], b1 = rot[o + 1], b2 = rot[o + 2], b3 = rot[o + 3], b4 = rot[o + 4], b5 = rot[o + 5], b6 = rot[o + 6], b7 = rot[o + 7], b8 = rot[o + 8];
      R[o] = a0 * b0 + a1 * b3 + a2 * b6; R[o + 1] = a0 * b1 + a1 * b4 + a2 * b7; R[o + 2] = a0 * b2 + a1 * b5 + a2 * b8;
      R[o + 3] = a3 * b0 + a4 * b3 + a5 * b6; R[o + 4] = a3 * b1 + a4 * b4 + a5 * b7; R[o + 5] = a3 * b2 + a4 * b5 + a5 * b8;
      R[o + 6] = a6 * b0 + a7 * b3 + a8 * b6; R[o + 7] = a6 * b1 + a7 * b4 + a8 * b7; R[o + 8] = a6 * b2 + a7 * b5 + a8 * b8;
      const x = comPos[i3], y = comPos[i3 + 1], z = comPos[i3 + 2];
      X[i3] = a0 * x + a1 * y + a2 * z; X[i3 + 1] = a3 * x + a4 * y + a5 * z; X[i3 + 2] = a6 * x + a7 * y + a8 * z;
    }
  }
  const w0 = w[0], w1 = w[1], w2 = w[2], w3 = w[3], w4 = w[4];
  const P0 = rotW[0], P1 = rotW[1], P2 = rotW[2], P3 = rotW[3], P4 = rotW[4];
  const C0 = comW[0], C1 = comW[1], C2 = comW[2], C3 = comW[3], C4 = comW[4];
  const Q0 = posW[0], Q1 = posW[1], Q2 = posW[2], Q3 = posW[3], Q4 = posW[4];
  const R0 = rotW[centre], X0 = comW[centre];
  // Moving segments: difference their world poses on the stencil.
  for (let m = 0; m < moving.length; m++) {
    const i = moving[m];
    for (let e = 9 * i; e < 9 * i + 9; e++) rotD[e] = w0 * P0[e] + w1 * P1[e] + w2 * P2[e] + w3 * P3[e] + w4 * P4[e];
    for (let e = 3 * i; e < 3 * i + 3; e++) {
      vel[e] = w0 * C0[e] + w1 * C1[e] + w2 * C2[e] + w3 * C3[e] + w4 * C4[e];
      posD[e] = w0 * Q0[e] + w1 * Q1[e] + w2 * Q2[e] + w3 * Q3[e] + w4 * Q4[e];
    }
  }
  // Segments carried rigidly by a moving host: their world pose is (host world pose)·(constant),
  // so, the stencil being linear, R_w = R_wₕ·Rᵣ, Ṙ_w = Ṙ_wₕ·Rᵣ, x_w = p_wₕ + R_wₕ·cᵣ, ẋ_w = ṗ_wₕ + Ṙ_wₕ·cᵣ.
  const Pc = posW[centre];
  for (let m = 0; m < carried.length; m++) {
    const i = carried[m], h = host[i], o = 9 * i, oh = 9 * h, i3 = 3 * i, h3 = 3 * h, cr = 9 * m, cc = 3 * m;
    for (let r = 0; r < 3; r++) {
      const g0 = R0[oh + 3 * r], g1 = R0[oh + 3 * r + 1], g2 = R0[oh + 3 * r + 2];
      const e0 = rotD[oh + 3 * r], e1 = rotD[oh + 3 * r + 1], e2 = rotD[oh + 3 * r + 2];
      for (let c = 0; c < 3; c++) {
        const b0 = carriedRot[cr + c], b1 = carriedRot[cr + 3 + c], b2 = carriedRot[cr + 6 + c];
        R0[o + 3 * r + c] = g0 * b0 + g1 * b1 + g2 * b2;
        rotD[o + 3 * r + c] = e0 * b0 + e1 * b1 + e2 * b2;
      }
      const x = carriedCom[cc], y = carriedCom[cc + 1], z = carriedCom[cc + 2];
      X0[i3 + r] = Pc[h3 + r] + g0 * x + g1 * y + g2 * z;
      vel[i3 + r] = posD[h3 + r] + e0 * x + e1 * y + e2 * z;
    }
  }
  // Segments at rest relative to the root: their world pose is (root world rotation)·(constant),
  // so the stencil, being linear, differences the root's world rotation once and applies it to
  // each: Ṙ_w = (Σ w_j Rq_j)·R, ẋ_w = (Σ w_j Rq_j)·x — the same differences, fewer products.
  const c9 = 9 * centre;
  const q0 = rootW[c9], q1 = rootW[c9 + 1], q2 = rootW[c9 + 2], q3 = rootW[c9 + 3], q4 = rootW[c9 + 4], q5 = rootW[c9 + 5], q6 = rootW[c9 + 6], q7 = rootW[c9 + 7], q8 = rootW[c9 + 8];
  let e0 = 0, e1 = 0, e2 = 0, e3 = 0, e4 = 0, e5 = 0, e6 = 0, e7 = 0, e8 = 0;
  for (let j = 0; j < STENCIL_POINTS; j++) {
    const r = 9 * j, wj = w[j];
    e0 += wj * rootW[r]; e1 += wj * rootW[r + 1]; e2 += wj * rootW[r + 2];
    e3 += wj * rootW[r + 3]; e4 += wj * rootW[r + 4]; e5 += wj * rootW[r + 5];
    e6 += wj * rootW[r + 6]; e7 += wj * rootW[r + 7]; e8 += wj * rootW[r + 8];
  }
  const { rot, comPos } = pose;
  for (let m = 0; m < resting.length; m++) {
    const i = resting[m], o = 9 * i, i3 = 3 * i;
    const b0 = rot[o], b1 = rot[o + 1], b2 = rot[o + 2], b3 = rot[o + 3], b4 = rot[o + 4], b5 = rot[o + 5], b6 = rot[o + 6], b7 = rot[o + 7], b8 = rot[o + 8];
    R0[o] = q0 * b0 + q1 * b3 + q2 * b6; R0[o + 1] = q0 * b1 + q1 * b4 + q2 * b7; R0[o + 2] = q0 * b2 + q1 * b5 + q2 * b8;
    R0[o + 3] = q3 * b0 + q4 * b3 + q5 * b6; R0[o + 4] = q3 * b1 + q4 * b4 + q5 * b7; R0[o + 5] = q3 * b2 + q4 * b5 + q5 * b8;
    R0[o + 6] = q6 * b0 + q7 * b3 + q8 * b6; R0[o + 7] = q6 * b1 + q7 * b4 + q8 * b7; R0[o + 8] = q6 * b2 + q7 * b5 + q8 * b8;
    rotD[o] = e0 * b0 + e1 * b3 + e2 * b6; rotD[o + 1] = e0 * b1 + e1 * b4 + e2 * b7; rotD[o + 2] = e0 * b2 + e1 * b5 + e2 * b8;
    rotD[o + 3] = e3 * b0 + e4 * b3 + e5 * b6; rotD[o + 4] = e3 * b1 + e4 * b4 + e5 * b7; rotD[o + 5] = e3 * b2 + e4 * b5 + e5 * b8;
    rotD[o + 6] = e6 * b0 + e7 * b3 + e8 * b6; rotD[o + 7] = e6 * b1 + e7 * b4 + e8 * b7; rotD[o + 8] = e6 * b2 + e7 * b5 + e8 * b8;
    const x = comPos[i3], y = comPos[i3 + 1], z = comPos[i3 + 2];
    X0[i3] = q0 * x + q1 * y + q2 * z; X0[i3 + 1] = q3 * x + q4 * y + q5 * z; X0[i3 + 2] = q6 * x + q7 * y + q8 * z;
    vel[i3] = e0 * x + e1 * y + e2 * z; vel[i3 + 1] = e3 * x + e4 * y + e5 * z; vel[i3 + 2] = e6 * x + e7 * y + e8 * z;
  }
  // System CoM position and velocity (world).
  const M = model.totalMass;
  let xcx = 0, xcy = 0, xcz = 0, vcx = 0, vcy = 0, vcz = 0;
  for (let i = 0; i < n; i++) {
    const m = model.mass[i] / M;
    xcx += m * X0[3 * i]; xcy += m * X0[3 * i + 1]; xcz += m * X0[3 * i + 2];
    vcx += m * vel[3 * i]; vcy += m * vel[3 * i + 1]; vcz += m * vel[3 * i + 2];
  }
  let Hx = 0, Hy = 0, Hz = 0;
  // World locked inertia (upper triangle): Σ R J Rᵀ + m(|d|²E − d dᵀ).
  let L00 = 0, L01 = 0, L02 = 0, L11 = 0, L12 = 0, L22 = 0;
  const J = model.inertia;
  for (let i = 0; i < n; i++) {
    const o = 9 * i;
    // Ω = vee(skew part of Ṙ Rᵀ), A = Ṙ Rᵀ (only its off-diagonal entries are needed).
    const d0 = rotD[o], d1 = rotD[o + 1], d2 = rotD[o + 2], d3 = rotD[o + 3], d4 = rotD[o + 4], d5 = rotD[o + 5], d6 = rotD[o + 6], d7 = rotD[o + 7], d8 = rotD[o + 8];
    const r0 = R0[o], r1 = R0[o + 1], r2 = R0[o + 2], r3 = R0[o + 3], r4 = R0[o + 4], r5 = R0[o + 5], r6 = R0[o + 6], r7 = R0[o + 7], r8 = R0[o + 8];
    // A(r, c) = Σ_k Ṙ[r][k] R[c][k].
    const A01 = d0 * r3 + d1 * r4 + d2 * r5, A02 = d0 * r6 + d1 * r7 + d2 * r8;
    const A10 = d3 * r0 + d4 * r1 + d5 * r2, A12 = d3 * r6 + d4 * r7 + d5 * r8;
    const A20 = d6 * r0 + d7 * r1 + d8 * r2, A21 = d6 * r3 + d7 * r4 + d8 * r5;
    const Ox = (A21 - A12) / 2, Oy = (A02 - A20) / 2, Oz = (A10 - A01) / 2;
    // Spin: R J Rᵀ Ω.
    const bx = r0 * Ox + r3 * Oy + r6 * Oz;
    const by = r1 * Ox + r4 * Oy + r7 * Oz;
    const bz = r2 * Ox + r5 * Oy + r8 * Oz;
    const jx = J[o] * bx + J[o + 1] * by + J[o + 2] * bz;
    const jy = J[o + 3] * bx + J[o + 4] * by + J[o + 5] * bz;
    const jz = J[o + 6] * bx + J[o + 7] * by + J[o + 8] * bz;
    Hx += r0 * jx + r1 * jy + r2 * jz;
    Hy += r3 * jx + r4 * jy + r5 * jz;
    Hz += r6 * jx + r7 * jy + r8 * jz;
    // Orbit: m (x − x_c) × (ẋ − ẋ_c).
    const m = model.mass[i];
    const dx = X0[3 * i] - xcx, dy = X0[3 * i + 1] - xcy, dz = X0[3 * i + 2] - xcz;
    const ux = vel[3 * i] - vcx, uy = vel[3 * i + 1] - vcy, uz = vel[3 * i + 2] - vcz;
    Hx += m * (dy * uz - dz * uy); Hy += m * (dz * ux - dx * uz); Hz += m * (dx * uy - dy * ux);
    // R J Rᵀ: K = J Rᵀ column by column is what the spin term did for one vector; here all of it.
    const k00 = J[o] * r0 + J[o + 1] * r1 + J[o + 2] * r2, k01 = J[o] * r3 + J[o + 1] * r4 + J[o + 2] * r5, k02 = J[o] * r6 + J[o + 1] * r7 + J[o + 2] * r8;
    const k10 = J[o + 3] * r0 + J[o + 4] * r1 + J[o + 5] * r2, k11 = J[o + 3] * r3 + J[o + 4] * r4 + J[o + 5] * r5, k12 = J[o + 3] * r6 + J[o + 4] * r7 + J[o + 5] * r8;
    const k20 = J[o + 6] * r0 + J[o + 7] * r1 + J[o + 8] * r2, k21 = J[o + 6] * r3 + J[o + 7] * r4 + J[o + 8] * r5, k22 = J[o + 6] * r6 + J[o + 7] * r7 + J[o + 8] * r8;
    const e2 = dx * dx + dy * dy + dz * dz;
    L00 += r0 * k00 + r1 * k10 + r2 * k20 + m * (e2 - dx * dx);
    L01 += r0 * k01 + r1 * k11 + r2 * k21 - m * dx * dy;
    L02 += r0 * k02 + r1 * k12 + r2 * k22 - m * dx * dz;
    L11 += r3 * k01 + r4 * k11 + r5 * k21 + m * (e2 - dy * dy);
    L12 += r3 * k02 + r4 * k12 + r5 * k22 - m * dy * dz;
    L22 += r6 * k02 + r7 * k12 + r8 * k22 + m * (e2 - dz * dz);
  }
  const { H, lockW } = work;
  H[0] = Hx; H[1] = Hy; H[2] = Hz;
  lockW[0] = L00; lockW[1] = L01; lockW[2] = L02; lockW[3] = L01; lockW[4] = L11; lockW[5] = L12; lockW[6] = L02; lockW[7] = L12; lockW[8] = L22;
  return Math.hypot(Hx, Hy, Hz);
}
