/**
 * Momentum audit. At each sample it takes the integrated attitude, follows the attitude motion a few
 * milliseconds either way with tiny classical RK4 steps (not odex: odex's dense-output polynomial is
 * accurate in value but its derivative is ~10³× less accurate than the tolerance), builds every
 * segment's world-frame pose from the prescribed joint angles, differences those poses in time
 * (5-point stencils) and sums the total angular momentum about the system CoM in the world frame,
 * H = Σ R J Rᵀ Ω + m (x − x_c) × (ẋ − ẋ_c). None of the engine's I_lock / h / analytic-velocity
 * code is used, so a wrong formula there shows up as H ≠ 0. A correct run gives ‖H‖ ≈ 0.
 */
import type { BodyModel } from '../../shared/kinematics/body-model.ts';
import { createBodyPose, forwardKinematics } from '../../shared/kinematics/forward-kinematics.ts';
import { quatToMatrix } from '../../shared/math/quaternion.ts';
import { evalPiece, type MotionPiece } from './joint-motion.ts';

/** Stencil half-width, s: small enough for δ⁴ truncation, large enough for rounding (common practice). */
export const AUDIT_DELTA_S = 1e-3;

/** Points per audit stencil. */
export const STENCIL_POINTS = 5;

/** Stencil offsets (in units of δ) and first-derivative weights (× 1/(12δ)); the evaluation point is offset 0. */
export const STENCILS = {
  central: { offsets: [-2, -1, 0, 1, 2], weights: [1, -8, 0, 8, -1] },
  forward: { offsets: [0, 1, 2, 3, 4], weights: [-25, 48, -36, 16, -3] },
  backward: { offsets: [-4, -3, -2, -1, 0], weights: [3, -16, 36, -48, 25] },
} as const;

/** Chooses a stencil for time t inside [t0, t1] (one integrator step) and its spacing δ (s). */
export function chooseStencil(t: number, t0: number, t1: number): { kind: keyof typeof STENCILS; delta: number } {
  const delta = Math.min(AUDIT_DELTA_S, (t1 - t0) / 8);
  if (t - 2 * delta >= t0 && t + 2 * delta <= t1) return { kind: 'central', delta };
  return t - t0 < t1 - t ? { kind: 'forward', delta } : { kind: 'backward', delta };
}

/**
 * ‖H‖ (kg·m²/s) at one instant from 5 stencil points: attitudes (4 per point, [w,x,y,z]) and joint
 * angles (dofCount per point, rad), with derivative weights already divided by 12δ.
 */
