/**
 * Turns a candidate (phases: a family at a size with whole cycles) into composer primitives. Each
 * phase starts and ends in the reference posture (the sequence's start): a lead-in to the sweep's
 * first posture, the sweep, and a pose shift back. The way back retraces the lead-in, so a phase
 * rotates the body by (per-cycle rotation seen from the reference posture)^cycles, and the phases'
 * rotations compose as an ordered product (the geometric-phase property the search relies on).
 * Blends are slow enough for the rate limit; the lead-in is written out as a pose shift only when
 * the compiler's own blend would be too fast for it.
 */
import { harmonicAngleDeg } from '../../shared/contracts/sequence.ts';
import { MINIMUM_JERK_PEAK_SLOPE } from '../../shared/math/minimum-jerk.ts';
import { BLEND_SPEED_DEG_S, blendDurationS } from '../../shared/primitives/compile-primitives.ts';
import { primitiveMotion } from '../../shared/primitives/primitive-motion.ts';
import type { Primitive } from '../../shared/primitives/primitive-schemas.ts';
import { type PlanFamily,RATE_MARGIN } from './plan-families.ts';

/** One phase of a candidate. */
export interface CandidatePart {
  family: PlanFamily;
  /** The family's size, degrees. */
  size: number;
  /** Whole cycles (≥ 1). */
  cycles: number;
}

const ceilTo = (x: number, step: number) => Math.ceil(x / step - 1e-9) * step;

/** The joint angles a sweep starts (and, with whole cycles, ends) at, degrees. */
export function sweepStartAngles(sweep: Primitive): Record<string, number> {
  const m = primitiveMotion(sweep);
  if (m.type !== 'sweep') return {};
  const out: Record<string, number> = { ...m.fixed };
  for (const [dof, w] of Object.entries(m.waves)) out[dof] = harmonicAngleDeg(w, m.period, 0);
  return out;
}

/** Duration of a blend between the reference posture and a sweep's start that respects the rate limit, seconds. */
export function blendToSweepS(sweep: Primitive, rateLimitDegS: number): number {
  const maxDelta = Math.max(0, ...Object.values(sweepStartAngles(sweep)).map(Math.abs));
  const forRate = (MINIMUM_JERK_PEAK_SLOPE * maxDelta) / (RATE_MARGIN * rateLimitDegS);
  return Math.min(120, Math.max(blendDurationS(maxDelta), ceilTo(forRate, 0.05)));
}

/** Whether the compiler's own blend (BLEND_SPEED_DEG_S on average, ≥ 0.5 s) would exceed the rate limit. */
function compilerBlendTooFast(rateLimitDegS: number): boolean {
  return MINIMUM_JERK_PEAK_SLOPE * BLEND_SPEED_DEG_S > RATE_MARGIN * rateLimitDegS;
}

/** The composer primitives of one phase. */
export function phasePrimitives(part: CandidatePart, rateLimitDegS: number): Primitive[] {
  const sweep = part.family.build(part.size, part.cycles);
  const blendS = blendToSweepS(sweep, rateLimitDegS);
  const out: Primitive[] = [];
  if (compilerBlendTooFast(rateLimitDegS)) {
    const custom = Object.fromEntries(Object.entries(sweepStartAngles(sweep)).map(([d, v]) => [d, Math.round(v * 1e6) / 1e6]));
    out.push({ kind: 'pose_shift', posture: 'custom', custom, durationS: blendS });
  }
  out.push(sweep, { kind: 'pose_shift', posture: 'reference', durationS: blendS });
  return out;
}

/** The composer primitives of a candidate. */
export function candidatePrimitives(parts: readonly CandidatePart[], rateLimitDegS: number): Primitive[] {
  return parts.flatMap((p) => phasePrimitives(p, rateLimitDegS));
}

/** Seconds of one phase: lead-in, cycles and the way back (the compiler's lead-in when not written out). */
export function phaseDurationS(part: CandidatePart, rateLimitDegS: number): number {
  const sweep = part.family.build(part.size, part.cycles);
  const maxDelta = Math.max(0, ...Object.values(sweepStartAngles(sweep)).map(Math.abs));
  const back = blendToSweepS(sweep, rateLimitDegS);
  const lead = compilerBlendTooFast(rateLimitDegS) ? back : blendDurationS(maxDelta);
  return lead + part.cycles * part.family.periodS(part.size) + back;
}
