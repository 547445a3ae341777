/**
 * The planner's search. Phases start and end in the reference posture, so a candidate's rotation
 * is the ordered product of per-cycle rotations raised to whole cycle counts. The search therefore
 * simulates only single cycles:
 * 1. tables: each family's per-cycle rotation at a few legal sizes (rotation vector, interpolated
 *    in size² between them, as a loop's effect grows with its area);
 * 2. structures: every ordered choice of one to three families (consecutive ones differ); the
 *    signed angle each must turn about its own axis is solved by bounded least squares
 *    (Levenberg–Marquardt, ml-levenberg-marquardt) from several starts, keeping the shortest;
 * 3. cycles: whole counts with a capped per-cycle rotation; every phase ends with a trim of small
 *    cycles (its whole angle when that is small), so a crew member can stop or add cycles about
 *    each axis from what they see: a stop one large cycle off would leave several degrees;
 * 4. refinement: the sizes of the last three phases' parts by least squares again, now with
 *    simulated cycles, until the composed rotation meets the target.
 */
import { levenbergMarquardt } from 'ml-levenberg-marquardt';

import type { Body } from '../../shared/contracts/body.ts';
import { type Quat, quatAngleBetween } from '../../shared/math/quaternion.ts';
import { type CandidatePart, phaseDurationS } from './candidate-steps.ts';
import { perCycleRotation } from './per-cycle-rotation.ts';
import type { PlanFamily } from './plan-families.ts';
import { quatChain, quatConj, quatExp, quatIntPower, quatLog, type RotVec } from './rotation-vector.ts';

const DEG = 180 / Math.PI;

/** Largest per-cycle rotation of the final (trim) phase, degrees: small enough to stop on from what one sees. */
export const TRIM_MAX_DEG = 2;
/** Fewest cycles of the trim phase (room to stop early or add cycles). */
export const TRIM_MIN_CYCLES = 4;
/** Largest per-cycle rotation of any other phase, degrees (bounds what a stop one cycle off can cost). */
export const PHASE_MAX_DEG = 8;
/**
 * Largest factor by which the refinement may grow or shrink a size (a loop's rotation goes about
 * with its size squared): enough to take up the tables' interpolation error, small enough that a
 * trim keeps the per-cycle rotation it was sized for (give or take a quarter) and so its room to
 * stop early or add cycles.
 */
const SIZE_GROWTH = 1.12;
/** Sizes measured per family, as fractions of its legal range. */
const TABLE_FRACTIONS = [0, 0.3, 0.55, 0.8, 1] as const;

/** Limits the search respects. */
export interface SearchLimits {
  toleranceDeg: number;
  rateLimitDegS: number;
  timeBudgetS: number | null;
}

/** One family's measured per-cycle rotations. */
export interface FamilyTable {
  family: PlanFamily;
  sizes: number[];
  /** Rotation vectors, radians. */
  rotations: RotVec[];
}

/** A structure's solution before refinement. */
export interface SearchSeed {
  parts: CandidatePart[];
  /** Sum of |angle| the phases turn, degrees (the rotation travelled net of each cycle's wobble). */
  netAngleDeg: number;
  estimatedDurationS: number;
  /** Error of the composed table rotations, degrees. */
  tableErrorDeg: number;
  /** Whether every phase ends in a trim (else only the last: a shorter fallback for a time budget). */
  everyPhaseTrimmed: boolean;
}

/** Measures every family at its table sizes. */
export function familyTables(body: Body, families: readonly PlanFamily[], rateLimitDegS: number): FamilyTable[] {
  return families.map((family) => {
    const sizes = [...new Set(TABLE_FRACTIONS.map((f) => family.minSize + f * (family.maxSize - family.minSize)))];
    return { family, sizes, rotations: sizes.map((s) => quatLog(perCycleRotation(body, family, s, rateLimitDegS))) };
  });
}