export function auditInstant(
  model: BodyModel, attitudes: ArrayLike<number>, angles: Float64Array[], weights: ArrayLike<number>, centre: number,
): number {
  const n = model.segmentCount;
  const pose = createBodyPose(model);
  const Rq = new Float64Array(9);
  // World rotation (9 per segment) and world CoM (3 per segment) at each point.
  const rotW: Float64Array[] = [], comW: Float64Array[] = [];
  for (let s = 0; s < weights.length; s++) {
    forwardKinematics(model, angles[s], pose);
    quatToMatrix([attitudes[4 * s], attitudes[4 * s + 1], attitudes[4 * s + 2], attitudes[4 * s + 3]], Rq);
    const R = new Float64Array(9 * n), X = new Float64Array(3 * n);
    for (let i = 0; i < n; i++) {
      for (let r = 0; r < 3; r++) {
        for (let c = 0; c < 3; c++) {
          R[9 * i + 3 * r + c] = Rq[3 * r] * pose.rot[9 * i + c] + Rq[3 * r + 1] * pose.rot[9 * i + 3 + c] + Rq[3 * r + 2] * pose.rot[9 * i + 6 + c];
        }
        X[3 * i + r] = Rq[3 * r] * pose.comPos[3 * i] + Rq[3 * r + 1] * pose.comPos[3 * i + 1] + Rq[3 * r + 2] * pose.comPos[3 * i + 2];
      }
    }
    rotW.push(R); comW.push(X);
  }
  // System CoM position and velocity (world).
  const M = model.totalMass;
  const xc = [0, 0, 0], vc = [0, 0, 0];
  const vel = new Float64Array(3 * n);
  for (let i = 0; i < n; i++) {
    for (let a = 0; a < 3; a++) {
      let v = 0;
      for (let s = 0; s < weights.length; s++) v += weights[s] * comW[s][3 * i + a];
      vel[3 * i + a] = v;
      xc[a] += (model.mass[i] * comW[centre][3 * i + a]) / M;
      vc[a] += (model.mass[i] * v) / M;
    }
  }
  let Hx = 0, Hy = 0, Hz = 0;
  const R0 = rotW[centre], X0 = comW[centre];
  for (let i = 0; i < n; i++) {
    const o = 9 * i;
    // Ṙ by the stencil; Ω = vee(skew part of Ṙ Rᵀ).
    const Rd = new Float64Array(9);
    for (let e = 0; e < 9; e++) { let v = 0; for (let s = 0; s < weights.length; s++) v += weights[s] * rotW[s][o + e]; Rd[e] = v; }
    const A = (r: number, c: number) => Rd[3 * r] * R0[o + 3 * c] + Rd[3 * r + 1] * R0[o + 3 * c + 1] + Rd[3 * r + 2] * R0[o + 3 * c + 2];
    const Ox = (A(2, 1) - A(1, 2)) / 2, Oy = (A(0, 2) - A(2, 0)) / 2, Oz = (A(1, 0) - A(0, 1)) / 2;
    // Spin: R J Rᵀ Ω.
    const J = model.inertia;
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
    const dx = X0[3 * i] - xc[0], dy = X0[3 * i + 1] - xc[1], dz = X0[3 * i + 2] - xc[2];
    const ux = vel[3 * i] - vc[0], uy = vel[3 * i + 1] - vc[1], uz = vel[3 * i + 2] - vc[2];
    Hx += m * (dy * uz - dz * uy); Hy += m * (dz * ux - dx * uz); Hz += m * (dx * uy - dy * ux);
  }
  return Math.hypot(Hx, Hy, Hz);
}

/** One classical RK4 step of y' = f(t, y) of size h (may be negative). */
function rk4Step(f: (t: number, y: number[]) => number[], t: number, y: number[], h: number): number[] {
  const k1 = f(t, y);
  const k2 = f(t + h / 2, y.map((v, i) => v + (h / 2) * k1[i]));
  const k3 = f(t + h / 2, y.map((v, i) => v + (h / 2) * k2[i]));
  const k4 = f(t + h, y.map((v, i) => v + h * k3[i]));
  return y.map((v, i) => v + (h / 6) * (k1[i] + 2 * k2[i] + 2 * k3[i] + k4[i]));
}

/**
 * ‖H‖ (kg·m²/s) at time t of a piece, given the integrated attitude q (w,x,y,z) there and the
 * attitude right-hand side f of that piece.
 */
export function auditAt(
  model: BodyModel, piece: MotionPiece, f: (t: number, y: number[]) => number[], t: number, q: ArrayLike<number>,
): number {
  const { kind, delta } = chooseStencil(t, piece.t0, piece.t1);
  const st = STENCILS[kind];
  const c = st.offsets.indexOf(0);
  const att = new Float64Array(4 * STENCIL_POINTS);
  const angles: Float64Array[] = [];
  // Propagate from the sample outwards, one δ at a time, each way.
  let fwd = Array.from(q), bwd = Array.from(q);
  for (let j = c; j < STENCIL_POINTS; j++) {
    if (j > c) fwd = rk4Step(f, t + (j - c - 1) * delta, fwd, delta);
    att.set(fwd, 4 * j);
  }
  for (let j = c - 1; j >= 0; j--) {
    bwd = rk4Step(f, t + (j - c + 1) * delta, bwd, -delta);
    att.set(bwd, 4 * j);
  }
  for (let j = 0; j < STENCIL_POINTS; j++) {
    const qq = new Float64Array(model.dofCount);
    evalPiece(piece, t + st.offsets[j] * delta, qq, null);
    angles.push(qq);
  }
  const w = st.weights.map((x) => (delta > 0 ? x / (12 * delta) : 0));
  return auditInstant(model, att, angles, w, c);
}
