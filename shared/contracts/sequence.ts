/**
 * The sequence contract (DESIGN.md "Sequence contract"): prescribed joint motion in degrees and seconds.
 * `move` is a minimum-jerk blend (Flash & Hogan 1985), `harmonic` a sinusoid per dof, `hold` a pause,
 * `track` recorded joint angles followed by a natural cubic spline.
 */
import { z } from 'zod';

import { type Body, bodyDofNames } from './body.ts';
import { type ContractIssue, type ContractResult, zodIssuesToContract } from './contract-issue.ts';

/** Largest |angle| accepted anywhere in a sequence, degrees (ten turns; beyond that it is a typo). */
export const MAX_ABS_ANGLE_DEG = 3600;
/** Continuity tolerance between a harmonic or track step's start and the previous end, degrees. */
export const CONTINUITY_TOLERANCE_DEG = 1e-6;

const finite = (what: string) =>
  z.number({ error: (iss) => (iss.input === undefined ? `${what} is required` : `${what} must be a finite number (NaN/Infinity not allowed)`) });
const angle = (what: string) =>
  finite(what).min(-MAX_ABS_ANGLE_DEG, `${what} must be ≥ −${MAX_ABS_ANGLE_DEG}°`).max(MAX_ABS_ANGLE_DEG, `${what} must be ≤ ${MAX_ABS_ANGLE_DEG}°`);
const positiveSeconds = (what: string) => finite(what).positive(`${what} must be positive (seconds)`);
const angleMap = (what: string) => z.record(z.string(), angle(what));

/** Minimum-jerk blend from the current angles to `to` over `duration` seconds; omitted dofs stay. */
export const moveStepSchema = z.object({
  kind: z.literal('move'),
  /** Seconds, > 0. */
  duration: positiveSeconds('duration'),
  /** Target angles by dof name, degrees. */
  to: angleMap('angle'),
});

/** One dof's sinusoid: θ(t) = offset + amplitude·sin(2πt/period + phase), degrees. */
export const harmonicJointSchema = z.object({
  /** Degrees. */
  offset: angle('offset'),
  /** Degrees (may be negative: a sign flip of the phase). */
  amplitude: angle('amplitude'),
  /** Degrees. */
  phase: angle('phase'),
});

/** `cycles·period` seconds of sinusoidal motion on the listed dofs; other dofs stay. */
export const harmonicStepSchema = z.object({
  kind: z.literal('harmonic'),
  /** Seconds per cycle, > 0. */
  period: positiveSeconds('period'),
  /** Number of cycles, > 0 (fractional allowed). */
  cycles: finite('cycles').positive('cycles must be positive'),
  /** Sinusoid per dof name. */
  joints: z.record(z.string(), harmonicJointSchema),
});

/** Nothing moves for `duration` seconds. */
export const holdStepSchema = z.object({
  kind: z.literal('hold'),
  /** Seconds, > 0. */
  duration: positiveSeconds('duration'),
});

/** Bounds of a track step. */
export const TRACK_LIMITS = { minFrames: 4, minRateHz: 1, maxRateHz: 1000 } as const;

/**
 * Recorded joint angles: frame k (degrees, in the order of `dofs`) is at k/rateHz s from the step's
 * start; each listed dof follows the natural cubic spline through its frames; other dofs stay.
 * Frame values are checked by name after the shape (see `trackValueIssues`).
 */
export const trackStepSchema = z.object({
  kind: z.literal('track'),
  /** Frames per second, 1–1000 Hz. */
  rateHz: finite('rateHz').min(TRACK_LIMITS.minRateHz, `rateHz must be at least ${TRACK_LIMITS.minRateHz} Hz`)
    .max(TRACK_LIMITS.maxRateHz, `rateHz must be at most ${TRACK_LIMITS.maxRateHz} Hz`),
  /** Dof names, one per frame column. */
  dofs: z.array(z.string().min(1, 'a dof name must not be empty')).min(1, 'dofs must list at least one dof'),
  /** Frames in time order; each lists one angle (degrees) per dof. */
  frames: z.array(z.array(z.unknown(), { error: 'each frame must be a list of angles' }), { error: 'frames must be a list of frames' })
    .min(TRACK_LIMITS.minFrames, `frames must hold at least ${TRACK_LIMITS.minFrames} frames (a cubic spline needs them)`),
}).transform((s) => s as { kind: 'track'; rateHz: number; dofs: string[]; frames: number[][] });

/** One step of a sequence. */
export const stepSchema = z.discriminatedUnion('kind', [moveStepSchema, harmonicStepSchema, holdStepSchema, trackStepSchema], {
  error: "step kind must be 'move', 'harmonic', 'hold' or 'track'",
});

/** A whole sequence: start angles (omitted dofs: 0°) and ordered steps. */
export const sequenceSchema = z.object({
  /** Initial joint angles by dof name, degrees; initial attitude is identity. */
  start: angleMap('angle').default({}),
  /** Steps in order. */
  steps: z.array(stepSchema),
});
/** A sequence as written in the contract. */
export type Sequence = z.infer<typeof sequenceSchema>;
/** One step as written in the contract. */
export type Step = z.infer<typeof stepSchema>;
/** A harmonic step. */
export type HarmonicStep = z.infer<typeof harmonicStepSchema>;
/** A track step. */
export type TrackStep = z.infer<typeof trackStepSchema>;

/** Duration of one step in seconds. */
export function stepDuration(step: Step): number {
  if (step.kind === 'track') return (step.frames.length - 1) / step.rateHz;
  return step.kind === 'harmonic' ? step.cycles * step.period : step.duration;
}

