/**
 * The steps as a person might execute them, for the dispersion run: each sweep's amplitudes scaled
 * by (1 + amplitude error), its period by (1 + timing error), and each dof's phase shifted by its
 * own error (joints falling out of step). The blend before a sweep is retargeted to the sweep's new
 * starting angles (a short blend is inserted when there is none), so the steps still join.
 */
import { harmonicAngleDeg, type HarmonicStep, type Sequence, type Step } from '../../shared/contracts/sequence.ts';
import { MIN_BLEND_S } from '../../shared/primitives/compile-primitives.ts';

/** Errors of one sweep: relative amplitude and period errors, phase errors by dof (degrees). */
export interface SweepError {
  amplitude: number;
  period: number;
  phaseDeg: Record<string, number>;
}

/**
 * Returns a new sequence; `errorFor(k)` gives the errors of the k-th harmonic step. Steps it does
 * not change are copied shallowly (their nested values are shared with `sequence`, which nothing
 * here or downstream mutates; a blend's `to` is replaced, never written into): a robustness run
 * builds one of these per sample, so it avoids deep copies and intermediate entry arrays.
 */
export function perturbSequence(sequence: Sequence, errorFor: (sweepIndex: number, dofs: string[]) => SweepError): Sequence {
  const steps: Step[] = [];
  let sweep = 0;
  for (const step of sequence.steps) {
    if (step.kind !== 'harmonic') { steps.push({ ...step }); continue; }
    const dofs = Object.keys(step.joints);
    const e = errorFor(sweep++, dofs);
    const period = step.period * (1 + e.period);
    const joints: HarmonicStep['joints'] = {};
    const startAngles: Record<string, number> = {};
    for (const dof of dofs) {
      const j = step.joints[dof];
      const varied = { offset: j.offset, amplitude: j.amplitude * (1 + e.amplitude), phase: j.phase + (e.phaseDeg[dof] ?? 0) };
      joints[dof] = varied;
      startAngles[dof] = harmonicAngleDeg(varied, period, 0);
    }
    const prev = steps[steps.length - 1];
    if (prev?.kind === 'move') prev.to = { ...prev.to, ...startAngles };
    else steps.push({ kind: 'move', duration: MIN_BLEND_S, to: startAngles });
    steps.push({ kind: 'harmonic', period, cycles: step.cycles, joints });
  }
  return { start: { ...sequence.start }, steps };
}
