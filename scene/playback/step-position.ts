/** Where a time falls on the step timeline: which step, and which cycle of a cyclic step. */

/** A step span on the timeline (s); cycles/period for cyclic (harmonic) steps, else null. */
export interface StepSpan {
  start: number;
  end: number;
  cycles: number | null;
  period: number | null;
  /** Where the cycles begin, s (after a lead-in); default `start`. */
  cycleStart?: number;
}

/** Index of the step holding t: the last step whose start ≤ t (0 before the first; the last at the end). */
export function stepIndexAt(steps: readonly StepSpan[], t: number): number {
  let idx = 0;
  for (let i = 0; i < steps.length; i++) if (steps[i].start <= t + 1e-9) idx = i;
  return idx;
}

/** The 1-based cycle in progress at t within a cyclic step; 0 for other steps. Allocation-free (render loop). */
export function cycleNumberAt(step: StepSpan, t: number): number {
  if (step.cycles === null || step.period === null || step.period <= 0) return 0;
  const from = step.cycleStart ?? step.start;
  // during the lead-in no cycle is under way yet
  if (t < from - 1e-9) return 0;
  const of = Math.ceil(step.cycles - 1e-9);
  return Math.min(of, Math.max(1, Math.floor((t - from) / step.period + 1e-9) + 1));
}

/** The 1-based cycle in progress at t within a cyclic step and how many there are; null for other steps. */
export function cycleAt(step: StepSpan, t: number): { cycle: number; of: number } | null {
  const cycle = cycleNumberAt(step, t);
  return cycle === 0 || step.cycles === null ? null : { cycle, of: Math.ceil(step.cycles - 1e-9) };
}
