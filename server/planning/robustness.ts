/**
 * The robustness run's per-sample model, split-safe: `robustnessSamples(inputs, from, to)` computes
 * samples [from, to) and `summariseRobustness` merges any set of them. Sample i draws from its own
 * stream seeded by (seed, i), so one thread, chunks and worker processes give identical figures.
 *
 * Two execution models on the same perturbed body and steps:
 * - open-loop: every step as planned (whole cycles as written);
 * - with feedback: the crew member watches a cabin reference. In each phase (a sweep of two or more
 *   whole cycles) they run the first half of the cycles as planned, then at every cycle's end decide
 *   from the attitude they perceive whether one more cycle brings the predicted final attitude
 *   (perceived attitude, then the rest of the plan as planned) closer to the target; they stop when
 *   it does not, and add at most half the planned cycles again (trim cycles). What they perceive is
 *   the attitude a reaction delay before the cycle's end, turned by a perception error drawn afresh
 *   for every decision (normal, `perceptionErrorDeg` 1σ about each body axis); knowing how a cycle
 *   goes, they carry it forward to the cycle's end as planned (the body's to-and-fro within a cycle
 *   is large, so judging the late glimpse as it is would mislead them). Both figures are ASSUMPTIONS
 *   (no source found for whole-body attitude perception in free fall): DECISIONS.md sets their
 *   floors, 2° and 0.3 s, which are the defaults.
 * Both models share the body and execution errors: per segment mass and length, per sweep amplitude
 * and period, per dof phase (timing). A person moving both arms or both legs together keeps them in
 * step, so by default (`spreads.pairedLimbs: together`) the left and right dof of a joint share one
 * phase error; each joint (shoulder flexion, abduction …) still has its own, so the loop's shape
 * varies. With independent errors two-limb loops drift about other axes, which no stopping corrects:
 * `independent` keeps that stricter model available.
 * Each sample is composed from per-step pieces (execution-pieces.ts), exact up to the integrator's
 * tolerance because every cycle returns to the same posture.
 */
import type { Body } from '../../shared/contracts/body.ts';
import type { RobustnessModel } from '../../shared/contracts/robustness.ts';
import type { RobustnessFigures, RobustnessSample } from '../../shared/contracts/robustness-stored.ts';
import type { Sequence } from '../../shared/contracts/sequence.ts';
import { type Quat, quatAngleBetween, quatMultiply } from '../../shared/math/quaternion.ts';
import { seededRandom, symmetricUnit } from '../../shared/math/seeded-random.ts';
import { type ExecutionPiece, executionPieces } from './execution-pieces.ts';
import { perturbBody } from './perturb-body.ts';
import { perturbSequence } from './perturb-sequence.ts';
import { quantile } from './quantile.ts';
import { quatChain, quatConj, quatExp, quatIntPower } from './rotation-vector.ts';

/** What one robustness run needs. */
export interface RobustnessInputs {
  body: Body;
  /** The nominal compiled sequence. */
  sequence: Sequence;
  /** Target attitude [w,x,y,z]. */
  target: Quat;
  toleranceDeg: number;
  seed: number;
  model: RobustnessModel;
}


/** A 32-bit seed for sample i of a run seeded `seed` (splitmix-style mixing, so neighbours differ). */
export function sampleSeed(seed: number, index: number): number {
  let z = (Math.imul(seed >>> 0, 0x9e3779b1) ^ Math.imul(index + 1, 0x85ebca6b)) >>> 0;
  z = Math.imul(z ^ (z >>> 16), 0x7feb352d) >>> 0;
  z = Math.imul(z ^ (z >>> 15), 0x846ca68b) >>> 0;
  return (z ^ (z >>> 16)) >>> 0;
}

/** The joint a dof belongs to on either side (`l_sh_flex` and `r_sh_flex` → `sh_flex`). */
const pairedJoint = (dof: string) => ((dof[0] === 'l' || dof[0] === 'r') && dof[1] === '_' ? dof.slice(2) : dof);

