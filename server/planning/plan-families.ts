/**
 * The limb-sweep families the planner composes from, fitted to one body. Each family is one
 * composer primitive with a single size (its main amplitude, degrees) and two variants that travel
 * the loop in opposite senses (their per-cycle rotations are close to inverse). Centres, secondary
 * amplitudes and periods follow from the body's own joint ranges (its suit's included) and the
 * rate limit, so every size the planner may pick keeps every moving dof at least RANGE_MARGIN_DEG
 * inside its range and every joint under the rate limit.
 *
 * Families, by the axis they mainly turn the body about (measured, not assumed: see the planner's
 * tables):
 * - `hanging_arm_circles` (yaw): both arms hanging, circling the same way round;
 * - `hip_swirl` (yaw): legs together and straight, circling at the hips;
 * - `forward_arm_circles` (pitch): both arms forward, circling as mirror images;
 * - `leg_pedal` (pitch): both legs pedalling together;
 * - `forward_arm_twin_circles` (roll): both arms forward, circling the same way round.
 */
import type { Body } from '../../shared/contracts/body.ts';
import { primitiveMotion } from '../../shared/primitives/primitive-motion.ts';
import { type Primitive, primitiveSchema } from '../../shared/primitives/primitive-schemas.ts';

/** Smallest distance a moving dof keeps from either end of its range, degrees. */
export const RANGE_MARGIN_DEG = 3;
/** Fraction of the rate limit sweeps and blends aim at (a margin for the person). */
export const RATE_MARGIN = 0.9;

/** Range of one dof, degrees. */
export interface DofRange { min: number; max: number }
/** Ranges by dof name. */
export type RangeMap = Record<string, DofRange>;

/** Ranges of a body's dofs. */
export function bodyRanges(body: Body): RangeMap {
  const out: RangeMap = {};
  for (const s of body.segments) for (const d of s.joint?.dofs ?? []) out[d.name] = { min: d.min, max: d.max };
  return out;
}

/** A sweep without cycles and period (set per candidate). */
type SweepShape = Omit<Extract<Primitive, { cycles: number }>, 'cycles' | 'periodS'>;

/** How a family builds its sweep from a size and a variant (0 or 1), on a body's ranges. */
interface FamilySpec {
  group: string;
  /** Main axis the family turns the body about (documentation and ranking hints only). */
  axis: 'yaw' | 'pitch' | 'roll';
  variants: readonly [string, string];
  /** Smallest size the primitive's schema allows, and the largest the planner uses (comfort), degrees. */
  minSize: number;
  maxSize: number;
  /** Shortest period, seconds (a person's comfortable pace). */
  minPeriodS: number;
  make(size: number, variant: 0 | 1, r: RangeMap): SweepShape | null;
}

const clamp = (x: number, lo: number, hi: number) => Math.min(hi, Math.max(lo, x));
const lowest = (r: RangeMap, a: string, b: string) => Math.max(r[a]?.min ?? -180, r[b]?.min ?? -180);
const highest = (r: RangeMap, a: string, b: string) => Math.min(r[a]?.max ?? 180, r[b]?.max ?? 180);
const M = RANGE_MARGIN_DEG;

