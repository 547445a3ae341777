/**
 * An independent second formulation of the same physics, written differently on purpose, and
 * compared with the engine's final attitude to 1e-6 rad (issue 3 acceptance):
 * - its own forward kinematics on 4×4 homogeneous transforms (not the shared module);
 * - its own joint motion straight from the sequence JSON (degrees);
 * - no locked inertia or shape momentum formula: the momentum map H(ω, θ̇) is measured by central
 *   finite differences of world poses along each velocity direction (three root rotations and the
 *   joint motion) and H = 0 is solved for ω by Gaussian elimination;
 * - the rotation matrix (not a quaternion) is integrated by a fixed-step classical RK4 with
 *   Gram–Schmidt re-orthonormalisation, with steps aligned to the step boundaries.
 */
import { describe, expect, it } from 'vitest';

import { simulate } from '../../server/engine/simulate.ts';
import type { Body } from '../../shared/contracts/body.ts';
import type { Sequence } from '../../shared/contracts/sequence.ts';
import { quatAngleBetween, quatToMatrix } from '../../shared/math/quaternion.ts';
import { type ReferenceSpline, referenceSpline } from '../support/reference-spline.ts';
import { loadBody, loadSequence, mustSequence, quatOf } from './fixtures.ts';

/** Acceptance tolerance, rad (issue 3). */
const AGREEMENT_RAD = 1e-6;
/** Track acceptance tolerance, rad (issue 15). */
const TRACK_AGREEMENT_RAD = 1e-7;

type M4 = number[]; // 4×4 row-major
const mul4 = (a: M4, b: M4): M4 => {
  const o = new Array<number>(16).fill(0);
  for (let r = 0; r < 4; r++) for (let c = 0; c < 4; c++) for (let k = 0; k < 4; k++) o[4 * r + c] += a[4 * r + k] * b[4 * k + c];
  return o;
};
const translation = (v: number[]): M4 => [1, 0, 0, v[0], 0, 1, 0, v[1], 0, 0, 1, v[2], 0, 0, 0, 1];
/** Homogeneous rotation about a (not necessarily unit) axis, via the matrix exponential's closed form. */
function rotation4(axis: number[], angle: number): M4 {
  const n = Math.hypot(axis[0], axis[1], axis[2]);
  const [x, y, z] = axis.map((v) => v / n);
  const K = [0, -z, y, z, 0, -x, -y, x, 0];
  const K2 = [0, 0, 0, 0, 0, 0, 0, 0, 0];
  for (let r = 0; r < 3; r++) for (let c = 0; c < 3; c++) for (let k = 0; k < 3; k++) K2[3 * r + c] += K[3 * r + k] * K[3 * k + c];
  const s = Math.sin(angle), v = 1 - Math.cos(angle);
  const R = [1, 0, 0, 0, 1, 0, 0, 0, 1].map((e, i) => e + s * K[i] + v * K2[i]);
  return [R[0], R[1], R[2], 0, R[3], R[4], R[5], 0, R[6], R[7], R[8], 0, 0, 0, 0, 1];
}

/** World transforms of all segments for joint angles by name (rad) and a root rotation (3×3 row-major). */
function poses(body: Body, angles: Map<string, number>, root: number[]): M4[] {
  const byName = new Map<string, M4>();
  const out: M4[] = [];
  for (const s of body.segments) {
    let T: M4;
    if (!s.parent) T = [root[0], root[1], root[2], 0, root[3], root[4], root[5], 0, root[6], root[7], root[8], 0, 0, 0, 0, 1];
    else {
      T = mul4(byName.get(s.parent)!, translation(s.joint!.origin));
      for (const d of s.joint!.dofs) T = mul4(T, rotation4(d.axis, angles.get(d.name) ?? 0));
    }
    byName.set(s.name, T);
    out.push(T);
  }
  return out;
}

/** Seconds a step lasts, from the contract's wording. */
function stepSeconds(step: Sequence['steps'][number]): number {
  if (step.kind === 'track') return (step.frames.length - 1) / step.rateHz;
  return step.kind === 'harmonic' ? step.period * step.cycles : step.duration;
}

