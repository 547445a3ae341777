/**
 * Compiles composer primitives into the engine's sequence contract (move/harmonic/hold steps),
 * inserting a minimum-jerk blend wherever a sweep would not start where the previous step ended,
 * so the compiled steps always join (the contract's continuity rule). Pure: used by the composer
 * for previews and by the server before verification.
 */
import type { Body } from '../contracts/body.ts';
import { harmonicAngleDeg, type Sequence, type Step } from '../contracts/sequence.ts';
import { type PrimitiveMotion, primitiveMotion } from './primitive-motion.ts';
import type { Primitive } from './primitive-schemas.ts';
import { PRIMITIVE_LABELS } from './primitive-schemas.ts';

/** One dof of the body the steps are compiled for: name and range, degrees. */
export interface DofInfo {
  name: string;
  min: number;
  max: number;
}

/** Which compiled steps came from which primitive. */
export interface StepOrigin {
  /** Index of the primitive in the composed list. */
  primitive: number;
  /** `blend`: inserted to join; `sweep`/`shift`/`pause`: the primitive's own motion. */
  role: 'blend' | 'sweep' | 'shift' | 'pause';
  /** Start and end of the step, seconds from the sequence start. */
  startS: number;
  endS: number;
}

/** A problem tied to one primitive and field. */
export interface PrimitiveIssue {
  /** Index of the primitive in the composed list. */
  primitive: number;
  /** Path of the field within the list, e.g. `primitives[2].custom.l_sh_flex`. */
  field: string;
  /** A sentence naming the step, the dof and the reason. */
  message: string;
}

/** Output of compilePrimitives. */
export interface CompiledPrimitives {
  /** The engine sequence (start posture and steps). */
  sequence: Sequence;
  /** The same steps as `sequence.steps`. */
  steps: Step[];
  /** One entry per compiled step. */
  stepMap: StepOrigin[];
  /** Total duration, seconds. */
  durationS: number;
  /** Hard errors (unknown dofs): the steps must not be run. */
  errors: PrimitiveIssue[];
  /** Angles planned beyond a dof's range (the engine reports them as range violations too). */
  warnings: PrimitiveIssue[];
}

/** Slowest average joint speed a blend may use, deg/s: blends last max(0.5 s, largest change / this). */
export const BLEND_SPEED_DEG_S = 60;
/** Shortest blend, seconds. */
export const MIN_BLEND_S = 0.5;
/** Changes below this are treated as already joined, degrees (well inside the contract's 1e-6°). */
const JOIN_TOLERANCE_DEG = 1e-9;

/** The dofs (name, range) of a body contract, in body order. */
export function dofInfoFromBody(body: Body): DofInfo[] {
  return body.segments.flatMap((s) => s.joint?.dofs.map((d) => ({ name: d.name, min: d.min, max: d.max })) ?? []);
}

/** Duration of a blend whose largest joint change is `maxDeltaDeg`, seconds (rounded up to 0.05 s). */
export function blendDurationS(maxDeltaDeg: number): number {
  return Math.max(MIN_BLEND_S, Math.ceil((maxDeltaDeg / BLEND_SPEED_DEG_S) * 20) / 20);
}

const round = (x: number) => Math.round(x * 1e6) / 1e6;

/**
 * Compiles `primitives` for a body with the given dofs, starting from `start` (degrees; omitted
 * dofs 0°). Never throws on bad dof names: they are reported in `errors` naming the primitive.
 */
