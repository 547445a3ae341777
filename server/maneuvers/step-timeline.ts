/**
 * The step list of a compiled sequence as composer, review, player and cue card number it: one entry
 * per composer step (DECISIONS.md "Steps"), with its start and end time, cycle count, cue, and the
 * joining move into its start posture as a short lead-in sub-phase, never a step of its own.
 */
import type { Body } from '../../shared/contracts/body.ts';
import type { StoredCompiled } from '../../shared/contracts/maneuver.ts';
import type { MotionStep } from '../../shared/contracts/motion.ts';
import { type Sequence, type Step, stepDuration } from '../../shared/contracts/sequence.ts';
import { DOF_LABELS, isDofName } from '../../shared/model/dof-names.ts';
import { compilePrimitives, dofInfoFromBody, type StepOrigin } from '../../shared/primitives/compile-primitives.ts';
import { capitalise, cueFor, LEAD_IN_WORDS, leadInCue, plainLeadInCue } from '../../shared/primitives/primitive-cues.ts';
import type { Primitive } from '../../shared/primitives/primitive-schemas.ts';

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

/** The composer's side of a version: its primitives and which primitive each compiled step came from. */
export interface ComposerOrigin {
  primitives: readonly Primitive[];
  stepMap: readonly { primitive: number; role: string }[];
}

/** Compiled step indices of one composer step: the lead-in prefix and the step's own motion. */
interface Group {
  lead: number[];
  main: number[];
  primitive: Primitive | null;
}

/** Groups from the composer's step map, or null when the map does not describe these steps. */
function composerGroups(sequence: Sequence, origin: ComposerOrigin | undefined): Group[] | null {
  if (!origin || origin.stepMap.length !== sequence.steps.length || sequence.steps.length === 0) return null;
  const groups: Group[] = [];
  let last = -1;
  for (let i = 0; i < origin.stepMap.length; i++) {
    const { primitive, role } = origin.stepMap[i];
    const p = origin.primitives[primitive];
    if (!p || primitive < last) return null;
    if (primitive !== last) groups.push({ lead: [], main: [], primitive: p });
    const g = groups[groups.length - 1];
    // a blend before the primitive's own motion is its lead-in; one after it (rare) belongs to the motion
    if (role === 'blend' && g.main.length === 0) g.lead.push(i);
    else g.main.push(i);
    last = primitive;
  }
  return groups.every((g) => g.main.length > 0) ? groups : null;
}

/**
 * Groups without a composer map (planner or hand-made sequences): a move that only joins into the
 * next sweep (worded as a lead-in, or followed by a harmonic or track step) is that step's lead-in.
 */
function plainGroups(sequence: Sequence, cues: readonly (string | undefined)[]): Group[] {
  const groups: Group[] = [];
  let pending: number[] = [];
  sequence.steps.forEach((step, i) => {
    const next = sequence.steps[i + 1];
    const joins = step.kind === 'move' && next !== undefined && next.kind !== 'move' && next.kind !== 'hold';
    if (step.kind === 'move' && (LEAD_IN_WORDS.test(cues[i] ?? '') || (joins && cues[i] === undefined))) {
      pending.push(i);
      return;
    }
    groups.push({ lead: pending, main: [i], primitive: null });
    pending = [];
  });
  // a trailing lead-in with nothing after it is a step of its own
  if (pending.length) groups.push({ lead: [], main: pending, primitive: null });
  return groups;
}

/**
 * The step list: one entry per composer step with start/end times (s), cycles, cue and lead-in.
 * With `origin` (the version's primitives and step map) steps follow the composer exactly; without
 * it, joining moves still become lead-ins. `cues[i]`, when given, words compiled step i.
 */
export function stepTimeline(sequence: Sequence, cues: readonly (string | undefined)[] = [], origin?: ComposerOrigin): MotionStep[] {
  const starts: number[] = [];
  let t = 0;
  for (const step of sequence.steps) {
    starts.push(t);
    t += stepDuration(step);
  }
  const endOf = (i: number) => starts[i] + stepDuration(sequence.steps[i]);
  const groups = composerGroups(sequence, origin) ?? plainGroups(sequence, cues);
  return groups.map((g, index) => {
    const first = g.lead[0] ?? g.main[0];
    const lastMain = g.main[g.main.length - 1];
    const main = sequence.steps[g.main[0]];
    const harmonics = g.main.filter((i) => sequence.steps[i].kind === 'harmonic');
    const cyclic = harmonics.length === 1 ? (sequence.steps[harmonics[0]] as Extract<Step, { kind: 'harmonic' }>) : null;
    const mainCue = g.primitive ? cueFor(g.primitive) : cues[g.main[0]]?.trim() || fallbackCue(main);
    const leadCue = g.primitive ? leadInCue(g.primitive) : plainLeadInCue;
    return {
      index,
      kind: main.kind,
      start: starts[first],
      end: endOf(lastMain),
      leadIn: g.lead.length ? { end: endOf(g.lead[g.lead.length - 1]), cue: capitalise(leadCue) } : null,
      cycleStart: cyclic ? starts[harmonics[0]] : starts[g.main[0]],
      cycles: cyclic ? cyclic.cycles : null,
      period: cyclic ? cyclic.period : null,
      cue: capitalise(mainCue),
    };
  });
}

/** The step map (compiled step → primitive) of `sequence`, recompiled from the primitives; null when they do not reproduce its steps. */
export function primitiveStepMap(primitives: Primitive[], body: Body, sequence: Sequence): StepOrigin[] | null {
  if (!primitives.length) return null;
  const compiled = compilePrimitives(primitives, dofInfoFromBody(body), sequence.start);
  if (compiled.errors.length || compiled.steps.length !== sequence.steps.length) return null;
  if (compiled.steps.some((s, i) => s.kind !== sequence.steps[i].kind)) return null;
  return compiled.stepMap;
}

/**
 * The step list of a stored version (player, rehearsal capture): by its stored step map, or, for
 * versions saved before the map was stored, by the map its primitives compile to for its body.
 */
export function versionStepList(v: { compiled: StoredCompiled; primitives: Primitive[]; body: Body }): MotionStep[] {
  const { sequence, cues, stepMap } = v.compiled;
  const map = stepMap.length ? stepMap : (primitiveStepMap(v.primitives, v.body, sequence) ?? []);
  return stepTimeline(sequence, cues, { primitives: v.primitives, stepMap: map });
}

/** Total duration of stored compiled steps, s. */
export function compiledDuration(compiled: StoredCompiled): number {
  return compiled.sequence.steps.reduce((t, s) => t + stepDuration(s), 0);
}

/**
 * Number of steps as the composer lists them (DECISIONS.md "Steps"): the primitives named by the
 * stored step map, or, without one, the compiled steps less the joining moves that become lead-ins
 * (the same grouping as the player's step list). The rehearsal log counts completed steps against it.
 */
export function stepListCount(compiled: StoredCompiled): number {
  if (compiled.stepMap.length) return new Set(compiled.stepMap.map((o) => o.primitive)).size;
  return stepTimeline(compiled.sequence, compiled.cues).length;
}
