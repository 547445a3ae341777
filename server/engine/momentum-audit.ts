/**
 * Momentum audit. At each sample it builds every segment's world-frame pose on a 5-point time
 * stencil — the prescribed joint angles through forward kinematics, and the root attitude moved
 * on from the integrated attitude at the rate the integrator follows there (q ⊗ exp(ω s/2), exact
 * to first order, which is all a first derivative sees) — differences those poses, and sums the
 * total angular momentum about the system CoM in the world frame,
 * H = Σ R J Rᵀ Ω + m (x − x_c) × (ẋ − ẋ_c).
 * None of the engine's I_lock / h / analytic-velocity code is used, so a wrong formula there shows
 * up as H ≠ 0; a correct run gives ‖H‖ at the rounding/truncation floor (≈1e-11 relative).
 * (Differencing odex's dense output instead is not usable: its interpolant is accurate in value
 * but its derivative is ~10³× less accurate than the tolerance.)
 */
import type { BodyModel } from '../../shared/kinematics/body-model.ts';
import { type BodyPose, createBodyPose, forwardKinematics } from '../../shared/kinematics/forward-kinematics.ts';
import { quatToMatrix } from '../../shared/math/quaternion.ts';
import { evalPiece, type MotionPiece } from './joint-motion.ts';

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
  q: Float64Array;
  /** World rotation (9 per segment) and world CoM (3 per segment) at each stencil point. */
  rotW: Float64Array[];
  comW: Float64Array[];
  vel: Float64Array;
  Rq: Float64Array;
  att: Float64Array;
}

/** Allocates audit buffers. */
export function createAuditWork(model: BodyModel): AuditWork {
  const n = model.segmentCount;
  return {
    pose: createBodyPose(model), q: new Float64Array(model.dofCount),
    rotW: Array.from({ length: STENCIL_POINTS }, () => new Float64Array(9 * n)),
    comW: Array.from({ length: STENCIL_POINTS }, () => new Float64Array(3 * n)),
    vel: new Float64Array(3 * n), Rq: new Float64Array(9), att: new Float64Array(4),
  };
}

/**
 * ‖H‖ (kg·m²/s) at time t of a piece, from the integrated attitude q [w,x,y,z] there and the root's
 * body-frame rate ω (rad/s) the integrator follows at (t, q).
 */