export function compilePrimitives(primitives: readonly Primitive[], dofInfo: readonly DofInfo[], start: Readonly<Record<string, number>> = {}): CompiledPrimitives {
  const byName = new Map(dofInfo.map((d) => [d.name, d]));
  const current = new Map<string, number>(dofInfo.map((d) => [d.name, start[d.name] ?? 0]));
  const steps: Step[] = [];
  const stepMap: StepOrigin[] = [];
  const errors: PrimitiveIssue[] = [];
  const warnings: PrimitiveIssue[] = [];
  let t = 0;

  const push = (step: Step, primitive: number, role: StepOrigin['role'], duration: number) => {
    steps.push(step);
    stepMap.push({ primitive, role, startS: round(t), endS: round(t + duration) });
    t += duration;
  };

  primitives.forEach((p, i) => {
    const label = `step ${i + 1} (${PRIMITIVE_LABELS[p.kind]})`;
    const motion: PrimitiveMotion = primitiveMotion(p);
    // Every dof the primitive names must exist in the body.
    const named = motion.type === 'sweep' ? [...Object.keys(motion.waves), ...Object.keys(motion.fixed)]
      : motion.type === 'shift' ? Object.keys(motion.to) : motion.type === 'recorded' ? motion.dofs : [];
    const unknown = named.filter((n) => !byName.has(n));
    for (const n of unknown) {
      const field = p.kind === 'pose_shift' && p.posture === 'custom' ? `primitives[${i}].custom.${n}` : `primitives[${i}]`;
      errors.push({ primitive: i, field, message: `${label}: the body has no dof '${n}'` });
    }
    if (unknown.length) return;

    // Planned angles beyond a dof's range (one warning per dof and primitive).
    const checkRange = (dof: string, lo: number, hi: number) => {
      const d = byName.get(dof)!;
      if (lo < d.min - JOIN_TOLERANCE_DEG) warnings.push({ primitive: i, field: `primitives[${i}]`, message: `${label}: ${dof} reaches ${round(lo)}°, below its minimum ${d.min}°` });
      else if (hi > d.max + JOIN_TOLERANCE_DEG) warnings.push({ primitive: i, field: `primitives[${i}]`, message: `${label}: ${dof} reaches ${round(hi)}°, above its maximum ${d.max}°` });
    };

    if (motion.type === 'pause') {
      push({ kind: 'hold', duration: motion.duration }, i, 'pause', motion.duration);
      return;
    }
    if (motion.type === 'shift') {
      const to: Record<string, number> = {};
      if (motion.allDofs) for (const d of dofInfo) to[d.name] = motion.to[d.name] ?? 0;
      else Object.assign(to, motion.to);
      for (const [dof, v] of Object.entries(to)) { checkRange(dof, v, v); current.set(dof, v); }
      push({ kind: 'move', duration: motion.duration, to }, i, 'shift', motion.duration);
      return;
    }

    if (motion.type === 'recorded') {
      // Each repetition: a blend to the first frame when needed, then the track.
      const { rateHz, dofs, frames, repeat } = motion;
      dofs.forEach((d, j) => { const vs = frames.map((f) => f[j]); checkRange(d, Math.min(...vs), Math.max(...vs)); });
      const d = (frames.length - 1) / rateHz;
      for (let r = 0; r < repeat; r++) {
        const first: Record<string, number> = {};
        let maxDelta = 0;
        dofs.forEach((dof, j) => { first[dof] = frames[0][j]; maxDelta = Math.max(maxDelta, Math.abs(frames[0][j] - (current.get(dof) ?? 0))); });
        if (maxDelta > JOIN_TOLERANCE_DEG) {
          const b = blendDurationS(maxDelta);
          push({ kind: 'move', duration: b, to: first }, i, 'blend', b);
        }
        push({ kind: 'track', rateHz, dofs: [...dofs], frames: frames.map((f) => [...f]) }, i, 'sweep', d);
        dofs.forEach((dof, j) => current.set(dof, frames[frames.length - 1][j]));
      }
      return;
    }

    // Sweep: blend to where each wave starts (and to the held angles), then the harmonic step.
    const startAngles: Record<string, number> = { ...motion.fixed };
    for (const [dof, w] of Object.entries(motion.waves)) startAngles[dof] = harmonicAngleDeg(w, motion.period, 0);
    let maxDelta = 0;
    for (const [dof, v] of Object.entries(startAngles)) maxDelta = Math.max(maxDelta, Math.abs(v - (current.get(dof) ?? 0)));
    if (maxDelta > JOIN_TOLERANCE_DEG) {
      const d = blendDurationS(maxDelta);
      push({ kind: 'move', duration: d, to: startAngles }, i, 'blend', d);
    }
    for (const [dof, v] of Object.entries(motion.fixed)) { checkRange(dof, v, v); current.set(dof, v); }
    for (const [dof, w] of Object.entries(motion.waves)) {
      const a = Math.abs(w.amplitude);
      checkRange(dof, w.offset - a, w.offset + a);
      // Track the end angle exactly as the engine's continuity check does.
      current.set(dof, harmonicAngleDeg(w, motion.period, motion.cycles * motion.period));
    }
    push({ kind: 'harmonic', period: motion.period, cycles: motion.cycles, joints: { ...motion.waves } }, i, 'sweep', motion.cycles * motion.period);
  });

  const sequence: Sequence = { start: { ...start }, steps };
  return { sequence, steps, stepMap, durationS: round(t), errors, warnings };
}