/** Interpolated per-cycle rotation vector at a size (linear in size², radians). */
export function tableRotation(t: FamilyTable, size: number): RotVec {
  const u = size * size;
  const us = t.sizes.map((s) => s * s);
  let k = 0;
  while (k < us.length - 2 && u > us[k + 1]) k++;
  const lo = us[k], hi = us[k + 1] ?? lo;
  const f = hi > lo ? (u - lo) / (hi - lo) : 0;
  const a = t.rotations[k], b = t.rotations[k + 1] ?? a;
  return [a[0] + f * (b[0] - a[0]), a[1] + f * (b[1] - a[1]), a[2] + f * (b[2] - a[2])];
}

const norm = (v: ArrayLike<number>) => Math.hypot(v[0], v[1], v[2]);
const unit = (v: RotVec): RotVec => { const n = norm(v) || 1; return [v[0] / n, v[1] / n, v[2] / n]; };

/** The size at which a family turns `angleRad` per cycle (bisection on the table; clamped to its range). */
export function sizeForAngle(t: FamilyTable, angleRad: number): number {
  let lo = t.family.minSize, hi = t.family.maxSize;
  if (norm(tableRotation(t, hi)) <= angleRad) return hi;
  if (norm(tableRotation(t, lo)) >= angleRad) return lo;
  for (let k = 0; k < 40; k++) {
    const mid = (lo + hi) / 2;
    if (norm(tableRotation(t, mid)) < angleRad) lo = mid; else hi = mid;
  }
  return (lo + hi) / 2;
}

/** Least squares over `x0` (bounded) of a 3-vector residual; returns the best parameters and the residual norm. */
export function leastSquares3(residual: (x: number[]) => number[], x0: number[], lo: number[], hi: number[], opts: { step: number; iterations: number; tolerance: number }): { x: number[]; norm: number } {
  const cache = new Map<string, number[]>();
  const r = (x: number[]) => {
    const key = x.join(',');
    let v = cache.get(key);
    if (!v) { v = residual(x); cache.set(key, v); }
    return v;
  };
  const fit = levenbergMarquardt({ x: [0, 1, 2], y: [0, 0, 0] }, (p) => (i) => r(p)[i], {
    initialValues: x0, minValues: lo, maxValues: hi, gradientDifference: opts.step, centralDifference: false,
    maxIterations: opts.iterations, errorTolerance: opts.tolerance ** 2, damping: 1e-2,
  });
  const best = [x0, fit.parameterValues].map((x) => ({ x, n: norm(r(x)) })).sort((a, b) => a.n - b.n)[0];
  return { x: best.x, norm: best.n };
}

/** Per-group tables by variant (0: positive angles about the group's axis, 1: negative). */
interface Group { id: string; tables: [FamilyTable, FamilyTable]; axis: RotVec; maxCycleRad: number }

function groupsOf(tables: readonly FamilyTable[]): Group[] {
  const byGroup = new Map<string, FamilyTable[]>();
  for (const t of tables) byGroup.set(t.family.group, [...(byGroup.get(t.family.group) ?? []), t]);
  const out: Group[] = [];
  for (const [id, ts] of byGroup) {
    const a = ts.find((t) => t.family.variant === 0), b = ts.find((t) => t.family.variant === 1);
    if (!a || !b) continue;
    const ra = tableRotation(a, a.family.maxSize);
    out.push({ id, tables: [a, b], axis: unit(ra), maxCycleRad: Math.min(norm(ra), norm(tableRotation(b, b.family.maxSize))) });
  }
  return out;
}

/**
 * Angles (rad) each group of a structure turns about its axis so that their product is the target.
 * A first pass treats a group's two variants as turning about one axis in opposite senses; a loop
 * run backwards is not the exact inverse of the loop (its second-order terms keep their sign, e.g.
 * a drift about another axis that both senses share), so a second pass re-solves with each
 * variant's own axis, for every choice of senses.
 */
