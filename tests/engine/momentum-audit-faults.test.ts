/**
 * The momentum audit catches the integrator (issue 11; DECISIONS.md "Audit"): perturbing the
 * integrated attitude at one sample by 1e-6 rad, or integrating ω scaled by (1 + 1e-6), raises
 * max ‖H‖ / peak shape momentum above 1e-7, while a healthy run stays below 1e-8. The audit sees
 * only the integrator's output (server/engine/track-audit.ts): its attitudes, and — as the full run
 * audits — the ω values it recorded at its nodes as the reference rate.
 */
import { describe, expect, it } from 'vitest';

import { integrateAttitude, PlanRate, type RateSource } from '../../server/engine/integrate-attitude.ts';
import type { MotionPiece } from '../../server/engine/joint-motion.ts';
import { quatTimesExp } from '../../server/engine/magnus.ts';
import { RateNodes } from '../../server/engine/rate-nodes.ts';
import { sampleTimes, simulate, simulateFinal, simulateModel } from '../../server/engine/simulate.ts';
import { auditTrack } from '../../server/engine/track-audit.ts';
import { evaluateSequence } from '../../server/planning/evaluate-steps.ts';
import { compileBody } from '../../shared/kinematics/body-model.ts';
import { quatAngleBetween } from '../../shared/math/quaternion.ts';
import { loadBody, loadSequence, quatOf } from './fixtures.ts';
import { standardManeuver } from './standard-maneuver.ts';

/** DECISIONS.md: a healthy run stays below this (relative to the peak shape momentum). */
const HEALTHY = 1e-8;
/** DECISIONS.md: a fault of 1e-6 raises the audit above this. */
const FAULT = 1e-7;

/** The plan's own rate, scaled by (1 + eps): an integrator fed a slightly wrong ω. */
class ScaledRate implements RateSource {
  private readonly inner: PlanRate;
  constructor(model: ReturnType<typeof compileBody>, private readonly scale: number) { this.inner = new PlanRate(model); }
  setPiece(piece: MotionPiece): void { this.inner.setPiece(piece); }
  rate(t: number, out: Float64Array, o: number): void {
    this.inner.rate(t, out, o);
    out[o] *= this.scale; out[o + 1] *= this.scale; out[o + 2] *= this.scale;
  }
}

describe('momentum audit: healthy runs', () => {
  it(`standard human model, 60 Hz: below ${HEALTHY}`, () => {
    const { model, plan } = standardManeuver();
    const r = simulateModel(model, plan);
    expect(r.momentumResidual.relative).toBeLessThan(HEALTHY);
    expect(r.momentumResidual.peakShapeMomentum).toBeGreaterThan(1);
  });

  for (const [b, s] of [['arm-on-trunk', 'arm-cone'], ['nested-chain', 'nested-chain-maneuver']]) {
    for (const rateHz of [10, 60, 240]) {
      it(`${b} at ${rateHz} Hz: below ${HEALTHY}`, () => {
        const body = loadBody(b);
        expect(simulate(body, loadSequence(s, body), { rateHz }).momentumResidual.relative).toBeLessThan(HEALTHY);
      });
    }
  }
});

describe('momentum audit: faults in the integration', () => {
  const { model, plan } = standardManeuver();
  const times = sampleTimes(plan.duration, 60);
  const healthy = integrateAttitude(model, plan, { rtol: 1e-10, atol: 1e-10 }, times);

  it('the healthy track audits below 1e-8 (the baseline of the faults below)', () => {
    expect(auditTrack(model, plan, times, healthy.outputs).relative).toBeLessThan(HEALTHY);
  });

  // Samples in a harmonic, in the hold, at a step boundary's neighbour, and the last one.
  const picks = [[0.5, [1, 0, 0]], [1.9, [0, 1, 0]], [3.55, [0, 0, 1]], [5.2, [0.6, 0, 0.8]], [plan.duration, [0, 0.8, 0.6]]] as const;
  for (const [t, axis] of picks) {
    it(`1e-6 rad about [${axis.join(', ')}] at the sample at ${t.toFixed(2)} s raises it above ${FAULT}`, () => {
      const k = times.findIndex((s) => Math.abs(s - t) < 1e-9);
      expect(k).toBeGreaterThanOrEqual(0);
      const bad = healthy.outputs.slice();
      quatTimesExp(bad, 4 * k, axis.map((v) => v * 1e-6), 0, bad, 4 * k);
      expect(quatAngleBetween(bad.subarray(4 * k, 4 * k + 4), healthy.outputs.subarray(4 * k, 4 * k + 4))).toBeCloseTo(1e-6, 12);
      const audit = auditTrack(model, plan, times, bad);
      expect(audit.relative).toBeGreaterThan(FAULT);
      expect(Math.abs(audit.atTime - t)).toBeLessThan(0.02);
    });
  }

  it(`ω scaled by (1 + 1e-6) in the integrator raises it above ${FAULT}`, () => {
    const wrong = integrateAttitude(model, plan, { rtol: 1e-10, atol: 1e-10 }, times, new ScaledRate(model, 1 + 1e-6));
    // A subtle fault: the final attitude moves by only ~1e-6 of the rotation.
    expect(quatAngleBetween(wrong.final, healthy.final)).toBeLessThan(1e-5);
    expect(auditTrack(model, plan, times, wrong.outputs).relative).toBeGreaterThan(FAULT);
  });

  it('a sloppy integration (rtol 1e-4) shows in the audit', () => {
    const sloppy = integrateAttitude(model, plan, { rtol: 1e-4, atol: 1e-4 }, times);
    expect(auditTrack(model, plan, times, sloppy.outputs).relative).toBeGreaterThan(HEALTHY);
  });
});

