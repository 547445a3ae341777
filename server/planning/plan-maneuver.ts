/**
 * The maneuver planner: fits the sweep families to the body, searches compositions of one to three
 * phases from simulated single cycles (plan-search.ts), verifies the chosen candidates at the
 * engine's full accuracy, runs the robustness Monte Carlo on each (open-loop and with feedback) and
 * ranks them (DECISIONS.md): (1) meets tolerance, ranges, rate limit and time budget; (2) no
 * detour; (3) robustness level; (4) duration. Synchronous and CPU-bound: the job runs it in a
 * worker thread, the CLI in its own process.
 */
import type { Body } from '../../shared/contracts/body.ts';
import type { SequenceTarget } from '../../shared/contracts/maneuver.ts';
import type { PlanCandidate, PlanSettings } from '../../shared/contracts/plan.ts';
import { ROBUSTNESS_LEVELS, robustnessLevel, type RobustnessModel } from '../../shared/contracts/robustness.ts';
import { pathDegFromSamples } from '../../shared/math/path-travelled.ts';
import type { Quat } from '../../shared/math/quaternion.ts';
import { cueFor } from '../../shared/primitives/primitive-cues.ts';
import { meetsLimits } from '../../shared/product/candidate-limits.ts';
import { targetQuat } from '../maneuvers/target-attitude.ts';
import { type CandidatePart, candidatePrimitives } from './candidate-steps.ts';
import { candidateTrack } from './candidate-track.ts';
import { compileForBody, evaluateSequence } from './evaluate-steps.ts';
import { perCycleRotation } from './per-cycle-rotation.ts';
import { FAMILY_GROUPS, fitFamilies } from './plan-families.ts';
import { familyTables, type RefinedParts, refineParts, type SearchLimits, type SearchSeed, searchSeeds } from './plan-search.ts';
import { robustnessSamples, summariseRobustness } from './robustness.ts';
import { quatAngle, quatChain, quatConj, quatLog } from './rotation-vector.ts';

/** Seeds refined beyond the number of candidates asked for (some may miss a limit or turn out less robust). */
const EXTRA_SEEDS = 4;
/**
 * Samples of the robustness screen that picks which refined seeds to verify: enough that its 95th
 * percentile moves by a few tenths of a degree from one seed to another, not by a degree or more.
 */
const SCREEN_SAMPLES = 40;
/**
 * A screened figure counts for a level only this far inside the level's bound, so a candidate that
 * merely drew lucky samples in the screen does not displace one that is comfortably inside.
 */
const SCREEN_MARGIN = 0.85;
/** Sample rate of the verification run, Hz (for pathDeg; ∫|ω| dt converges well before it). */
const VERIFY_RATE_HZ = 30;
const DEG = 180 / Math.PI;

/** Progress report: fraction 0–1 and a short note. */
export type PlanProgress = (fraction: number, note: string) => void;

/** Planner inputs. */
export interface PlanInputs {
  body: Body;
  target: SequenceTarget;
  settings: PlanSettings;
  /** Family groups to use (default: all). */
  groups?: readonly string[];
  /** Skip the robustness run (figures reported as NaN); for the planner's own speed checks only. */
  skipRobustness?: boolean;
  onProgress?: PlanProgress;
}

/** The planner's answer: ranked candidates and plain notes (why a target cannot be reached, …). */
export interface PlanOutcome {
  candidates: PlanCandidate[];
  notes: string[];
  /** Wall time of the search and verification, and of the robustness runs, seconds. */
  timings: { searchS: number; robustnessS: number };
}

/** Ranks by (1) limits met, (2) no detour, (3) robustness level, (4) duration; numbers the ranks from 1. */
export function rankCandidates(list: readonly Omit<PlanCandidate, 'rank'>[]): PlanCandidate[] {
  const key = (c: Omit<PlanCandidate, 'rank'>) => [meetsLimits(c) ? 0 : 1, c.detour ? 1 : 0, ROBUSTNESS_LEVELS.indexOf(c.robustness.level), c.durationS];
  const sorted = [...list].sort((a, b) => {
    const ka = key(a), kb = key(b);
    for (let i = 0; i < ka.length; i++) if (ka[i] !== kb[i]) return ka[i] - kb[i];
    return a.errorDeg - b.errorDeg;
  });
  return sorted.map((c, i) => ({ ...c, rank: i + 1 }));
}