function solveAngles(structure: readonly Group[], target: Quat): { angles: number[]; errorRad: number } {
  const first = solveSymmetric(structure, target);
  const tInv = quatConj(target);
  // Each variant's own axis; every sign pattern (at most 2³), started from the first pass's sizes.
  const axisOf = (g: Group, sign: number) => { const v = sign > 0 ? g.tables[0] : g.tables[1]; return unit(tableRotation(v, v.family.maxSize)); };
  let best = { angles: first.angles, errorRad: Infinity, travel: Infinity };
  for (let pattern = 0; pattern < 1 << structure.length; pattern++) {
    const signs = structure.map((_g, i) => ((pattern >> i) & 1 ? -1 : 1));
    const axes = structure.map((g, i) => axisOf(g, signs[i]));
    // th keeps its pattern's sign; the variant turns |th| about its own axis.
    const residual = (th: number[]) => quatLog(quatChain(tInv, ...axes.map((ax, i) => quatExp([ax[0] * Math.abs(th[i]), ax[1] * Math.abs(th[i]), ax[2] * Math.abs(th[i])]))));
    const x0 = first.angles.map((a, i) => signs[i] * Math.max(Math.abs(a), 0.05));
    const r = leastSquares3(residual, x0, signs.map((s) => (s > 0 ? 0 : -2 * Math.PI)), signs.map((s) => (s > 0 ? 2 * Math.PI : 0)), { step: 1e-4, iterations: 60, tolerance: 1e-6 });
    const travel = r.x.reduce((sum, v) => sum + Math.abs(v), 0);
    if (r.norm < best.errorRad - 1e-6 || (Math.abs(r.norm - best.errorRad) <= 1e-6 && travel < best.travel)) best = { angles: r.x, errorRad: r.norm, travel };
  }
  return best;
}

/** The first pass of `solveAngles`: each group turns about one axis, its variants in opposite senses. */
function solveSymmetric(structure: readonly Group[], target: Quat): { angles: number[]; errorRad: number } {
  const tInv = quatConj(target);
  const residual = (th: number[]) => quatLog(quatChain(tInv, ...structure.map((g, i) => quatExp([g.axis[0] * th[i], g.axis[1] * th[i], g.axis[2] * th[i]]))));
  const goal = quatLog(target);
  // Starts: plain projections, and greedy (each group takes its share of what is left).
  const starts: number[][] = [structure.map((g) => g.axis[0] * goal[0] + g.axis[1] * goal[1] + g.axis[2] * goal[2])];
  let left: Quat = target;
  const greedy: number[] = [];
  for (const g of structure) {
    const v = quatLog(left);
    const th = g.axis[0] * v[0] + g.axis[1] * v[1] + g.axis[2] * v[2];
    greedy.push(th);
    left = quatChain(quatExp([-g.axis[0] * th, -g.axis[1] * th, -g.axis[2] * th]), left);
  }
  starts.push(greedy);
  let best = { angles: starts[0], errorRad: Infinity, travel: Infinity };
  const lim = structure.map(() => 2 * Math.PI);
  for (const x0 of starts) {
    const r = leastSquares3(residual, x0, lim.map((l) => -l), lim, { step: 1e-4, iterations: 60, tolerance: 1e-6 });
    const travel = r.x.reduce((s, v) => s + Math.abs(v), 0);
    if (r.norm < best.errorRad - 1e-6 || (Math.abs(r.norm - best.errorRad) <= 1e-6 && travel < best.travel)) best = { angles: r.x, errorRad: r.norm, travel };
  }
  return best;
}

/** Whole cycles and a size for a phase turning |angle| with per-cycle rotation at most `capRad`. */
function discretise(table: FamilyTable, angleRad: number, capRad: number, minCycles: number): CandidatePart {
  const perMax = Math.min(norm(tableRotation(table, table.family.maxSize)), capRad);
  const cycles = Math.max(minCycles, Math.ceil(angleRad / perMax - 0.02));
  return { family: table.family, size: sizeForAngle(table, angleRad / cycles), cycles };
}