/** A track's splines per dof from the reference package (cached: its dense solve is slow). */
const trackSplines = new WeakMap<object, ReferenceSpline[]>();
function splinesOf(step: Extract<Sequence['steps'][number], { kind: 'track' }>): ReferenceSpline[] {
  let s = trackSplines.get(step);
  if (!s) {
    const xs = step.frames.map((_, k) => k / step.rateHz);
    s = step.dofs.map((_, j) => referenceSpline(xs, step.frames.map((f) => f[j])));
    trackSplines.set(step, s);
  }
  return s;
}

/** Joint angles (rad) and rates (rad/s) at time t, straight from the sequence JSON. */
function jointState(body: Body, seq: Sequence, t: number): { q: Map<string, number>; qd: Map<string, number> } {
  const r = Math.PI / 180;
  const q = new Map<string, number>(), qd = new Map<string, number>();
  for (const s of body.segments) for (const d of s.joint?.dofs ?? []) { q.set(d.name, (seq.start[d.name] ?? 0) * r); qd.set(d.name, 0); }
  let t0 = 0;
  for (const step of seq.steps) {
    const T = stepSeconds(step);
    const local = Math.min(Math.max(t - t0, 0), T);
    const active = t > t0 && t <= t0 + T;
    if (step.kind === 'move') {
      const u = local / T;
      for (const [name, deg] of Object.entries(step.to)) {
        const a = q.get(name)!, b = deg * r;
        q.set(name, a + (b - a) * (10 * u ** 3 - 15 * u ** 4 + 6 * u ** 5));
        if (active) qd.set(name, ((b - a) * (30 * u ** 2 - 60 * u ** 3 + 30 * u ** 4)) / T);
      }
    } else if (step.kind === 'harmonic') {
      const w = (2 * Math.PI) / step.period;
      for (const [name, j] of Object.entries(step.joints)) {
        q.set(name, (j.offset + j.amplitude * Math.sin(w * local + j.phase * r)) * r);
        if (active) qd.set(name, j.amplitude * r * w * Math.cos(w * local + j.phase * r));
      }
    } else if (step.kind === 'track') {
      // Rate by central differences of the reference spline (one-sided at the ends, where the
      // natural spline's zero curvature keeps that second-order accurate too).
      const e = 1e-6;
      splinesOf(step).forEach((sp, j) => {
        const name = step.dofs[j];
        q.set(name, sp.at(local) * r);
        const a = Math.max(0, local - e), b = Math.min(T, local + e);
        if (active) qd.set(name, ((sp.at(b) - sp.at(a)) / (b - a)) * r);
      });
    }
    if (t <= t0 + T) break;
    t0 += T;
  }
  return { q, qd };
}