const SPECS: readonly FamilySpec[] = [
  {
    group: 'hanging_arm_circles', axis: 'yaw', variants: ['hanging_arm_circles_out', 'hanging_arm_circles_in'], minSize: 4, maxSize: 30, minPeriodS: 1.2,
    make: (h, v, r) => {
      // Centre as low as the flexion range allows (a cone about the long axis turns the body about it).
      const flex = Math.max(0, lowest(r, 'l_sh_flex', 'r_sh_flex') + M + h);
      if (flex > 30) return null;
      return { kind: 'arm_orbit', arms: 'both', pairing: 'same_way', centre: 'custom', centreFlexDeg: flex, centreAbdDeg: h + M, halfAngleDeg: h, travel: v ? 'inward' : 'outward' };
    },
  },
  {
    group: 'hip_swirl', axis: 'yaw', variants: ['hip_swirl_left', 'hip_swirl_right'], minSize: 3, maxSize: 25, minPeriodS: 1.6,
    make: (h, v, r) => ({
      kind: 'hip_swirl', halfAngleDeg: h, turn: v ? 'to_right' : 'to_left',
      centreFlexDeg: clamp(20, Math.max(-15, lowest(r, 'l_hip_flex', 'r_hip_flex') + M + h), highest(r, 'l_hip_flex', 'r_hip_flex') - M - h),
    }),
  },
  {
    group: 'forward_arm_circles', axis: 'pitch', variants: ['forward_arm_circles_out', 'forward_arm_circles_in'], minSize: 4, maxSize: 40, minPeriodS: 1.2,
    make: (h, v, r) => ({
      kind: 'arm_orbit', arms: 'both', pairing: 'mirror', centre: 'custom', halfAngleDeg: h, travel: v ? 'inward' : 'outward',
      centreFlexDeg: clamp(90, lowest(r, 'l_sh_flex', 'r_sh_flex') + M + h, highest(r, 'l_sh_flex', 'r_sh_flex') - M - h), centreAbdDeg: h + M,
    }),
  },
  {
    group: 'leg_pedal', axis: 'pitch', variants: ['leg_pedal_forward', 'leg_pedal_backward'], minSize: 5, maxSize: 35, minPeriodS: 1.6,
    make: (h, v, r) => {
      const knee = Math.min(1.2 * h, 50);
      return {
        kind: 'leg_pedal', legs: 'both', pattern: 'together', direction: v ? 'backward' : 'forward', hipSwingDeg: h, kneeSwingDeg: knee,
        hipCentreDeg: clamp(35, Math.max(-15, lowest(r, 'l_hip_flex', 'r_hip_flex') + M + h), highest(r, 'l_hip_flex', 'r_hip_flex') - M - h),
        kneeCentreDeg: Math.max(0, lowest(r, 'l_knee_flex', 'r_knee_flex') + M + knee),
      };
    },
  },
  ...(['left', 'right'] as const).map((side): FamilySpec => ({
    // One leg pedalling: timing errors between its hip and knee change the loop's size, not its
    // sense, so the turn stays about the same axis (both legs pedalling drift when they fall out of step).
    group: `${side}_leg_pedal`, axis: 'pitch', variants: [`${side}_leg_pedal_forward`, `${side}_leg_pedal_backward`], minSize: 5, maxSize: 35, minPeriodS: 1.6,
    make: (h, v, r) => {
      const knee = Math.min(1.2 * h, 50);
      const hip = side === 'left' ? 'l_hip_flex' : 'r_hip_flex', kn = side === 'left' ? 'l_knee_flex' : 'r_knee_flex';
      return {
        kind: 'leg_pedal', legs: side, pattern: 'together', direction: v ? 'backward' : 'forward', hipSwingDeg: h, kneeSwingDeg: knee,
        hipCentreDeg: clamp(35, Math.max(-15, (r[hip]?.min ?? -15) + M + h), (r[hip]?.max ?? 120) - M - h),
        kneeCentreDeg: Math.max(0, (r[kn]?.min ?? 0) + M + knee),
      };
    },
  })),
  {
    group: 'forward_arm_twin_circles', axis: 'roll', variants: ['forward_arm_twin_circles_out', 'forward_arm_twin_circles_in'], minSize: 4, maxSize: 40, minPeriodS: 1.2,
    make: (h, v, r) => ({
      kind: 'arm_orbit', arms: 'both', pairing: 'same_way', centre: 'custom', halfAngleDeg: h, travel: v ? 'inward' : 'outward',
      centreFlexDeg: clamp(90, lowest(r, 'l_sh_flex', 'r_sh_flex') + M + h, highest(r, 'l_sh_flex', 'r_sh_flex') - M - h), centreAbdDeg: h + M,
    }),
  },
];

/** Every family group's id. */
export const FAMILY_GROUPS = SPECS.map((s) => s.group);

/** A family variant fitted to one body and rate limit. */
export interface PlanFamily {
  /** Variant id, e.g. `hip_swirl_left`. */
  id: string;
  /** Family id shared by both variants, e.g. `hip_swirl`. */
  group: string;
  /** 0 or 1: the two senses of travel. */
  variant: 0 | 1;
  axis: FamilySpec['axis'];
  /** Legal sizes on this body, degrees (minSize ≤ maxSize). */
  minSize: number;
  maxSize: number;
  /** The sweep at a size with whole cycles; its period keeps every joint under the rate limit. */
  build(size: number, cycles: number): Primitive;
  /** Seconds per cycle at a size. */
  periodS(size: number): number;
}