/**
 * One group's phase as parts: its whole angle in trim-sized cycles when that is short, else most of
 * it in large cycles and the rest as a trim of small cycles, so every phase ends with cycles small
 * enough to stop on from what one sees (a stop one large cycle off is several degrees off).
 */
function phaseParts(table: FamilyTable, angleRad: number): CandidatePart[] {
  const big = Math.min(norm(tableRotation(table, table.family.maxSize)), PHASE_MAX_DEG / DEG);
  const trimShare = TRIM_MIN_CYCLES * (TRIM_MAX_DEG / DEG) * 0.75;
  const coarse = Math.floor((angleRad - trimShare) / big);
  if (coarse < 1) return [discretise(table, angleRad, TRIM_MAX_DEG / DEG, TRIM_MIN_CYCLES)];
  const coarsePart = { family: table.family, size: sizeForAngle(table, big), cycles: coarse };
  const rest = angleRad - coarse * norm(tableRotation(table, coarsePart.size));
  return [coarsePart, discretise(table, rest, TRIM_MAX_DEG / DEG, TRIM_MIN_CYCLES)];
}

/** Composed table rotation of parts. */
function tableComposition(parts: readonly CandidatePart[], tables: ReadonlyMap<PlanFamily, FamilyTable>): Quat {
  return quatChain(...parts.map((p) => quatIntPower(quatExp(tableRotation(tables.get(p.family)!, p.size)), p.cycles)));
}

/** Every structure's cycle plan from the tables, shortest first. */
export function searchSeeds(tables: readonly FamilyTable[], target: Quat, limits: SearchLimits): SearchSeed[] {
  const groups = groupsOf(tables);
  const byFamily = new Map(tables.map((t) => [t.family, t]));
  const structures: Group[][] = [];
  for (const a of groups) {
    structures.push([a]);
    for (const b of groups) {
      if (b === a) continue;
      structures.push([a, b]);
      for (const c of groups) if (c !== b) structures.push([a, b, c]);
    }
  }
  const seeds: SearchSeed[] = [];
  const negligible = (limits.toleranceDeg / 4) / DEG;
  for (const s of structures) {
    const { angles, errorRad } = solveAngles(s, target);
    if (errorRad * DEG > limits.toleranceDeg / 2) continue;
    // Drop phases that turn next to nothing (another structure covers them).
    if (angles.some((a) => Math.abs(a) < negligible)) continue;
    // Every phase ends in small cycles, so the crew member can stop or add cycles about each axis
    // in turn (also a family that recurs: its first phase's error, turned by the phases between,
    // lies partly about axes the later phase cannot trim). Only the last phase ending so is the
    // shorter fallback for a time budget the first cannot meet.
    const tableOf = (i: number) => s[i].tables[angles[i] >= 0 ? 0 : 1];
    const trimmed = s.flatMap((_g, i) => phaseParts(tableOf(i), Math.abs(angles[i])));
    const lastOnly = s.flatMap((_g, i) => (i < s.length - 1 ? [discretise(tableOf(i), Math.abs(angles[i]), PHASE_MAX_DEG / DEG, 1)] : phaseParts(tableOf(i), Math.abs(angles[i]))));
    const options: [CandidatePart[], boolean][] = [[trimmed, true], ...(lastOnly.length < trimmed.length ? [[lastOnly, false] as [CandidatePart[], boolean]] : [])];
    for (const [parts, everyPhaseTrimmed] of options) {
      const q = tableComposition(parts, byFamily);
      seeds.push({
        parts,
        netAngleDeg: angles.reduce((sum, a) => sum + Math.abs(a), 0) * DEG,
        estimatedDurationS: parts.reduce((sum, p) => sum + phaseDurationS(p, limits.rateLimitDegS), 0),
        tableErrorDeg: quatAngleBetween(q, target) * DEG,
        everyPhaseTrimmed,
      });
    }
  }
  return seeds.sort((a, b) => a.estimatedDurationS - b.estimatedDurationS);
}

