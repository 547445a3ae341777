/**
 * Turns a candidate (families with amplitudes and whole cycle counts) into composer primitives:
 * each sweep is followed by a pose shift back to the reference posture, the sequence's start. Every
 * sweep therefore starts and ends in the same posture, so the rotation of the whole list is the
 * product of each sweep's rotation (the geometric-phase property the seeding relies on).
 */
import { blendDurationS } from '../../shared/primitives/compile-primitives.ts';
import { primitiveMotion } from '../../shared/primitives/primitive-motion.ts';
import type { Primitive } from '../../shared/primitives/primitive-schemas.ts';
import { harmonicAngleDeg } from '../../shared/contracts/sequence.ts';
import { clampAmplitudes, type PlanFamily } from './plan-families.ts';

/** One sweep of a candidate. */
export interface CandidatePart {
  family: PlanFamily;
  /** Amplitudes in the family's parameter order, degrees. */
  amplitudes: number[];
  /** Whole cycles (≥ 1). */
  cycles: number;
}

/** Fraction of the rate limit the planner aims at for sweeps and return blends (margin for the person). */
export const RATE_MARGIN = 0.9;
/** Peak speed of a minimum-jerk blend relative to its average, 15/8 (Flash & Hogan 1985). */
const MIN_JERK_PEAK_RATIO = 1.875;

const ceilTo = (x: number, step: number) => Math.ceil(x / step - 1e-9) * step;

/** Seconds per cycle: the family's default, lengthened so the peak sweep rate 2π·A/T stays within the limit. */
export function sweepPeriodS(family: PlanFamily, amplitudes: readonly number[], rateLimitDegS: number): number {
  const needed = (2 * Math.PI * family.peakAmplitudeDeg(amplitudes)) / (RATE_MARGIN * rateLimitDegS);
  return Math.min(30, Math.max(family.minPeriodS, family.periodS, ceilTo(needed, 0.05)));
}

/** Duration of the return blend from a sweep's end posture to the reference posture, seconds. */
export function returnDurationS(sweep: Primitive, rateLimitDegS: number): number {
  const m = primitiveMotion(sweep);
  if (m.type !== 'sweep') return 0.5;
  let maxDelta = 0;
  for (const v of Object.values(m.fixed)) maxDelta = Math.max(maxDelta, Math.abs(v));
  for (const w of Object.values(m.waves)) maxDelta = Math.max(maxDelta, Math.abs(harmonicAngleDeg(w, m.period, m.cycles * m.period)));
  const forRate = (MIN_JERK_PEAK_RATIO * maxDelta) / (RATE_MARGIN * rateLimitDegS);
  return Math.min(120, Math.max(blendDurationS(maxDelta), ceilTo(forRate, 0.05)));
}

/** The composer primitives of a candidate. */
export function candidatePrimitives(parts: readonly CandidatePart[], rateLimitDegS: number): Primitive[] {
  const out: Primitive[] = [];
  for (const part of parts) {
    const amplitudes = clampAmplitudes(part.family, part.amplitudes);
    const sweep = part.family.build(amplitudes, part.cycles, sweepPeriodS(part.family, amplitudes, rateLimitDegS));
    out.push(sweep, { kind: 'pose_shift', posture: 'reference', durationS: returnDurationS(sweep, rateLimitDegS) });
  }
  return out;
}
