/**
 * Reference checks of the zero-momentum engine against results from outside the project.
 */
import { describe, expect, it } from 'vitest';

import { simulate } from '../../server/engine/simulate.ts';
import { quatAngleBetween, quatToAxisAngle } from '../../shared/math/quaternion.ts';
import { loadBody, loadSequence, mustSequence, quatOf } from './fixtures.ts';

/** Agreement required between runs that differ only in playback speed, rad (issue 3). */
const SPEED_INDEPENDENCE_RAD = 1e-7;

describe('rotor spun inside a body about a common principal axis through the CoM', () => {
  // Conservation of angular momentum: (I_b + I_r)·φ̇ + I_r·θ̇ = 0, so the body turns by
  // φ = −I_r/(I_r + I_b)·θ (Kane & Levinson 1985, Dynamics: Theory and Applications, ch. on gyrostats).
  const body = loadBody('rotor');
  const Ir = 0.5, Ib = 2.5; // the fixture's z moments, kg·m²

  it('turns the platform by −I_r/(I_r+I_b) times a 720° rotor move', () => {
    const r = simulate(body, mustSequence({ steps: [{ kind: 'move', duration: 2, to: { spin: 720 } }] }, body));
    const expected = (-Ir / (Ir + Ib)) * 720;
    const { angle, axis } = quatToAxisAngle(quatOf(r.final.attitude));
    // 720·(1/6) = 120°: about −z.
    expect(axis[2]).toBeCloseTo(-1, 12);
    expect((angle * 180) / Math.PI).toBeCloseTo(-expected, 8);
    expect(r.momentumResidual.relative).toBeLessThan(1e-9);
  });

  it('follows the rotor through a harmonic step (net zero after whole cycles)', () => {
    const r = simulate(body, mustSequence({ steps: [
      { kind: 'move', duration: 1, to: { spin: 90 } },
      { kind: 'harmonic', period: 0.7, cycles: 3, joints: { spin: { offset: 0, amplitude: 90, phase: 90 } } },
    ] }, body));
    // After the move (+90°) and whole harmonic cycles (ends at 90°): body at −90·I_r/(I_r+I_b) = −15° about z.
    expect(r.final.yprDeg.yaw).toBeCloseTo(-15, 7);
    expect(Math.abs(r.final.yprDeg.pitch)).toBeLessThan(1e-9);
  });
});

describe('paths that enclose no area give no net rotation', () => {
  // A closed path in shape space that encloses no area has no geometric phase
  // (Shapere & Wilczek 1989, "Geometry of self-propulsion at low Reynolds number"; Montgomery 1993).
  const body = loadBody('nested-chain');

  it('no joint motion: the attitude stays identity', () => {
    const r = simulate(body, mustSequence({ start: { j1a: 30 }, steps: [{ kind: 'hold', duration: 3 }] }, body));
    expect(quatAngleBetween(quatOf(r.final.attitude), [1, 0, 0, 0])).toBe(0);
  });

  it('one dof out and back along the same path: back to the start to 1e-9 rad', () => {
    const r = simulate(body, mustSequence({ start: { j1a: 20, knee: 30 }, steps: [
      { kind: 'move', duration: 1.3, to: { j1a: 150 } },
      { kind: 'hold', duration: 0.2 },
      { kind: 'move', duration: 0.6, to: { j1a: 20 } },
    ] }, body));
    expect(quatAngleBetween(quatOf(r.final.attitude), [1, 0, 0, 0])).toBeLessThan(1e-9);
    // …while the body did turn on the way.
    const mid = r.samples.frames.find((f) => f.t >= 1.3)!;
    expect(quatAngleBetween(quatOf(mid.attitude), [1, 0, 0, 0])).toBeGreaterThan(0.05);
  });

  it('a multi-dof move out and back along the same straight path also returns', () => {
    const r = simulate(body, mustSequence({ steps: [
      { kind: 'move', duration: 1, to: { j1a: 80, j1b: 40, hip_flex: 60, knee: 90 } },
      { kind: 'move', duration: 2.5, to: { j1a: 0, j1b: 0, hip_flex: 0, knee: 0 } },
    ] }, body));
    expect(quatAngleBetween(quatOf(r.final.attitude), [1, 0, 0, 0])).toBeLessThan(1e-9);
  });
});