/**
 * Phase errors (degrees of a cycle) of a sweep's dofs. Every dof draws its own error in order (so
 * the random stream does not depend on the pairing); with `pairedLimbs: together` the second side
 * of a paired joint takes the first side's error instead of its own.
 */
export function phaseErrors(dofs: readonly string[], spreads: RobustnessModel['spreads'], random: () => number): Record<string, number> {
  const out: Record<string, number> = {};
  const bySide = new Map<string, number>();
  for (const dof of dofs) {
    const own = symmetricUnit(random) * spreads.phaseDeg;
    const joint = pairedJoint(dof);
    const shared = spreads.pairedLimbs === 'together' && joint !== dof ? bySide.get(joint) : undefined;
    out[dof] = shared ?? own;
    if (shared === undefined && joint !== dof) bySide.set(joint, own);
  }
  return out;
}

/** One sample's perturbed body and sequence (open-loop execution). */
export function perturbedCase(inputs: RobustnessInputs, index: number): { body: Body; sequence: Sequence; random: () => number } {
  const { body, sequence, model } = inputs;
  const spreads = model.spreads;
  const random = seededRandom(sampleSeed(inputs.seed, index));
  const scales = body.segments.map(() => ({ mass: symmetricUnit(random) * spreads.massPct / 100, length: symmetricUnit(random) * spreads.lengthPct / 100 }));
  const varied = perturbSequence(sequence, (_k, dofs) => ({
    amplitude: symmetricUnit(random) * spreads.amplitudePct / 100,
    period: symmetricUnit(random) * spreads.periodPct / 100,
    phaseDeg: phaseErrors(dofs, spreads, random),
  }));
  return { body: perturbBody(body, scales), sequence: varied, random };
}

const DEG = 180 / Math.PI;

/** A standard normal number from a [0, 1) generator (Box–Muller). */
function gaussian(random: () => number): number {
  const u = Math.max(random(), 1e-12), v = random();
  return Math.sqrt(-2 * Math.log(u)) * Math.cos(2 * Math.PI * v);
}

/** Open-loop final attitude: every piece as planned. */
export function openLoopAttitude(pieces: readonly ExecutionPiece[]): Quat {
  return quatChain(...pieces.map((p) => (p.kind === 'fixed' ? p.rotation : quatIntPower(p.cycle, p.cycles))));
}

/** Earliest and latest whole cycles a crew member may stop a phase of `n` planned cycles at. */
export function feedbackWindow(n: number): { first: number; last: number } {
  const w = n >= 2 ? Math.ceil(n / 2) : 0;
  return { first: n - w, last: n + w };
}

/**
 * Final attitude with feedback: `actual` pieces are what the body does, `nominal` what the crew
 * member expects (the plan on the nominal body), same structure. Perception noise from `random`.
 */
