/**
 * The timeline of a compiled sequence: each step's start and end time, cycle count, and a cue in
 * words. Cues come from the composer's primitives when the maneuvers API supplies them; otherwise
 * they are written here from the engine step itself.
 */
import type { MotionStep } from '../../shared/contracts/motion.ts';
import { type Sequence, type Step, stepDuration } from '../../shared/contracts/sequence.ts';
import { DOF_LABELS, isDofName } from '../../shared/model/dof-names.ts';

/** A dof in words ("Right shoulder flexion"), or its raw name for custom bodies. */
function dofLabel(name: string): string {
  return isDofName(name) ? DOF_LABELS[name].replace(/ \(.*\)$/, '') : name;
}

/** Up to three dof labels joined, then "and N more". */
function listDofs(names: string[]): string {
  const labels = names.map(dofLabel);
  if (labels.length <= 3) return labels.join(', ');
  return `${labels.slice(0, 3).join(', ')} and ${labels.length - 3} more`;
}

const capitalise = (s: string) => s.charAt(0).toUpperCase() + s.slice(1);
const round = (v: number) => Math.round(v * 10) / 10;

/** A plain cue for one engine step (used when no primitive cue is available). */
export function fallbackCue(step: Step): string {
  if (step.kind === 'hold') return `Hold still for ${round(step.duration)} s`;
  if (step.kind === 'move') {
    const dofs = Object.keys(step.to);
    return dofs.length ? `Move into position: ${listDofs(dofs)} (${round(step.duration)} s)` : `Settle (${round(step.duration)} s)`;
  }
  if (step.kind === 'track') {
    return `Follow the recorded sweep: ${listDofs(step.dofs)} (${round((step.frames.length - 1) / step.rateHz)} s)`;
  }
  const dofs = Object.keys(step.joints);
  return `Sweep ${listDofs(dofs)}: ${round(step.cycles)} cycles of ${round(step.period)} s`;
}

/** Steps with start/end times (s) and cues; `cues[i]`, when given and non-empty, replaces step i's fallback cue. */
export function stepTimeline(sequence: Sequence, cues: readonly (string | undefined)[] = []): MotionStep[] {
  let t = 0;
  return sequence.steps.map((step, index) => {
    const start = t;
    t += stepDuration(step);
    return {
      index, kind: step.kind, start, end: t,
      cycles: step.kind === 'harmonic' ? step.cycles : null,
      period: step.kind === 'harmonic' ? step.period : null,
      cue: capitalise(cues[index]?.trim() || fallbackCue(step)),
    };
  });
}