describe('a two-dof loop', () => {
  // Reorientation under zero momentum depends only on the path in joint space, not on its timing
  // (the connection is a 1-form on shape space; Shapere & Wilczek 1989; Montgomery 1993).
  const body = loadBody('arm-on-trunk');
  const loop = (period: number, direction: 1 | -1) => ({
    start: { r_sh_flex: 60, r_sh_abd: 30 },
    steps: [
      { kind: 'move', duration: period / 2, to: { r_sh_flex: 90 } },
      { kind: 'harmonic', period, cycles: 2,
        joints: { r_sh_flex: { offset: 60, amplitude: 30, phase: 90 }, r_sh_abd: { offset: 30, amplitude: 30 * direction, phase: 0 } } },
      { kind: 'move', duration: period / 2, to: { r_sh_flex: 60 } },
    ],
  });
  const run = (period: number, dir: 1 | -1) => quatOf(simulate(body, mustSequence(loop(period, dir), body)).final.attitude);

  it('gives a non-zero net rotation', () => {
    expect(quatAngleBetween(run(1.5, 1), [1, 0, 0, 0])).toBeGreaterThan(0.05);
  });

  it('reversing the loop gives the inverse rotation (to 1e-8 rad)', () => {
    // Path a·γ·a⁻¹ versus a·γ⁻¹·a⁻¹: the holonomy of the reversed loop is the inverse rotation.
    const fwd = run(1.5, 1), back = run(1.5, -1);
    const backInverse = [back[0], -back[1], -back[2], -back[3]];
    expect(quatAngleBetween(fwd, backInverse)).toBeLessThan(1e-8);
  });

  it('the same path at half and at twice the speed gives the same rotation to 1e-7 rad', () => {
    const base = run(1.5, 1);
    expect(quatAngleBetween(run(3.0, 1), base)).toBeLessThan(SPEED_INDEPENDENCE_RAD);
    expect(quatAngleBetween(run(0.75, 1), base)).toBeLessThan(SPEED_INDEPENDENCE_RAD);
  });
});

describe('momentum audit and tolerance convergence on every test body', () => {
  const cases: [string, string][] = [['arm-on-trunk', 'arm-cone'], ['nested-chain', 'nested-chain-maneuver']];
  for (const [b, s] of cases) {
    it(`${b}: audit below 1e-9 relative`, () => {
      const body = loadBody(b);
      const r = simulate(body, loadSequence(s, body));
      expect(r.momentumResidual.peakShapeMomentum).toBeGreaterThan(0.1);
      expect(r.momentumResidual.relative).toBeLessThan(1e-9);
    });

    it(`${b}: tightening rtol 1e-8 → 1e-10 → 1e-12 converges (changes shrink with the tolerance)`, () => {
      const body = loadBody(b);
      const seq = loadSequence(s, body);
      const at = (rtol: number) => quatOf(simulate(body, seq, { rtol, rateHz: 5 }).final.attitude);
      const q8 = at(1e-8), q10 = at(1e-10), q12 = at(1e-12);
      // Error at a tolerance is bounded by a modest multiple of it (common practice: ×100 for global error).
      expect(quatAngleBetween(q8, q12)).toBeLessThan(100 * 1e-8);
      expect(quatAngleBetween(q10, q12)).toBeLessThan(100 * 1e-10);
      // Halving the tolerance changes the result by less than the tolerance promises.
      expect(quatAngleBetween(at(5e-11), q10)).toBeLessThan(100 * 1e-10);
    });
  }
});

describe('the momentum audit detects a wrong body rate', () => {
  // A check that cannot fail proves nothing: feed the audit a rate 1 % off and it must see it.
  it('flags a 1 % error in ω at about 1e-2 of the shape momentum', async () => {
    const { compileBody } = await import('../../shared/kinematics/body-model.ts');
    const { compileMotion, evalPiece } = await import('../../server/engine/joint-motion.ts');
    const { bodyRate, createMomentumWork } = await import('../../server/engine/locked-momentum.ts');
    const { auditAt, createAuditWork } = await import('../../server/engine/momentum-audit.ts');
    const body = loadBody('nested-chain');
    const model = compileBody(body);
    const plan = compileMotion(model, loadSequence('nested-chain-maneuver', body));
    const piece = plan.pieces[1];
    const t = piece.t0 + 0.7;
    const q = new Float64Array(model.dofCount), qd = new Float64Array(model.dofCount);
    evalPiece(piece, t, q, qd);
    const work = createMomentumWork(model);
    const omega = Array.from(bodyRate(model, q, qd, work));
    const h = Math.hypot(...work.h);
    const audit = createAuditWork(model);
    expect(auditAt(model, piece, t, omega, audit) / h).toBeLessThan(1e-9);
    const wrong = auditAt(model, piece, t, omega.map((w) => 1.01 * w), audit) / h;
    expect(wrong).toBeGreaterThan(1e-3);
  });
});