/** Why a family cannot be used on a body. */
export interface FamilyUnavailable { group: string; reason: string }

/** Whether every moving dof stays RANGE_MARGIN_DEG inside its range and held dofs inside theirs. */
export function sweepWithinRanges(p: Primitive, r: RangeMap): { ok: true } | { ok: false; reason: string } {
  const m = primitiveMotion(p);
  if (m.type !== 'sweep') return { ok: true };
  for (const [dof, w] of Object.entries(m.waves)) {
    const range = r[dof];
    if (!range) return { ok: false, reason: `the body has no dof ${dof}` };
    const a = Math.abs(w.amplitude);
    if (w.offset - a < range.min + M - 1e-9) return { ok: false, reason: `${dof} would go below ${range.min + M}° (its minimum ${range.min}° plus a ${M}° margin)` };
    if (w.offset + a > range.max - M + 1e-9) return { ok: false, reason: `${dof} would go above ${range.max - M}° (its maximum ${range.max}° minus a ${M}° margin)` };
  }
  for (const [dof, v] of Object.entries(m.fixed)) {
    const range = r[dof];
    if (!range) return { ok: false, reason: `the body has no dof ${dof}` };
    if (v < range.min || v > range.max) return { ok: false, reason: `${dof} must be held at ${v}°, outside its range ${range.min}…${range.max}°` };
  }
  return { ok: true };
}

/** Largest joint amplitude of a sweep, degrees (the rate bound is 2π·A/T per dof). */
function peakAmplitude(p: Primitive): number {
  const m = primitiveMotion(p);
  return m.type === 'sweep' ? Math.max(...Object.values(m.waves).map((w) => Math.abs(w.amplitude))) : 0;
}

const ceilTo = (x: number, step: number) => Math.ceil(x / step - 1e-9) * step;
const SIZE_STEP = 0.25;

/** The families usable on `body` under `rateLimitDegS`, and why the others are not. */
export function fitFamilies(body: Body, rateLimitDegS: number, groups: readonly string[] = FAMILY_GROUPS): { families: PlanFamily[]; unavailable: FamilyUnavailable[] } {
  const r = bodyRanges(body);
  const families: PlanFamily[] = [];
  const unavailable: FamilyUnavailable[] = [];
  for (const spec of SPECS.filter((s) => groups.includes(s.group))) {
    const legal = (size: number, v: 0 | 1): string | null => {
      const shape = spec.make(size, v, r);
      if (!shape) return 'no centre of the sweep fits the ranges';
      const p = { ...shape, cycles: 1, periodS: 2 } as Primitive;
      const w = sweepWithinRanges(p, r);
      if (!w.ok) return w.reason;
      const parsed = primitiveSchema.safeParse(p);
      if (!parsed.success) {
        const field = String(parsed.error.issues[0]?.path.join('.') ?? 'a field');
        return `its ${field} would be ${String((p as Record<string, unknown>)[field])}, outside what the step allows`;
      }
      return null;
    };
    // Largest legal size for both variants, scanning down from the comfort maximum.
    let max = 0, why = '';
    for (let s = spec.maxSize; s >= spec.minSize - 1e-9; s -= SIZE_STEP) {
      const a = legal(s, 0) ?? legal(s, 1);
      if (a === null) { max = s; break; }
      if (!why) why = a;
    }
    if (max === 0) { unavailable.push({ group: spec.group, reason: `even the smallest ${spec.group.replaceAll('_', ' ')} breaks a range: ${why}` }); continue; }
    ([0, 1] as const).forEach((variant) => {
      const periodS = (size: number) => {
        const shape = spec.make(size, variant, r)!;
        const needed = (2 * Math.PI * peakAmplitude({ ...shape, cycles: 1, periodS: 2 } as Primitive)) / (RATE_MARGIN * rateLimitDegS);
        return Math.min(30, Math.max(spec.minPeriodS, ceilTo(needed, 0.05)));
      };
      families.push({
        id: spec.variants[variant], group: spec.group, variant, axis: spec.axis, minSize: spec.minSize, maxSize: max,
        periodS,
        build: (size, cycles) => {
          const s = clamp(size, spec.minSize, max);
          return { ...spec.make(s, variant, r)!, cycles, periodS: periodS(s) } as Primitive;
        },
      });
    });
  }
  return { families, unavailable };
}