/** A refined candidate: parts and the error of their simulated per-cycle composition. */
export interface RefinedParts {
  parts: CandidatePart[];
  composedErrorDeg: number;
  /** One-cycle simulations the refinement ran. */
  simulations: number;
}

/**
 * Which parts' sizes the refinement moves: in each of the last three runs of one family (a group's
 * large cycles and its trim), the part with most cycles. One per axis is enough for any residual
 * and keeps the problem small; the part with most cycles turns most per unit of size.
 */
function freeParts(parts: readonly CandidatePart[]): number[] {
  const runs: number[][] = [];
  parts.forEach((p, i) => {
    const run = runs[runs.length - 1];
    if (run && parts[run[0]].family === p.family) run.push(i); else runs.push([i]);
  });
  return runs.slice(-3).flat();
}

/**
 * Refines the sizes with simulated cycles (bounded least squares on the rotation-vector error);
 * when that cannot meet the target, tries one cycle more or less on the last trim.
 */
export function refineParts(body: Body, target: Quat, start: readonly CandidatePart[], limits: SearchLimits): RefinedParts {
  const cache = new Map<string, Quat>();
  let simulations = 0;
  const cycleOf = (f: PlanFamily, size: number): Quat => {
    const key = `${f.id}@${size}`;
    let q = cache.get(key);
    if (!q) { q = perCycleRotation(body, f, size, limits.rateLimitDegS); cache.set(key, q); simulations++; }
    return q;
  };
  const tInv = quatConj(target);
  const goalDeg = limits.toleranceDeg * 0.05;
  // Sizes move within a factor `growth` of where they start (a trim stays a trim), wider only when
  // that cannot meet the target: an error of a degree costs more than a trim a little off its size.
  const attempt = (parts: readonly CandidatePart[], growth: number) => {
    const free = freeParts(parts);
    const residual = (x: number[]) => {
      const sized = parts.map((p, i) => (free.includes(i) ? { ...p, size: x[free.indexOf(i)] } : p));
      return quatLog(quatChain(tInv, ...sized.map((p) => quatIntPower(cycleOf(p.family, p.size), p.cycles)))).map((v) => v * DEG);
    };
    const lo = free.map((i) => Math.max(parts[i].family.minSize, parts[i].size / growth));
    const hi = free.map((i) => Math.min(parts[i].family.maxSize, parts[i].size * growth));
    const r = leastSquares3(residual, free.map((i) => parts[i].size), lo, hi, { step: 0.02, iterations: 12, tolerance: goalDeg });
    return { parts: parts.map((p, i) => (free.includes(i) ? { ...p, size: r.x[free.indexOf(i)] } : p)), errorDeg: r.norm };
  };
  const good = limits.toleranceDeg * 0.1;
  let best = attempt(start, SIZE_GROWTH);
  for (const growth of [SIZE_GROWTH ** 2, Infinity]) {
    if (best.errorDeg <= good) break;
    const r = attempt(best.parts, growth);
    if (r.errorDeg < best.errorDeg) best = r;
  }
  if (best.errorDeg > limits.toleranceDeg * 0.5) {
    const last = start.length - 1;
    for (const d of [1, -1, 2]) {
      const cycles = start[last].cycles + d;
      if (cycles < 1) continue;
      const r = attempt(start.map((p, i) => (i === last ? { ...p, cycles } : p)), Infinity);
      if (r.errorDeg < best.errorDeg) best = r;
      if (best.errorDeg <= limits.toleranceDeg * 0.5) break;
    }
  }
  return { parts: best.parts, composedErrorDeg: best.errorDeg, simulations };
}