/** Angle (deg) of a harmonic joint at time t (s) into the step. */
export function harmonicAngleDeg(j: { offset: number; amplitude: number; phase: number }, period: number, t: number): number {
  return j.offset + j.amplitude * Math.sin((2 * Math.PI * t) / period + (j.phase * Math.PI) / 180);
}

function describeSequencePath(path: readonly PropertyKey[]): string {
  if (path[0] === 'steps' && typeof path[1] === 'number') return `step ${path[1]}`;
  if (path[0] === 'start') return 'start';
  return '';
}

/**
 * A track's frame values and frame lengths, checked with the dof named (zod only sees numbers):
 * every frame as long as `dofs`, every value a finite angle, no dof listed twice.
 */
export function trackValueIssues(step: TrackStep, where: string, path: string): ContractIssue[] {
  const issues: ContractIssue[] = [];
  const seen = new Set<string>();
  step.dofs.forEach((d, j) => {
    if (seen.has(d)) issues.push({ path: `${path}.dofs[${j}]`, message: `${where}: dof '${d}' is listed twice` });
    seen.add(d);
  });
  for (let k = 0; k < step.frames.length && issues.length < 20; k++) {
    const f = step.frames[k];
    if (f.length !== step.dofs.length) {
      issues.push({ path: `${path}.frames[${k}]`, message: `${where}: frame ${k} has ${f.length} values but dofs lists ${step.dofs.length}` });
      continue;
    }
    for (let j = 0; j < f.length; j++) {
      const v = f[j];
      if (typeof v !== 'number' || !Number.isFinite(v)) {
        issues.push({ path: `${path}.frames[${k}][${j}]`, message: `${where}: frame ${k}, dof '${step.dofs[j]}' must be a finite number of degrees (got ${String(v)})` });
      } else if (Math.abs(v) > MAX_ABS_ANGLE_DEG) {
        issues.push({ path: `${path}.frames[${k}][${j}]`, message: `${where}: frame ${k}, dof '${step.dofs[j]}' is ${v}°, beyond ±${MAX_ABS_ANGLE_DEG}°` });
      }
    }
  }
  return issues;
}

/** Checks dof names against the body and the continuity rule; returns issues naming the step and dof. */
function checkSequenceSemantics(seq: Sequence, body: Body): ContractIssue[] {
  const issues: ContractIssue[] = [];
  const names = bodyDofNames(body);
  const known = new Set(names);
  const unknown = (path: string, where: string, dof: string) =>
    issues.push({ path, message: `${where}: unknown dof '${dof}' (the body '${body.name}' has no such dof)` });

  // Track every dof's angle through the steps (degrees).
  const current = new Map<string, number>(names.map((n) => [n, 0]));
  for (const [dof, v] of Object.entries(seq.start)) {
    if (!known.has(dof)) unknown(`start.${dof}`, 'start', dof);
    else current.set(dof, v);
  }
  seq.steps.forEach((step, i) => {
    if (step.kind === 'move') {
      for (const [dof, v] of Object.entries(step.to)) {
        if (!known.has(dof)) unknown(`steps[${i}].to.${dof}`, `step ${i} (move)`, dof);
        else current.set(dof, v);
      }
    } else if (step.kind === 'harmonic') {
      for (const [dof, j] of Object.entries(step.joints)) {
        if (!known.has(dof)) { unknown(`steps[${i}].joints.${dof}`, `step ${i} (harmonic)`, dof); continue; }
        const begin = harmonicAngleDeg(j, step.period, 0);
        const prev = current.get(dof) ?? 0;
        if (Math.abs(begin - prev) > CONTINUITY_TOLERANCE_DEG) {
          issues.push({
            path: `steps[${i}].joints.${dof}`,
            message: `step ${i} (harmonic): dof '${dof}' starts at ${begin}° but the previous step ended at ${prev}° (offset + amplitude·sin(phase) must equal it within ${CONTINUITY_TOLERANCE_DEG}°; insert a move first)`,
          });
        }
        current.set(dof, harmonicAngleDeg(j, step.period, step.cycles * step.period));
      }
    } else if (step.kind === 'track') {
      const where = `step ${i} (track)`;
      const valueIssues = trackValueIssues(step, where, `steps[${i}]`);
      issues.push(...valueIssues);
      step.dofs.forEach((dof, j) => {
        if (!known.has(dof)) { unknown(`steps[${i}].dofs[${j}]`, where, dof); return; }
        if (valueIssues.length) return;
        const begin = step.frames[0][j];
        const prev = current.get(dof) ?? 0;
        if (Math.abs(begin - prev) > CONTINUITY_TOLERANCE_DEG) {
          issues.push({
            path: `steps[${i}].frames[0][${j}]`,
            message: `${where}: dof '${dof}' starts at ${begin}° but the previous step ended at ${prev}° (the first frame must equal it within ${CONTINUITY_TOLERANCE_DEG}°; insert a move first)`,
          });
        }
        current.set(dof, step.frames[step.frames.length - 1][j]);
      });
    }
  });
  return issues;
}

/**
 * Validates untrusted JSON against the sequence contract for a given (already valid) body:
 * shape, finiteness, positive durations, known dof names, harmonic and track continuity, track frames.
 * Angles outside a dof's [min, max] are not rejected: the engine reports them as range violations.
 */
export function validateSequence(json: unknown, body: Body): ContractResult<Sequence> {
  const parsed = sequenceSchema.safeParse(json);
  if (!parsed.success) return { ok: false, issues: zodIssuesToContract(parsed.error, describeSequencePath) };
  const issues = checkSequenceSemantics(parsed.data, body);
  return issues.length ? { ok: false, issues } : { ok: true, value: parsed.data };
}