describe('momentum audit: the same faults with the integrator\'s recorded nodes as the reference rate (what simulateModel runs)', () => {
  const { model, plan } = standardManeuver();
  const times = sampleTimes(plan.duration, 60);
  const nodes = new RateNodes(plan);
  const healthy = integrateAttitude(model, plan, { rtol: 1e-10, atol: 1e-10, nodes }, times);

  it('the healthy track audits below 1e-8, with no evaluations of ω by the audit', () => {
    const audit = auditTrack(model, plan, times, healthy.outputs, { reference: nodes });
    expect(audit.relative).toBeLessThan(HEALTHY);
    expect(audit.rateEvaluations).toBe(0);
    // The same peak shape momentum (differenced poses) as with the audit's own ω.
    expect(audit.peakShapeMomentum).toBeCloseTo(auditTrack(model, plan, times, healthy.outputs).peakShapeMomentum, 6);
  });

  const picks = [[0.5, [1, 0, 0]], [1.9, [0, 1, 0]], [3.55, [0, 0, 1]], [5.2, [0.6, 0, 0.8]], [plan.duration, [0, 0.8, 0.6]]] as const;
  for (const [t, axis] of picks) {
    it(`1e-6 rad about [${axis.join(', ')}] at the sample at ${t.toFixed(2)} s raises it above ${FAULT}`, () => {
      const k = times.findIndex((s) => Math.abs(s - t) < 1e-9);
      const bad = healthy.outputs.slice();
      quatTimesExp(bad, 4 * k, axis.map((v) => v * 1e-6), 0, bad, 4 * k);
      const audit = auditTrack(model, plan, times, bad, { reference: nodes });
      expect(audit.relative).toBeGreaterThan(FAULT);
      expect(Math.abs(audit.atTime - t)).toBeLessThan(0.02);
    });
  }

  it(`ω scaled by (1 + 1e-6) in the integrator, the nodes recorded by that integrator, raises it above ${FAULT}`, () => {
    const wrongNodes = new RateNodes(plan);
    const wrong = integrateAttitude(model, plan, { rtol: 1e-10, atol: 1e-10, nodes: wrongNodes }, times, new ScaledRate(model, 1 + 1e-6));
    // The track follows its (wrong) nodes exactly; the independent pose differencing sees H = I_lock·δω.
    expect(auditTrack(model, plan, times, wrong.outputs, { reference: wrongNodes }).relative).toBeGreaterThan(FAULT);
  });

  it('a sloppy integration (rtol 1e-4) shows in the audit', () => {
    const sloppyNodes = new RateNodes(plan);
    const sloppy = integrateAttitude(model, plan, { rtol: 1e-4, atol: 1e-4, nodes: sloppyNodes }, times);
    expect(auditTrack(model, plan, times, sloppy.outputs, { reference: sloppyNodes }).relative).toBeGreaterThan(HEALTHY);
  });

  it('simulateModel audits this way: the same figure', () => {
    const r = simulateModel(model, plan);
    expect(r.momentumResidual.relative).toBe(auditTrack(model, plan, times, healthy.outputs, { reference: nodes }).relative);
  });
});

describe('search mode (simulateFinal)', () => {
  const { body, sequence } = standardManeuver();

  it('gives the full run\'s final attitude to the last bit, with no samples and no audit', () => {
    const full = simulate(body, sequence);
    const fin = simulateFinal(body, sequence);
    expect(fin.final).toEqual(full.final);
    expect(fin.rangeViolations).toEqual(full.rangeViolations);
    expect(fin.peakJointRateDegS).toEqual(full.peakJointRateDegS);
    expect(fin.solver.rhsEvaluations).toBe(full.solver.rhsEvaluations);
    expect(fin.samples.frames).toEqual([]);
    expect(fin.momentumResidual.maxAbs).toBeNaN();
  });

  it('is what the planner\'s evaluation uses by default', () => {
    const out = evaluateSequence(body, sequence, [1, 0, 0, 0]);
    expect(out.result.solver.method).toMatch(/search mode/);
    expect(quatAngleBetween(quatOf(out.result.final.attitude), quatOf(simulate(body, sequence).final.attitude))).toBeLessThan(1e-7);
  });
});