/** Main family of a seed: the one whose phase turns most (cycles × size², a loop's effect grows with its area). */
const mainGroup = (s: SearchSeed) => [...s.parts].sort((a, b) => b.cycles * b.size ** 2 - a.cycles * a.size ** 2)[0].family.group;

/**
 * Refines seeds shortest first (within the time budget first, every phase trimmed first), one per structure of families, until
 * `count` meet the tolerance with at most two per main family (so different ways of turning are
 * compared), or `4 × count` have been tried.
 */
function refineSeeds(body: Body, goal: Quat, seeds: readonly SearchSeed[], count: number, limits: SearchLimits, progress: PlanProgress): { seed: SearchSeed; r: RefinedParts }[] {
  const withinBudget = (s: SearchSeed) => limits.timeBudgetS === null || s.estimatedDurationS <= limits.timeBudgetS;
  // Within the budget first, and there plans whose every phase ends in a trim (robust to a person's
  // execution) before those trimming only the last phase (shorter, for a budget nothing else meets).
  const rank = (s: SearchSeed) => (withinBudget(s) ? 0 : 2) + (s.everyPhaseTrimmed ? 0 : 1);
  const ordered = [0, 1, 2, 3].flatMap((k) => seeds.filter((s) => rank(s) === k));
  const seen = new Set<string>();
  const perMain = new Map<string, number>();
  const out: { seed: SearchSeed; r: RefinedParts }[] = [];
  let tried = 0, good = 0;
  for (const seed of ordered) {
    if (good >= count || tried >= 4 * count) break;
    const key = seed.parts.map((p) => p.family.group).join('+');
    const main = mainGroup(seed);
    if (seen.has(key) || (perMain.get(main) ?? 0) >= 2) continue;
    seen.add(key);
    progress(0.1 + (0.3 * tried) / (4 * count), `refining candidate ${tried + 1}`);
    tried++;
    const r = refineParts(body, goal, seed.parts, limits);
    out.push({ seed, r });
    if (r.composedErrorDeg <= limits.toleranceDeg) { good++; perMain.set(main, (perMain.get(main) ?? 0) + 1); }
  }
  return out;
}