export function auditAt(model: BodyModel, piece: MotionPiece, t: number, q: ArrayLike<number>, omega: ArrayLike<number>, work: AuditWork): number {
  const { kind, delta } = chooseStencil(t, piece.t0, piece.t1);
  const st = STENCILS[kind];
  const n = model.segmentCount;
  const { pose, rotW, comW, vel, Rq, att } = work;
  const wn = Math.hypot(omega[0], omega[1], omega[2]);
  let centre = 0;
  for (let j = 0; j < STENCIL_POINTS; j++) {
    const s = st.offsets[j] * delta;
    if (s === 0) centre = j;
    // Root attitude q ⊗ exp(ω s / 2).
    const half = (wn * s) / 2, k = wn > 0 ? Math.sin(half) / wn : s / 2, c = Math.cos(half);
    const ex = omega[0] * k, ey = omega[1] * k, ez = omega[2] * k;
    att[0] = q[0] * c - q[1] * ex - q[2] * ey - q[3] * ez;
    att[1] = q[0] * ex + q[1] * c + q[2] * ez - q[3] * ey;
    att[2] = q[0] * ey - q[1] * ez + q[2] * c + q[3] * ex;
    att[3] = q[0] * ez + q[1] * ey - q[2] * ex + q[3] * c;
    quatToMatrix(att, Rq);
    // Segment poses from the prescribed joint angles, then to the world frame.
    evalPiece(piece, t + s, work.q, null);
    forwardKinematics(model, work.q, pose);
    const R = rotW[j], X = comW[j];
    for (let i = 0; i < n; i++) {
      for (let r = 0; r < 3; r++) {
        const a = Rq[3 * r], b = Rq[3 * r + 1], d = Rq[3 * r + 2];
        for (let cc = 0; cc < 3; cc++) R[9 * i + 3 * r + cc] = a * pose.rot[9 * i + cc] + b * pose.rot[9 * i + 3 + cc] + d * pose.rot[9 * i + 6 + cc];
        X[3 * i + r] = a * pose.comPos[3 * i] + b * pose.comPos[3 * i + 1] + d * pose.comPos[3 * i + 2];
      }
    }
  }
  const w = st.weights.map((x) => x / (12 * delta));
  // System CoM position and velocity (world).
  const M = model.totalMass;
  let xcx = 0, xcy = 0, xcz = 0, vcx = 0, vcy = 0, vcz = 0;
  for (let i = 0; i < n; i++) {
    for (let a = 0; a < 3; a++) {
      let v = 0;
      for (let s = 0; s < STENCIL_POINTS; s++) v += w[s] * comW[s][3 * i + a];
      vel[3 * i + a] = v;
    }
    const m = model.mass[i] / M;
    xcx += m * comW[centre][3 * i]; xcy += m * comW[centre][3 * i + 1]; xcz += m * comW[centre][3 * i + 2];
    vcx += m * vel[3 * i]; vcy += m * vel[3 * i + 1]; vcz += m * vel[3 * i + 2];
  }
  let Hx = 0, Hy = 0, Hz = 0;
  const R0 = rotW[centre], X0 = comW[centre], J = model.inertia;
  const Rd = [0, 0, 0, 0, 0, 0, 0, 0, 0];
  for (let i = 0; i < n; i++) {
    const o = 9 * i;
    // Ṙ by the stencil; Ω = vee(skew part of Ṙ Rᵀ).
    for (let e = 0; e < 9; e++) { let v = 0; for (let s = 0; s < STENCIL_POINTS; s++) v += w[s] * rotW[s][o + e]; Rd[e] = v; }
    const A = (r: number, c: number) => Rd[3 * r] * R0[o + 3 * c] + Rd[3 * r + 1] * R0[o + 3 * c + 1] + Rd[3 * r + 2] * R0[o + 3 * c + 2];
    const Ox = (A(2, 1) - A(1, 2)) / 2, Oy = (A(0, 2) - A(2, 0)) / 2, Oz = (A(1, 0) - A(0, 1)) / 2;
    // Spin: R J Rᵀ Ω.
    const bx = R0[o] * Ox + R0[o + 3] * Oy + R0[o + 6] * Oz;
    const by = R0[o + 1] * Ox + R0[o + 4] * Oy + R0[o + 7] * Oz;
    const bz = R0[o + 2] * Ox + R0[o + 5] * Oy + R0[o + 8] * Oz;
    const jx = J[o] * bx + J[o + 1] * by + J[o + 2] * bz;
    const jy = J[o + 3] * bx + J[o + 4] * by + J[o + 5] * bz;
    const jz = J[o + 6] * bx + J[o + 7] * by + J[o + 8] * bz;
    Hx += R0[o] * jx + R0[o + 1] * jy + R0[o + 2] * jz;
    Hy += R0[o + 3] * jx + R0[o + 4] * jy + R0[o + 5] * jz;
    Hz += R0[o + 6] * jx + R0[o + 7] * jy + R0[o + 8] * jz;
    // Orbit: m (x − x_c) × (ẋ − ẋ_c).
    const m = model.mass[i];
    const dx = X0[3 * i] - xcx, dy = X0[3 * i + 1] - xcy, dz = X0[3 * i + 2] - xcz;
    const ux = vel[3 * i] - vcx, uy = vel[3 * i + 1] - vcy, uz = vel[3 * i + 2] - vcz;
    Hx += m * (dy * uz - dz * uy); Hy += m * (dz * ux - dx * uz); Hz += m * (dx * uy - dy * ux);
  }
  return Math.hypot(Hx, Hy, Hz);
}
