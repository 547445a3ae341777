/**
 * The steps as a person might execute them, for the dispersion run: each sweep's amplitudes scaled
 * by (1 + amplitude error), its period by (1 + timing error), and each dof's phase shifted by its
 * own error (joints falling out of step). The blend before a sweep is retargeted to the sweep's new
 * starting angles (a short blend is inserted when there is none), so the steps still join.
 */
import { harmonicAngleDeg, type Sequence, type Step } from '../../shared/contracts/sequence.ts';
import { MIN_BLEND_S } from '../../shared/primitives/compile-primitives.ts';

/** Errors of one sweep: relative amplitude and period errors, phase errors by dof (degrees). */
export interface SweepError {
  amplitude: number;
  period: number;
  phaseDeg: Record<string, number>;
}

/** Returns a new sequence; `errorFor(k)` gives the errors of the k-th harmonic step. */
export function perturbSequence(sequence: Sequence, errorFor: (sweepIndex: number, dofs: string[]) => SweepError): Sequence {
  const steps: Step[] = [];
  let sweep = 0;
  for (const step of sequence.steps) {
    if (step.kind !== 'harmonic') { steps.push(structuredClone(step)); continue; }
    const e = errorFor(sweep++, Object.keys(step.joints));
    const period = step.period * (1 + e.period);
    const joints = Object.fromEntries(Object.entries(step.joints).map(([dof, j]) => [dof, {
      offset: j.offset, amplitude: j.amplitude * (1 + e.amplitude), phase: j.phase + (e.phaseDeg[dof] ?? 0),
    }]));
    const startAngles = Object.fromEntries(Object.entries(joints).map(([dof, j]) => [dof, harmonicAngleDeg(j, period, 0)]));
    const prev = steps[steps.length - 1];
    if (prev?.kind === 'move') prev.to = { ...prev.to, ...startAngles };
    else steps.push({ kind: 'move', duration: MIN_BLEND_S, to: startAngles });
    steps.push({ kind: 'harmonic', period, cycles: step.cycles, joints });
  }
  return { start: { ...sequence.start }, steps };
}
