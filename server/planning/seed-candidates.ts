/**
 * Seeding: per-cycle rotations of every family at a few amplitudes, composed as quaternion powers
 * and products, pick whole cycle counts (and a starting amplitude) for one family or an ordered
 * pair of families (e.g. a pitch family then a yaw family for a two-axis target). Cheap: no
 * simulation beyond one cycle per family and amplitude.
 */
import type { Body } from '../../shared/contracts/body.ts';
import { quatAngleBetween, quatMultiply, type Quat } from '../../shared/math/quaternion.ts';
import { compilePrimitives, dofInfoFromBody } from '../../shared/primitives/compile-primitives.ts';
import { candidatePrimitives, type CandidatePart } from './candidate-steps.ts';
import { perCycleRotation, quatPower } from './per-cycle-rotation.ts';
import { clampAmplitudes, type PlanFamily } from './plan-families.ts';

const DEG = 180 / Math.PI;

/** Amplitude levels tried per family, as multiples of its starting amplitudes. */
export const AMPLITUDE_LEVELS = [0.5, 1, 1.6] as const;
/** Most cycles of one sweep the seeding considers. */
export const MAX_SEED_CYCLES = 40;
/** Seconds of duration traded for one degree of seed error beyond tolerance (ranking weight). */
const SECONDS_PER_DEGREE = 10;

/** One family at one amplitude: its per-cycle rotation and time costs. */
export interface FamilyLevel {
  family: PlanFamily;
  amplitudes: number[];
  /** Per-cycle rotation [w,x,y,z]. */
  rotation: Quat;
  /** Seconds per cycle. */
  cycleS: number;
  /** Lead-in and return time, seconds. */
  overheadS: number;
  /** rotation^n for n = 0…MAX_SEED_CYCLES. */
  powers: Quat[];
}

/** A seed: parts with cycle counts, the composed error and the expected duration. */
export interface Seed {
  parts: CandidatePart[];
  /** Angle between the composed per-cycle rotations and the target, degrees. */
  errorDeg: number;
  durationS: number;
  score: number;
}

/** Per-cycle rotations of every family at every amplitude level. */
export function familyLevels(body: Body, families: readonly PlanFamily[], rateLimitDegS: number): FamilyLevel[] {
  const dofs = dofInfoFromBody(body);
  const out: FamilyLevel[] = [];
  for (const family of families) {
    for (const level of AMPLITUDE_LEVELS) {
      const amplitudes = clampAmplitudes(family, family.params.map((p) => p.initial * level));
      const rotation = perCycleRotation(body, family, amplitudes, rateLimitDegS);
      const one = candidatePrimitives([{ family, amplitudes, cycles: 1 }], rateLimitDegS);
      const sweep = one[0] as { periodS: number };
      const total = compilePrimitives(one, dofs).durationS;
      const powers: Quat[] = [[1, 0, 0, 0]];
      for (let n = 1; n <= MAX_SEED_CYCLES; n++) powers.push(quatMultiply(powers[n - 1], rotation, [0, 0, 0, 0]));
      out.push({ family, amplitudes, rotation, cycleS: sweep.periodS, overheadS: total - sweep.periodS, powers });
    }
  }
  return out;
}

/**
 * The best seed of every structure (one family, or an ordered pair of different families), by
 * score = duration + 10 s per degree of error beyond the tolerance (+ the same per second over budget).
 */
export function seedCandidates(levels: readonly FamilyLevel[], target: Quat, opts: { toleranceDeg: number; timeBudgetS: number | null }): Seed[] {
  const best = new Map<string, Seed>();
  const consider = (key: string, parts: CandidatePart[], q: Quat, durationS: number) => {
    const errorDeg = quatAngleBetween(q, target) * DEG;
    const over = opts.timeBudgetS === null ? 0 : Math.max(0, durationS - opts.timeBudgetS);
    const score = durationS + SECONDS_PER_DEGREE * (Math.max(0, errorDeg - opts.toleranceDeg) + over);
    const prev = best.get(key);
    if (!prev || score < prev.score) best.set(key, { parts, errorDeg, durationS, score });
  };
  const tmp: Quat = [0, 0, 0, 0];
  for (const a of levels) {
    for (let n = 1; n <= MAX_SEED_CYCLES; n++) {
      consider(a.family.id, [{ family: a.family, amplitudes: a.amplitudes, cycles: n }], a.powers[n], a.overheadS + n * a.cycleS);
    }
  }
  for (const a of levels) {
    for (const b of levels) {
      if (a.family === b.family) continue;
      const key = `${a.family.id}+${b.family.id}`;
      for (let n = 1; n <= MAX_SEED_CYCLES; n++) {
        for (let m = 1; m <= MAX_SEED_CYCLES; m++) {
          quatMultiply(a.powers[n], b.powers[m], tmp);
          const errorDeg = quatAngleBetween(tmp, target) * DEG;
          const durationS = a.overheadS + n * a.cycleS + b.overheadS + m * b.cycleS;
          // Cheap pre-check before allocating the parts.
          const prev = best.get(key);
          const over = opts.timeBudgetS === null ? 0 : Math.max(0, durationS - opts.timeBudgetS);
          const score = durationS + SECONDS_PER_DEGREE * (Math.max(0, errorDeg - opts.toleranceDeg) + over);
          if (prev && score >= prev.score) continue;
          consider(key, [
            { family: a.family, amplitudes: a.amplitudes, cycles: n },
            { family: b.family, amplitudes: b.amplitudes, cycles: m },
          ], [...tmp], durationS);
        }
      }
    }
  }
  return [...best.values()].sort((x, y) => x.score - y.score);
}

/** The composed rotation of seed parts from a table of levels (for checks): Π rotation_i^cycles_i. */
export function composedRotation(rotations: readonly Quat[], cycles: readonly number[]): Quat {
  let q: Quat = [1, 0, 0, 0];
  rotations.forEach((r, i) => { q = quatMultiply(q, quatPower(r, cycles[i]), [0, 0, 0, 0]); });
  return q;
}