export function feedbackAttitude(actual: readonly ExecutionPiece[], nominal: readonly ExecutionPiece[], target: Quat, model: RobustnessModel, random: () => number): Quat {
  // What the rest of the plan is expected to do after each piece.
  const restAfter = new Array<Quat>(nominal.length);
  let rest: Quat = [1, 0, 0, 0];
  for (let k = nominal.length - 1; k >= 0; k--) {
    restAfter[k] = rest;
    const p = nominal[k];
    rest = quatMultiply(p.kind === 'fixed' ? p.rotation : quatIntPower(p.cycle, p.cycles), rest, [0, 0, 0, 0]);
  }
  const sigma = model.perceptionErrorDeg / DEG;
  let att: Quat = [1, 0, 0, 0];
  actual.forEach((p, k) => {
    const nom = nominal[k];
    if (p.kind === 'fixed' || nom.kind === 'fixed') {
      att = quatMultiply(att, p.kind === 'fixed' ? p.rotation : quatIntPower(p.cycle, p.cycles), [0, 0, 0, 0]);
      return;
    }
    const { first, last } = feedbackWindow(p.cycles);
    // Attitudes at the end of each cycle so far (index = cycles done).
    const ends: Quat[] = [att];
    const grow = (n: number) => { while (ends.length <= n) ends.push(quatMultiply(ends[ends.length - 1], p.cycle, [0, 0, 0, 0])); };
    let done = first;
    grow(done);
    while (done < last) {
      // Seen now: the attitude a reaction delay ago, turned by this look's perception error.
      const from = done - 1 - p.lagCycles;
      const seen = from < 0 ? ends[0] : quatMultiply(ends[from], p.lagged, [0, 0, 0, 0]);
      // They know how a cycle goes: what they saw, carried forward to the cycle's end as planned.
      const ahead = quatChain(quatConj(nom.lagged), quatIntPower(nom.cycle, Math.min(done, p.lagCycles + 1)));
      const perceived = quatChain(seen, quatExp([sigma * gaussian(random), sigma * gaussian(random), sigma * gaussian(random)]), from < 0 ? [1, 0, 0, 0] : ahead);
      const stopNow = quatAngleBetween(quatMultiply(perceived, restAfter[k], [0, 0, 0, 0]), target);
      const oneMore = quatAngleBetween(quatChain(perceived, nom.cycle, restAfter[k]), target);
      if (oneMore >= stopNow) break;
      done++;
      grow(done);
    }
    att = ends[done];
  });
  return att;
}

/** Samples [from, to) in order. */
/** What every sample of a run shares, computed once per run and reused for each chunk. */
export interface PreparedRobustness {
  inputs: RobustnessInputs;
  /** The plan as the crew member knows it, cut the same way as the perturbed steps (same inserted blends). */
  nominal: ExecutionPiece[];
}

export function prepareRobustness(inputs: RobustnessInputs): PreparedRobustness {
  const planned = perturbSequence(inputs.sequence, () => ({ amplitude: 0, period: 0, phaseDeg: {} }));
  return { inputs, nominal: executionPieces(inputs.body, planned, inputs.model.reactionDelayS) };
}

export function robustnessSamples(inputs: RobustnessInputs, from: number, to: number, prepared: PreparedRobustness = prepareRobustness(inputs)): RobustnessSample[] {
  const out: RobustnessSample[] = [];
  if (to <= from) return out;
  const { nominal } = prepared;
  for (let i = from; i < to; i++) {
    const c = perturbedCase(inputs, i);
    const actual = executionPieces(c.body, c.sequence, inputs.model.reactionDelayS);
    const openLoop = quatAngleBetween(openLoopAttitude(actual), inputs.target) * DEG;
    const feedback = quatAngleBetween(feedbackAttitude(actual, nominal, inputs.target, inputs.model, c.random), inputs.target) * DEG;
    out.push({ index: i, openLoopErrorDeg: openLoop, feedbackErrorDeg: feedback });
  }
  return out;
}

/** The figures of a complete set of samples (any order, any split). */
export function summariseRobustness(samples: readonly RobustnessSample[], toleranceDeg: number): RobustnessFigures {
  const ordered = [...samples].sort((a, b) => a.index - b.index);
  const open = ordered.map((s) => s.openLoopErrorDeg).sort((a, b) => a - b);
  const fb = ordered.map((s) => s.feedbackErrorDeg);
  const fbSorted = [...fb].sort((a, b) => a - b);
  return {
    openLoopP95Deg: quantile(open, 0.95),
    feedbackP95Deg: quantile(fbSorted, 0.95),
    p50Deg: quantile(fbSorted, 0.5),
    withinToleranceShare: fb.filter((e) => e <= toleranceDeg).length / Math.max(1, fb.length),
    samples: ordered.length,
    feedbackErrorsDeg: fb,
  };
}
