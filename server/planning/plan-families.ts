/**
 * The primitive families the planner composes from: each is one composer primitive (the real
 * schemas of shared/primitives) with its continuous amplitude parameters exposed for refinement,
 * their schema bounds, and a default period. Cycle counts and periods are set per candidate.
 */
import {
  armLoopSchema, armOrbitSchema, defaultPrimitive, hipSwirlSchema, legPedalSchema,
  type ArmLoop, type ArmOrbit, type HipSwirl, type LegPedal, type Primitive,
} from '../../shared/primitives/primitive-schemas.ts';

/** One continuous parameter of a family: its name in the primitive, bounds and starting value, degrees. */
export interface AmplitudeParam {
  key: string;
  min: number;
  max: number;
  initial: number;
}

/** A family: builds its sweep primitive from amplitudes (same order as `params`), cycles and period. */
export interface PlanFamily {
  /** Stable id, e.g. `hip_swirl_left`. */
  id: string;
  params: AmplitudeParam[];
  /** Default seconds per cycle (the period is lengthened when the rate limit needs it). */
  periodS: number;
  /** Shortest period the schema allows, seconds. */
  minPeriodS: number;
  build(amplitudes: readonly number[], cycles: number, periodS: number): Primitive;
  /** Largest joint amplitude of the sweep for given amplitudes, degrees (for the rate bound 2π·A/T). */
  peakAmplitudeDeg(amplitudes: readonly number[]): number;
}

/** Bounds of a numeric schema field (zod 4 exposes minValue/maxValue on number schemas). */
function bounds(schema: { shape: Record<string, unknown> }, key: string): { min: number; max: number } {
  const f = schema.shape[key] as { minValue: number | null; maxValue: number | null };
  return { min: f.minValue ?? 0, max: f.maxValue ?? 360 };
}

function param(schema: { shape: Record<string, unknown> }, key: string, initial: number): AmplitudeParam {
  return { key, ...bounds(schema, key), initial };
}

const MIN_PERIOD_S = 0.3;

function armOrbit(travel: ArmOrbit['travel']): PlanFamily {
  const d = defaultPrimitive('arm_orbit') as ArmOrbit;
  return {
    id: `arm_orbit_${travel}`,
    params: [param(armOrbitSchema, 'halfAngleDeg', d.halfAngleDeg)],
    periodS: d.periodS,
    minPeriodS: MIN_PERIOD_S,
    build: ([h], cycles, periodS) => ({ ...d, travel, halfAngleDeg: h, cycles, periodS }),
    peakAmplitudeDeg: ([h]) => h,
  };
}

function armLoop(plane: ArmLoop['plane'], bendOn: ArmLoop['bendOn'], arms: ArmLoop['arms'] = 'both'): PlanFamily {
  const d = defaultPrimitive('arm_loop') as ArmLoop;
  const side = arms === 'both' ? '' : `_${arms}`;
  return {
    id: `arm_loop_${plane}_${bendOn === 'forward_swing' ? 'fwd' : 'ret'}${side}`,
    params: [param(armLoopSchema, 'swingDeg', d.swingDeg), param(armLoopSchema, 'elbowDeg', d.elbowDeg)],
    periodS: d.periodS,
    minPeriodS: MIN_PERIOD_S,
    build: ([swing, elbow], cycles, periodS) => ({ ...d, arms, plane, bendOn, swingDeg: swing, elbowDeg: elbow, cycles, periodS }),
    peakAmplitudeDeg: ([swing, elbow]) => Math.max(swing, elbow),
  };
}

function legPedal(direction: LegPedal['direction']): PlanFamily {
  const d = defaultPrimitive('leg_pedal') as LegPedal;
  return {
    id: `leg_pedal_${direction}`,
    params: [param(legPedalSchema, 'hipSwingDeg', d.hipSwingDeg), param(legPedalSchema, 'kneeSwingDeg', d.kneeSwingDeg)],
    periodS: d.periodS,
    minPeriodS: MIN_PERIOD_S,
    build: ([hip, knee], cycles, periodS) => ({ ...d, direction, hipSwingDeg: hip, kneeSwingDeg: knee, cycles, periodS }),
    peakAmplitudeDeg: ([hip, knee]) => Math.max(hip, knee),
  };
}

function hipSwirl(turn: HipSwirl['turn']): PlanFamily {
  const d = defaultPrimitive('hip_swirl') as HipSwirl;
  return {
    id: `hip_swirl_${turn === 'to_left' ? 'left' : 'right'}`,
    params: [param(hipSwirlSchema, 'halfAngleDeg', d.halfAngleDeg)],
    periodS: d.periodS,
    minPeriodS: MIN_PERIOD_S,
    build: ([h], cycles, periodS) => ({ ...d, turn, halfAngleDeg: h, cycles, periodS }),
    peakAmplitudeDeg: ([h]) => h,
  };
}

/**
 * Every family the planner may use: arm orbits (both arms, outward / inward), leg pedal (both
 * legs alternating, forward / backward), hip swirl (to the left / right), arm loops in each plane
 * with both arms (either bend phase), and single-arm side-plane loops (the only roll sources).
 */
export const PLAN_FAMILIES: readonly PlanFamily[] = [
  armOrbit('outward'), armOrbit('inward'),
  legPedal('forward'), legPedal('backward'),
  hipSwirl('to_left'), hipSwirl('to_right'),
  armLoop('sagittal', 'forward_swing'), armLoop('sagittal', 'return_swing'),
  armLoop('frontal', 'forward_swing'), armLoop('frontal', 'return_swing'),
  armLoop('horizontal', 'forward_swing'), armLoop('horizontal', 'return_swing'),
  armLoop('frontal', 'forward_swing', 'right'), armLoop('frontal', 'forward_swing', 'left'),
];

/** Family by id (throws on an unknown id: a programming error). */
export function planFamily(id: string): PlanFamily {
  const f = PLAN_FAMILIES.find((x) => x.id === id);
  if (!f) throw new Error(`unknown planner family '${id}'`);
  return f;
}

/** Clamps amplitudes into their bounds. */
export function clampAmplitudes(family: PlanFamily, amplitudes: readonly number[]): number[] {
  return family.params.map((p, i) => Math.min(p.max, Math.max(p.min, amplitudes[i])));
}