/** Angular momentum about the system CoM (root frame at R = I) of a velocity direction, by central differences of poses. */
function momentumAlong(body: Body, q: Map<string, number>, dq: Map<string, number>, omega: number[]): number[] {
  const eps = 1e-6;
  const at = (sign: number) => {
    const qq = new Map([...q].map(([k, v]) => [k, v + sign * eps * (dq.get(k) ?? 0)]));
    const rot = rotation4(Math.hypot(...omega) > 0 ? omega : [1, 0, 0], sign * eps * Math.hypot(...omega));
    return poses(body, qq, [rot[0], rot[1], rot[2], rot[4], rot[5], rot[6], rot[8], rot[9], rot[10]]);
  };
  const P = at(1), Mn = at(-1), P0 = poses(body, q, [1, 0, 0, 0, 1, 0, 0, 0, 1]);
  const com = (T: M4, c: number[]) => [0, 1, 2].map((r) => T[4 * r] * c[0] + T[4 * r + 1] * c[1] + T[4 * r + 2] * c[2] + T[4 * r + 3]);
  const mTot = body.segments.reduce((s, g) => s + g.mass, 0);
  const x = body.segments.map((s, i) => com(P0[i], s.com));
  const v = body.segments.map((s, i) => com(P[i], s.com).map((e, k) => (e - com(Mn[i], s.com)[k]) / (2 * eps)));
  const xc = [0, 1, 2].map((k) => body.segments.reduce((s, g, i) => s + g.mass * x[i][k], 0) / mTot);
  const vc = [0, 1, 2].map((k) => body.segments.reduce((s, g, i) => s + g.mass * v[i][k], 0) / mTot);
  const H = [0, 0, 0];
  body.segments.forEach((s, i) => {
    // Ω from (Ṙ Rᵀ) skew part; spin = R J Rᵀ Ω with J the full tensor.
    const R = (T: M4) => [T[0], T[1], T[2], T[4], T[5], T[6], T[8], T[9], T[10]];
    const R0 = R(P0[i]), Rp = R(P[i]), Rm = R(Mn[i]);
    const Rd = Rp.map((e, k) => (e - Rm[k]) / (2 * eps));
    const W = (a: number, b: number) => Rd[3 * a] * R0[3 * b] + Rd[3 * a + 1] * R0[3 * b + 1] + Rd[3 * a + 2] * R0[3 * b + 2];
    const Om = [(W(2, 1) - W(1, 2)) / 2, (W(0, 2) - W(2, 0)) / 2, (W(1, 0) - W(0, 1)) / 2];
    const [a, b, c, dxy = 0, dxz = 0, dyz = 0] = s.inertia;
    const J = [a, dxy, dxz, dxy, b, dyz, dxz, dyz, c];
    const bodyOm = [0, 1, 2].map((k) => R0[k] * Om[0] + R0[3 + k] * Om[1] + R0[6 + k] * Om[2]);
    const JO = [0, 1, 2].map((k) => J[3 * k] * bodyOm[0] + J[3 * k + 1] * bodyOm[1] + J[3 * k + 2] * bodyOm[2]);
    const spin = [0, 1, 2].map((k) => R0[3 * k] * JO[0] + R0[3 * k + 1] * JO[1] + R0[3 * k + 2] * JO[2]);
    const d = x[i].map((e, k) => e - xc[k]), u = v[i].map((e, k) => e - vc[k]);
    H[0] += spin[0] + s.mass * (d[1] * u[2] - d[2] * u[1]);
    H[1] += spin[1] + s.mass * (d[2] * u[0] - d[0] * u[2]);
    H[2] += spin[2] + s.mass * (d[0] * u[1] - d[1] * u[0]);
  });
  return H;
}

/** ω (root frame) that makes H = 0, by Gaussian elimination on the 3 measured columns. */
function solveOmega(body: Body, seq: Sequence, t: number): number[] {
  const { q, qd } = jointState(body, seq, t);
  const zero = new Map([...qd].map(([k]) => [k, 0]));
  const cols = [[1, 0, 0], [0, 1, 0], [0, 0, 1]].map((e) => momentumAlong(body, q, zero, e));
  const rhs = momentumAlong(body, q, qd, [0, 0, 0]).map((v) => -v);
  const A = [0, 1, 2].map((r) => [cols[0][r], cols[1][r], cols[2][r], rhs[r]]);
  for (let p = 0; p < 3; p++) {
    const piv = [p, p + 1, p + 2].filter((r) => r < 3).reduce((m, r) => (Math.abs(A[r][p]) > Math.abs(A[m][p]) ? r : m), p);
    [A[p], A[piv]] = [A[piv], A[p]];
    for (let r = 0; r < 3; r++) if (r !== p) { const f = A[r][p] / A[p][p]; for (let c = p; c < 4; c++) A[r][c] -= f * A[p][c]; }
  }
  return [A[0][3] / A[0][0], A[1][3] / A[1][1], A[2][3] / A[2][2]];
}

