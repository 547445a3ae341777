/**
 * The sixth-order Magnus integrator (server/engine/magnus.ts, integrate-attitude.ts) against
 * things outside it: a general-purpose adaptive ODE solver (odex, Hairer's ODEX extrapolation
 * method) on the quaternion ODE q̇ = ½ q ⊗ (0, ω), on several bodies and sequences; its order of
 * convergence; closed-form rotations; and the accounting of ω evaluations.
 */
import { describe, expect, it } from 'vitest';

import { integrateAttitude, PlanRate, type RateSource } from '../../server/engine/integrate-attitude.ts';
import { compileMotion, type MotionPiece, type MotionPlan } from '../../server/engine/joint-motion.ts';
import { GAUSS_NODES, magnusTheta, quatTimesExp } from '../../server/engine/magnus.ts';
import type { Body } from '../../shared/contracts/body.ts';
import { validateBody } from '../../shared/contracts/body.ts';
import { compileBody } from '../../shared/kinematics/body-model.ts';
import { quatAngleBetween } from '../../shared/math/quaternion.ts';
import { loadBody, loadSequence, mustSequence } from './fixtures.ts';
import { odexAttitudesAt, odexFinalAttitude } from './odex-reference.ts';
import { odex } from './odex-solver.ts';
import { standardManeuver } from './standard-maneuver.ts';

/** Final attitude agreement with odex at 1e-13, at the default rtol 1e-10, rad (issue 11: the result tolerances stay). */
const AGREEMENT_RAD = 1e-9;
/** Sample attitudes against odex's dense output at 1e-13, rad. */
const SAMPLE_AGREEMENT_RAD = 1e-9;

/** A smooth, non-commuting test rate (rad/s). */
const omega = (t: number): number[] => [Math.cos(3 * t), Math.sin(2 * t), 0.5 + 0.3 * t];

/** q̇ = ½ q ⊗ (0, ω(t)) by odex at tolerance 1e-14, from identity to T. */
function odexReference(T: number): number[] {
  const s = new odex.Solver(4);
  s.relativeTolerance = 1e-14; s.absoluteTolerance = 1e-14; s.maxSteps = 1_000_000;
  const r = s.solve((t, y) => {
    const [wx, wy, wz] = omega(t);
    return [0.5 * (-y[1] * wx - y[2] * wy - y[3] * wz), 0.5 * (y[0] * wx + y[2] * wz - y[3] * wy),
      0.5 * (y[0] * wy - y[1] * wz + y[3] * wx), 0.5 * (y[0] * wz + y[1] * wy - y[2] * wx)];
  }, 0, [1, 0, 0, 0], T);
  return r.y;
}

/** The test rate as a RateSource, counting calls. */
function syntheticSource(): RateSource & { calls: number } {
  return {
    calls: 0,
    setPiece() {},
    rate(t, out, o) { this.calls++; const w = omega(t); out[o] = w[0]; out[o + 1] = w[1]; out[o + 2] = w[2]; },
  };
}

/** A plan of smooth pieces over [0, T] for the synthetic rate (only t0, t1, moving and step are read). */
function syntheticPlan(bounds: number[]): MotionPlan {
  const pieces = bounds.slice(1).map((t1, i) => ({ t0: bounds[i], t1, step: i, moving: Int32Array.of(0) }) as unknown as MotionPiece);
  return { pieces, duration: bounds[bounds.length - 1], start: new Float64Array(0) };
}

describe('Magnus step (three Gauss–Legendre nodes)', () => {
  it('a constant rate gives the exact rotation exp(hω) in one step', () => {
    const w = Float64Array.of(0.3, -1.2, 2, 0.3, -1.2, 2, 0.3, -1.2, 2), th = new Float64Array(3);
    magnusTheta(w, 0, 0.7, th);
    expect(Array.from(th).map((v) => v / 0.7)).toEqual([0.3, -1.2, 2].map((v): unknown => expect.closeTo(v, 14)));
  });

  it('converges at sixth order on a non-commuting rate (error ratio ≈ 2⁶ per halving)', () => {
    const T = 2, ref = odexReference(T);
    const errors = [10, 20, 40].map((n) => {
      const h = T / n, q = Float64Array.of(1, 0, 0, 0), w = new Float64Array(9), th = new Float64Array(3);
      for (let k = 0; k < n; k++) {
        for (let j = 0; j < 3; j++) w.set(omega(k * h + GAUSS_NODES[j] * h), 3 * j);
        magnusTheta(w, 0, h, th);
        quatTimesExp(q, 0, th, 0, q, 0);
      }
      return quatAngleBetween(q, ref);
    });
    // Order 6: 64× per halving (measured 64, 64); at least 50 allows for round-off.
    expect(errors[0] / errors[1]).toBeGreaterThan(50);
    expect(errors[1] / errors[2]).toBeGreaterThan(50);
  });
});

