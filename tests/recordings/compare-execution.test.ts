/**
 * The rehearsal comparison on recordings made from the plan's own joint angles with a known lag,
 * amplitude and tempo: the figures it reports are the perturbations that were applied.
 */
import { describe, expect, it } from 'vitest';

import { anglesAt, compileMotion } from '../../server/engine/joint-motion.ts';
import { simulate } from '../../server/engine/simulate.ts';
import { compareExecution, recordingSequence } from '../../server/recordings/compare-execution.ts';
import { compileBody } from '../../shared/kinematics/body-model.ts';
import { quatAngleBetween } from '../../shared/math/quaternion.ts';
import { loadBody, mustSequence, quatOf } from '../engine/fixtures.ts';

const body = loadBody('arm-on-trunk');
const model = compileBody(body);
const joints = { r_sh_flex: { offset: 60, amplitude: 30, phase: 90 }, r_sh_abd: { offset: 20, amplitude: 25, phase: 0 } };
const plan = mustSequence({
  start: {},
  steps: [{ kind: 'move', duration: 1, to: { r_sh_flex: 90, r_sh_abd: 20 } }, { kind: 'harmonic', period: 1.5, cycles: 4, joints }, { kind: 'hold', duration: 0.5 }],
}, body);
const motion = compileMotion(model, plan);
const dofs = ['r_sh_flex', 'r_sh_abd'];
const ks = dofs.map((d) => model.dofIndex.get(d)!);

/** A 100 Hz recording of the plan's angles at time map(t), scaled by `gain` about each sweep's offset. */
function perturbed(map: (t: number) => number, gain: number, seconds = motion.duration) {
  const q = new Float64Array(model.dofCount);
  const frames: number[][] = [];
  for (let k = 0; k <= Math.round(seconds * 100); k++) {
    anglesAt(motion, Math.min(motion.duration, Math.max(0, map(k / 100))), q);
    frames.push(ks.map((kk, j) => {
      const deg = (q[kk] * 180) / Math.PI, o = joints[dofs[j] as keyof typeof joints].offset;
      return o + gain * (deg - o);
    }));
  }
  return { rateHz: 100, dofs, frames };
}

describe('rehearsal comparison', () => {
  it('the plan itself: lag 0, period ratio 1, amplitude ratio 1', () => {
    const [s] = compareExecution(plan, perturbed((t) => t, 1));
    expect(s.step).toBe(1);
    expect(Math.abs(s.phaseLagS)).toBeLessThan(1e-4);
    expect(s.periodRatio).toBeCloseTo(1, 5);
    expect(s.amplitudeRatio).toBeCloseTo(1, 4);
  });

  it('recovers a lag of 0.12 s and an amplitude of 85 % applied to the plan\'s joint angles', () => {
    const [s] = compareExecution(plan, perturbed((t) => t - 0.12, 0.85));
    expect(s.phaseLagS).toBeCloseTo(0.12, 3);
    expect(s.amplitudeRatio).toBeCloseTo(0.85, 3);
    expect(s.periodRatio).toBeCloseTo(1, 4);
    for (const d of s.dofs) expect(d.fitRmsDeg).toBeLessThan(0.05);
  });

  it('recovers a recording 0.2 s early (negative lag)', () => {
    const [s] = compareExecution(plan, perturbed((t) => t + 0.2, 1));
    expect(s.phaseLagS).toBeCloseTo(-0.2, 3);
  });

  it('recovers a tempo 10 % slow (period ratio 1.1) on a plan that starts with the sweep', () => {
    const sweepOnly = mustSequence({ start: { r_sh_flex: 90, r_sh_abd: 20 }, steps: [{ kind: 'harmonic', period: 1.5, cycles: 4, joints }] }, body);
    const m = compileMotion(model, sweepOnly);
    const q = new Float64Array(model.dofCount);
    const frames: number[][] = [];
    for (let k = 0; k <= 660; k++) { anglesAt(m, Math.min(m.duration, k / 100 / 1.1), q); frames.push(ks.map((kk) => (q[kk] * 180) / Math.PI)); }
    const [s] = compareExecution(sweepOnly, { rateHz: 100, dofs, frames });
    expect(s.periodRatio).toBeCloseTo(1.1, 3);
    expect(s.amplitudeRatio).toBeCloseTo(1, 3);
  });

  it('the recording simulated as a track: the plan\'s own angles reach the plan\'s attitude; a 0.12 s lag reaches a different one', () => {
    const planned = simulate(body, plan);
    const same = simulate(body, mustSequence(recordingSequence(plan, perturbed((t) => t, 1)), body));
    expect(quatAngleBetween(quatOf(same.final.attitude), quatOf(planned.final.attitude))).toBeLessThan(1e-4);
    const late = simulate(body, mustSequence(recordingSequence(plan, perturbed((t) => t - 0.12, 0.85)), body));
    expect(quatAngleBetween(quatOf(late.final.attitude), quatOf(planned.final.attitude))).toBeGreaterThan(1e-3);
  });
});