/** Runs the planner. */
export function planManeuver({ body, target, settings, groups = FAMILY_GROUPS, skipRobustness = false, onProgress }: PlanInputs): PlanOutcome {
  const progress = onProgress ?? (() => {});
  const started = performance.now();
  const timings = { searchS: 0, robustnessS: 0 };
  const goal = targetQuat(target);
  const goalAngleDeg = quatAngle(goal) * DEG;
  const limits: SearchLimits = { toleranceDeg: target.toleranceDeg, rateLimitDegS: target.rateLimitDegS, timeBudgetS: target.timeBudgetS };
  const notes: string[] = [];

  progress(0.02, 'fitting the sweeps to the body');
  const { families, unavailable } = fitFamilies(body, target.rateLimitDegS, groups);
  for (const u of unavailable) notes.push(`${u.group.replaceAll('_', ' ')} not used: ${u.reason}.`);
  if (!families.length) return { candidates: [], notes: [...notes, 'No sweep fits this body\'s joint ranges: nothing to plan with.'], timings };

  progress(0.05, 'measuring per-cycle rotations');
  const tables = familyTables(body, families, target.rateLimitDegS);
  const seeds = searchSeeds(tables, goal, limits);
  if (!seeds.length) {
    const axes = [...new Set(families.map((f) => f.axis))];
    const missing = (['yaw', 'pitch', 'roll'] as const).filter((a) => !axes.includes(a));
    notes.push(`No composition of up to three phases reaches the target within ${target.toleranceDeg}° using the sweeps that fit this body's joint ranges (3° margin) and the ${target.rateLimitDegS}°/s rate limit`
      + (missing.length ? `: none of them turns the body mainly about ${missing.join(' or ')}.` : '.'));
    return { candidates: [], notes, timings };
  }
  const refined = refineSeeds(body, goal, seeds, settings.maxCandidates + EXTRA_SEEDS, limits, progress);
  if (limits.timeBudgetS !== null && refined.every(({ seed }) => seed.estimatedDurationS > limits.timeBudgetS!)) {
    notes.push(`The shortest plan found needs about ${Math.ceil(refined[0].seed.estimatedDurationS)} s, over the ${limits.timeBudgetS} s time budget (sweeps are slowed to stay under the ${target.rateLimitDegS}°/s rate limit).`);
  }

  const model: RobustnessModel = { spreads: settings.spreads, perceptionErrorDeg: settings.perceptionErrorDeg, reactionDelayS: settings.reactionDelayS };
  const out: Omit<PlanCandidate, 'rank'>[] = [];
  // A robustness screen (its own seed) picks which to verify: within tolerance, no detour, level
  // with a margin, then duration within a level (the shortest comfortably robust plan), or the
  // screened figure itself among those outside every level's margin.
  progress(0.4, 'screening robustness');
  const withinTol = (r: RefinedParts) => r.composedErrorDeg <= limits.toleranceDeg;
  const detour = (seed: SearchSeed) => seed.netAngleDeg > goalAngleDeg + 90;
  const byDuration = [...refined].sort((a, b) => Number(!withinTol(a.r)) - Number(!withinTol(b.r)) || Number(detour(a.seed)) - Number(detour(b.seed))
    || a.seed.estimatedDurationS - b.seed.estimatedDurationS);
  const last = ROBUSTNESS_LEVELS.length - 1;
  const screened: { r: RefinedParts; seed: SearchSeed; level: number; p95: number }[] = [];
  for (const { r, seed } of byDuration) {
    // Shortest first: once enough are comfortably marginal, longer ones cannot outrank them (robust,
    // ≤ the tolerance, is out of reach with a perception error as large as a tolerance).
    if (screened.filter((c) => c.level < last).length >= settings.maxCandidates) break;
    if (!withinTol(r)) { screened.push({ r, seed, level: ROBUSTNESS_LEVELS.length, p95: Infinity }); continue; }
    const sequence = compileForBody(body, candidatePrimitives(r.parts, limits.rateLimitDegS));
    const s = summariseRobustness(robustnessSamples({ body, sequence, target: goal, toleranceDeg: target.toleranceDeg, seed: settings.seed + 7919, model }, 0, SCREEN_SAMPLES), target.toleranceDeg);
    screened.push({ r, seed, level: ROBUSTNESS_LEVELS.indexOf(robustnessLevel(s.feedbackP95Deg / SCREEN_MARGIN, target.toleranceDeg)), p95: s.feedbackP95Deg });
  }
  const verify = screened
    .sort((a, b) => Number(!withinTol(a.r)) - Number(!withinTol(b.r)) || Number(detour(a.seed)) - Number(detour(b.seed))
      || a.level - b.level || (a.level >= last ? a.p95 - b.p95 : a.seed.estimatedDurationS - b.seed.estimatedDurationS))
    .slice(0, settings.maxCandidates);
  verify.forEach(({ r }, i) => {
    progress(0.5 + (0.45 * i) / verify.length, `verifying candidate ${i + 1} of ${verify.length}`);
    out.push(verifyCandidate(body, target, r.parts, r.simulations, model, settings, skipRobustness, goalAngleDeg, timings));
  });
  timings.searchS = (performance.now() - started) / 1000 - timings.robustnessS;
  progress(1, 'done');
  const candidates = rankCandidates(out);
  if (candidates.length && !candidates.some(meetsLimits)) notes.push(`No candidate meets every limit. The best one: ${missedLimits(candidates[0], target, goal).join('; ')}.`);
  return { candidates, notes, timings };
}

const AXIS_NAMES = ['roll (x)', 'pitch (y)', 'yaw (z)'] as const;

/**
 * Which limits a candidate misses, in words: the error and the body axis it mostly lies about (the
 * residual rotation target⁻¹·final, in the body frame), the dofs that leave their ranges, the peak
 * rate and the time budget.
 */