describe('adaptive Magnus integration of a prescribed rate', () => {
  it('meets the tolerance on a synthetic rate split into pieces, and counts every evaluation', () => {
    const ref = odexReference(2);
    for (const tol of [1e-8, 1e-10, 1e-12]) {
      const src = syntheticSource();
      const tr = integrateAttitude(compileBody(loadBody('rotor')), syntheticPlan([0, 0.5, 1.3, 2]), { rtol: tol, atol: tol }, [0.25, 1, 1.9], src);
      // About the tolerance at every level (the per-step bound is a twentieth of it, and a few
      // hundred steps add up); odex at the same rtol was off by up to 17× on the standard maneuver.
      expect(quatAngleBetween(tr.final, ref)).toBeLessThan(3 * tol);
      // Every call of the rate function is counted, by stepping or by samples.
      expect(tr.stats.rhsEvaluations + tr.stats.sampleEvaluations).toBe(src.calls);
    }
  });

  it('error falls as the tolerance tightens (standard human model, arm cones then leg loops)', () => {
    const { model, plan } = standardManeuver();
    const ref = odexFinalAttitude(model, plan, 1e-13).q;
    const errs = [1e-6, 1e-8, 1e-10, 1e-12].map((tol) => quatAngleBetween(integrateAttitude(model, plan, { rtol: tol, atol: tol }).final, ref));
    for (let k = 1; k < errs.length; k++) expect(errs[k]).toBeLessThan(errs[k - 1]);
    expect(errs[2]).toBeLessThan(1e-10);
  });
});

/** A 30-segment chain (2 dofs per joint, segments of decreasing size) with three joints swept out of phase. */
function chain30(): { body: Body; sequence: unknown } {
  const segments: unknown[] = [{ name: 's0', mass: 6, com: [0, 0, 0], inertia: [0.08, 0.07, 0.03] }];
  for (let i = 1; i < 30; i++) {
    const m = 6 * Math.pow(0.93, i);
    segments.push({
      name: `s${i}`, parent: `s${i - 1}`, mass: m, com: [0, 0, 0.06], inertia: [m * 0.004, m * 0.004, m * 0.001],
      joint: { origin: [0, 0, 0.12], dofs: [
        { name: `a${i}`, axis: [1, 0, 0], min: -180, max: 180 }, { name: `b${i}`, axis: [0, 1, 0], min: -180, max: 180 }] },
    });
  }
  const v = validateBody({ name: 'thirty-segment chain', segments });
  if (!v.ok) throw new Error(v.issues.map((i) => i.message).join('; '));
  const sequence = { start: { a5: 20, b15: 0, a25: 0 }, steps: [
    { kind: 'harmonic', period: 0.9, cycles: 3, joints: {
      a5: { offset: -20, amplitude: 40, phase: 90 }, b15: { offset: 0, amplitude: 50, phase: 0 }, a25: { offset: 0, amplitude: 60, phase: 0 } } },
    { kind: 'move', duration: 0.7, to: { a5: 0, b15: 0, a25: 0, b2: 30 } },
  ] };
  return { body: v.value, sequence };
}

describe('Magnus (production) vs odex (independent cross-check) at the default rtol 1e-10', () => {
  const cases: [string, () => { model: ReturnType<typeof compileBody>; plan: MotionPlan }][] = [
    ['arm-on-trunk, arm cone', () => { const b = loadBody('arm-on-trunk'); const m = compileBody(b); return { model: m, plan: compileMotion(m, loadSequence('arm-cone', b)) }; }],
    ['nested-chain maneuver', () => { const b = loadBody('nested-chain'); const m = compileBody(b); return { model: m, plan: compileMotion(m, loadSequence('nested-chain-maneuver', b)) }; }],
    ['rotor, 720° move', () => { const b = loadBody('rotor'); const m = compileBody(b); return { model: m, plan: compileMotion(m, mustSequence({ steps: [{ kind: 'move', duration: 2, to: { spin: 720 } }] }, b)) }; }],
    ['standard human model, 10 s maneuver', standardManeuver],
    ['30-segment chain', () => { const c = chain30(); const m = compileBody(c.body); return { model: m, plan: compileMotion(m, mustSequence(c.sequence, c.body)) }; }],
  ];
  for (const [name, make] of cases) {
    it(`${name}: final attitudes agree to ${AGREEMENT_RAD} rad`, () => {
      const { model, plan } = make();
      const magnus = integrateAttitude(model, plan, { rtol: 1e-10, atol: 1e-10 });
      const ref = odexFinalAttitude(model, plan, 1e-13);
      expect(quatAngleBetween(magnus.final, ref.q)).toBeLessThan(AGREEMENT_RAD);
      // Fewer evaluations of ω than odex needs at the same tolerance.
      expect(magnus.stats.rhsEvaluations).toBeLessThan(odexFinalAttitude(model, plan, 1e-10).evaluations);
    });
  }

  it('samples inside steps (the interpolant) agree with odex dense output at 1e-13', () => {
    const { model, plan } = standardManeuver();
    const times = [0.013, 0.41, 1.777, 3.3333, 4.9, 6.02, 8.5, 9.95];
    const magnus = integrateAttitude(model, plan, { rtol: 1e-10, atol: 1e-10 }, times);
    const ref = odexAttitudesAt(model, plan, 1e-13, times);
    times.forEach((_, k) => expect(quatAngleBetween(magnus.outputs.subarray(4 * k, 4 * k + 4), ref[k])).toBeLessThan(SAMPLE_AGREEMENT_RAD));
    // Inside a piece's first step a sample costs three evaluations; elsewhere none (the rate polynomial).
    expect(magnus.stats.sampleEvaluations).toBeLessThanOrEqual(3);
  });

  it('a hold costs no evaluation and keeps the attitude', () => {
    const b = loadBody('arm-on-trunk'), m = compileBody(b);
    const plan = compileMotion(m, mustSequence({ start: { r_sh_flex: 30 }, steps: [{ kind: 'hold', duration: 2 }] }, b));
    const src = new PlanRate(m);
    const tr = integrateAttitude(m, plan, { rtol: 1e-10, atol: 1e-10 }, [0.5, 2], src);
    expect(src.evaluations).toBe(0);
    expect(Array.from(tr.final)).toEqual([1, 0, 0, 0]);
  });
});