/** Fixed-step RK4 on Ṙ = R[ω]×, re-orthonormalised after each step; returns the final R (row-major). */
function integrateRotation(body: Body, seq: Sequence, stepsPerSecond: number): number[] {
  const skewMul = (R: number[], w: number[]) => [0, 1, 2].flatMap((r) => [
    R[3 * r + 1] * w[2] - R[3 * r + 2] * w[1], R[3 * r + 2] * w[0] - R[3 * r] * w[2], R[3 * r] * w[1] - R[3 * r + 1] * w[0]]);
  let R = [1, 0, 0, 0, 1, 0, 0, 0, 1];
  let t0 = 0;
  for (const step of seq.steps) {
    const T = stepSeconds(step);
    const n = Math.max(4, Math.ceil(T * stepsPerSecond));
    const h = T / n;
    // Rates are evaluated strictly inside the step so the piece boundaries are respected.
    const f = (t: number, X: number[]) => skewMul(X, solveOmega(body, seq, Math.min(t0 + T, Math.max(t0 + 1e-12, t))));
    for (let k = 0; k < n; k++) {
      const t = t0 + k * h;
      const k1 = f(t, R);
      const k2 = f(t + h / 2, R.map((v, i) => v + (h / 2) * k1[i]));
      const k3 = f(t + h / 2, R.map((v, i) => v + (h / 2) * k2[i]));
      const k4 = f(t + h, R.map((v, i) => v + h * k3[i]));
      R = R.map((v, i) => v + (h / 6) * (k1[i] + 2 * k2[i] + 2 * k3[i] + k4[i]));
      // Gram–Schmidt on the columns.
      const c0 = [R[0], R[3], R[6]], c1 = [R[1], R[4], R[7]];
      const n0 = Math.hypot(...c0); c0.forEach((v, i) => (c0[i] = v / n0));
      const d = c0[0] * c1[0] + c0[1] * c1[1] + c0[2] * c1[2]; c1.forEach((v, i) => (c1[i] = v - d * c0[i]));
      const n1 = Math.hypot(...c1); c1.forEach((v, i) => (c1[i] = v / n1));
      const c2 = [c0[1] * c1[2] - c0[2] * c1[1], c0[2] * c1[0] - c0[0] * c1[2], c0[0] * c1[1] - c0[1] * c1[0]];
      R = [c0[0], c1[0], c2[0], c0[1], c1[1], c2[1], c0[2], c1[2], c2[2]];
    }
    t0 += T;
  }
  return R;
}

/** Angle (rad) between two rotation matrices: acos((tr(AᵀB) − 1)/2) via atan2 for accuracy. */
function matrixAngle(A: ArrayLike<number>, B: ArrayLike<number>): number {
  const C = [0, 1, 2].flatMap((r) => [0, 1, 2].map((c) => A[r] * B[c] + A[3 + r] * B[3 + c] + A[6 + r] * B[6 + c]));
  const tr = C[0] + C[4] + C[8];
  const s = Math.hypot(C[7] - C[5], C[2] - C[6], C[3] - C[1]) / 2;
  return Math.atan2(s, (tr - 1) / 2);
}

describe('engine vs an independent implementation (finite-difference momentum map + RK4 on rotation matrices)', () => {
  const cases: [string, string][] = [['nested-chain', 'nested-chain-maneuver'], ['arm-on-trunk', 'arm-cone']];
  for (const [b, s] of cases) {
    it(`${b}: final attitudes agree to 1e-6 rad`, () => {
      const body = loadBody(b);
      const seq = loadSequence(s, body);
      const engine = simulate(body, seq);
      const ref = integrateRotation(body, seq, 100);
      const q = quatOf(engine.final.attitude);
      // Non-trivial maneuver, then agreement.
      expect(quatAngleBetween(q, [1, 0, 0, 0])).toBeGreaterThan(0.1);
      const diff = matrixAngle(quatToMatrix(q), ref);
      expect(diff).toBeLessThan(AGREEMENT_RAD);
    });
  }

  // A recorded track (4 s of 50 Hz frames of an irregular two-dof sweep) on the nested chain; RK4
  // steps of 1/400 s land on every frame, so each step stays inside one cubic.
  it('nested-chain with a 50 Hz track step: final attitudes agree to 1e-7 rad', () => {
    const body = loadBody('nested-chain');
    const dofs = body.segments.flatMap((s) => s.joint?.dofs.map((d) => d.name) ?? []).slice(0, 2);
    const frames = Array.from({ length: 201 }, (_, k) => {
      const t = k / 50;
      return [60 * Math.sin(2 * Math.PI * t / 1.3) ** 2 + 10 * Math.sin(7 * t), 45 * (1 - Math.cos(2 * Math.PI * t / 0.9)) + 5 * Math.sin(3 * t)];
    });
    const seq = mustSequence({ start: { [dofs[0]]: frames[0][0], [dofs[1]]: frames[0][1] }, steps: [{ kind: 'track', rateHz: 50, dofs, frames }] }, body);
    const engine = simulate(body, seq);
    const ref = integrateRotation(body, seq, 400);
    const q = quatOf(engine.final.attitude);
    expect(quatAngleBetween(q, [1, 0, 0, 0])).toBeGreaterThan(0.05);
    expect(matrixAngle(quatToMatrix(q), ref)).toBeLessThan(TRACK_AGREEMENT_RAD);
  });
});