export function missedLimits(c: PlanCandidate, target: SequenceTarget, goal: Quat): string[] {
  const out: string[] = [];
  if (!c.withinTolerance) {
    const a = c.final.attitude;
    const residual = quatLog(quatChain(quatConj(goal), [a.w, a.x, a.y, a.z]));
    const k = [0, 1, 2].reduce((m, i) => (Math.abs(residual[i]) > Math.abs(residual[m]) ? i : m), 0);
    out.push(`misses the target by ${c.errorDeg.toFixed(1)}° (tolerance ${target.toleranceDeg}°), mostly about ${AXIS_NAMES[k]}`);
  }
  if (c.rangeViolationCount > 0) {
    const dofs = [...new Set(c.rangeViolations.map((v) => `${v.dof} past its ${v.bound} ${v.limitDeg}°`))];
    out.push(`leaves a joint range (${dofs.join(', ')})`);
  }
  if (!c.withinRateLimit) out.push(`peak joint rate ${Math.round(c.peakJointRateDegS)}°/s over the ${target.rateLimitDegS}°/s rate limit`);
  if (!c.withinTimeBudget && target.timeBudgetS !== null) out.push(`takes ${c.durationS.toFixed(0)} s, over the ${target.timeBudgetS} s time budget`);
  return out;
}

/** Full-accuracy verification, path and robustness of one candidate. */
function verifyCandidate(body: Body, target: SequenceTarget, parts: CandidatePart[], simulations: number, model: RobustnessModel, settings: PlanSettings, skipRobustness: boolean, goalAngleDeg: number, timings: PlanOutcome['timings']): Omit<PlanCandidate, 'rank'> {
  const goal = targetQuat(target);
  const primitives = candidatePrimitives(parts, target.rateLimitDegS);
  const sequence = compileForBody(body, primitives);
  const full = evaluateSequence(body, sequence, goal, { rateHz: VERIFY_RATE_HZ });
  const f = full.result.final;
  // Cycle end to cycle end: each phase turns by its per-cycle angle per cycle (seen from the reference posture).
  const netPathDeg = parts.reduce((s, p) => s + p.cycles * quatAngle(perCycleRotation(body, p.family, p.size, target.rateLimitDegS)) * DEG, 0);
  let robustness: PlanCandidate['robustness'] = { openLoopP95Deg: NaN, feedbackP95Deg: NaN, p50Deg: NaN, withinToleranceShare: NaN, samples: 0, seed: settings.seed, level: 'not_robust' };
  if (!skipRobustness) {
    const t0 = performance.now();
    const samples = robustnessSamples({ body, sequence, target: goal, toleranceDeg: target.toleranceDeg, seed: settings.seed, model }, 0, settings.samples);
    const s = summariseRobustness(samples, target.toleranceDeg);
    robustness = {
      openLoopP95Deg: s.openLoopP95Deg, feedbackP95Deg: s.feedbackP95Deg, p50Deg: s.p50Deg, withinToleranceShare: s.withinToleranceShare,
      samples: s.samples, seed: settings.seed, level: robustnessLevel(s.feedbackP95Deg, target.toleranceDeg),
    };
    timings.robustnessS += (performance.now() - t0) / 1000;
  }
  return {
    primitives,
    sequence,
    cues: primitives.map(cueFor),
    families: parts.map((p) => p.family.id),
    final: { attitude: f.attitude, rotation: f.rotation, yprDeg: f.yprDeg },
    durationS: full.durationS,
    withinTimeBudget: target.timeBudgetS === null || full.durationS <= target.timeBudgetS,
    errorDeg: full.errorDeg,
    withinTolerance: full.errorDeg <= target.toleranceDeg,
    yprDeg: { ...f.yprDeg },
    pathDeg: pathDegFromSamples(full.result.samples.frames),
    netPathDeg,
    detour: netPathDeg > goalAngleDeg + 90,
    peakJointRateDegS: full.peakRateDegS,
    withinRateLimit: full.peakRateDegS <= target.rateLimitDegS + 1e-9,
    rangeViolations: full.result.rangeViolations,
    rangeViolationCount: full.rangeViolationCount,
    evaluations: simulations + 1,
    robustness,
    track: candidateTrack(full.result.samples.frames),
  };
}
