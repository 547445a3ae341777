/**
 * One simulation: compile the body and the sequence, integrate the attitude piece by piece,
 * audit the momentum, check joint ranges and rates, and assemble the result contract.
 */
import { type Body, validateBody } from '../../shared/contracts/body.ts';
import type { ContractIssue } from '../../shared/contracts/contract-issue.ts';
import type { SimulationResult } from '../../shared/contracts/result.ts';
import { type Sequence, validateSequence } from '../../shared/contracts/sequence.ts';
import { DEFAULT_RATE_HZ, DEFAULT_RTOL } from '../../shared/contracts/simulate-request.ts';
import { type BodyModel, compileBody } from '../../shared/kinematics/body-model.ts';
import { quatToYpr } from '../../shared/math/euler-zyx.ts';
import { pathDegFromSamples } from '../../shared/math/path-travelled.ts';
import { quatCanonical, quatToAxisAngle } from '../../shared/math/quaternion.ts';
import { type AttitudeTrack, integrateAttitude } from './integrate-attitude.ts';
import { anglesAt, compileMotion, evalPiece, type MotionPlan } from './joint-motion.ts';
import { findRangeViolations, peakJointRates } from './joint-range.ts';
import { RateNodes } from './rate-nodes.ts';
import { auditTrack, type TrackAudit } from './track-audit.ts';
import { ENGINE_VERSION } from './version.ts';

const DEG = 180 / Math.PI;

/** Engine options (all optional). */
export interface EngineOptions {
  /** Sample rate for `samples`, Hz (default 60). */
  rateHz?: number;
  /** Relative tolerance (default 1e-10). */
  rtol?: number;
  /** Absolute tolerance on quaternion components (default = rtol). */
  atol?: number;
  /** Skip the momentum audit (its figures, the peak shape momentum included, are NaN); only for benchmarks isolating the integrator. */
  skipAudit?: boolean;
  /** Search mode (as simulateFinal, which every entry point then runs): final attitude, range violations and peak joint rates only. */
  finalOnly?: boolean;
}

/** Sample times 0, 1/rate, 2/rate, … and the end (s). */
export function sampleTimes(duration: number, rateHz: number): number[] {
  const out: number[] = [];
  const n = Math.floor(duration * rateHz + 1e-9);
  for (let k = 0; k <= n; k++) out.push(Math.min(duration, k / rateHz));
  if (duration - out[out.length - 1] > 1e-12) out.push(duration);
  return out;
}

/** Simulates a validated body and sequence. Throws only on internal failure (e.g. integrator divergence). */
export function simulate(body: Body, sequence: Sequence, options: EngineOptions = {}): SimulationResult {
  const model = compileBody(body);
  const plan = compileMotion(model, sequence);
  return simulateModel(model, plan, options);
}

/**
 * Search mode, for the planner's and the robustness run's inner loops: the final attitude, range
 * violations and peak joint rates only — no samples, no audit, no interpolation. The result has the
 * contract's shape with `samples.frames` empty and the momentum audit NaN.
 */
export function simulateFinal(body: Body, sequence: Sequence, options: Pick<EngineOptions, 'rtol' | 'atol'> = {}): SimulationResult {
  const model = compileBody(body);
  const plan = compileMotion(model, sequence);
  return simulateModelFinal(model, plan, options);
}

/** Search mode on a compiled model and plan. */
export function simulateModelFinal(model: BodyModel, plan: MotionPlan, options: Pick<EngineOptions, 'rtol' | 'atol'> = {}): SimulationResult {
  const rtol = options.rtol ?? DEFAULT_RTOL;
  const atol = options.atol ?? rtol;
  const track = integrateAttitude(model, plan, { rtol, atol });
  return assemble(model, plan, track, { rtol, atol }, 0, [], {
    maxAbs: NaN, relative: NaN, peakShapeMomentum: NaN, atTime: 0, points: 0, rateEvaluations: 0,
  }, 'search mode (final attitude only)');
}

/** Simulates a compiled model and plan (the benchmark's entry: no re-compilation). */
export function simulateModel(model: BodyModel, plan: MotionPlan, options: EngineOptions = {}): SimulationResult {
  if (options.finalOnly) return simulateModelFinal(model, plan, options);
  const rateHz = options.rateHz ?? DEFAULT_RATE_HZ;
  const rtol = options.rtol ?? DEFAULT_RTOL;
  const atol = options.atol ?? rtol;
  const times = sampleTimes(plan.duration, rateHz);
  const nd = model.dofCount;
  // The integrator's accepted nodes are the audit's reference rate (no evaluations of its own).
  const skip = options.skipAudit === true;
  const nodes = skip ? undefined : new RateNodes(plan);
  const track = integrateAttitude(model, plan, { rtol, atol, nodes }, times);
  const audit = auditTrack(model, plan, times, track.outputs, { skip, reference: nodes });

  // Samples: the integrated attitude and the prescribed joint angles.
  const q = new Float64Array(nd);
  const frames = new Array<SimulationResult['samples']['frames'][number]>(times.length);
  const o = track.outputs;
  for (let s = 0; s < times.length; s++) {
    const t = times[s];
    anglesAt(plan, t, q);
    const jointsDeg = new Array<number>(nd);
    for (let k = 0; k < nd; k++) jointsDeg[k] = q[k] * DEG;
    frames[s] = { t, attitude: { w: o[4 * s], x: o[4 * s + 1], y: o[4 * s + 2], z: o[4 * s + 3] }, jointsDeg };
  }
  return assemble(model, plan, track, { rtol, atol }, rateHz, frames, audit, 'full');
}

/** The result contract from a track (final state, checks, solver figures). */
function assemble(
  model: BodyModel, plan: MotionPlan, track: AttitudeTrack, tol: { rtol: number; atol: number }, rateHz: number,
  frames: SimulationResult['samples']['frames'], audit: TrackAudit, mode: string,
): SimulationResult {
  const nd = model.dofCount;
  const fq = quatCanonical(Float64Array.from(track.final));
  const aa = quatToAxisAngle(fq);
  const ypr = quatToYpr(fq);
  const finalQ = new Float64Array(nd);
  if (plan.pieces.length) evalPiece(plan.pieces[plan.pieces.length - 1], plan.duration, finalQ, null); else finalQ.set(plan.start);
  return {
    engineVersion: ENGINE_VERSION,
    duration: plan.duration,
    pathDeg: pathDegFromSamples(frames),
    final: {
      attitude: { w: fq[0], x: fq[1], y: fq[2], z: fq[3] },
      rotation: { angleDeg: aa.angle * DEG, axis: aa.axis },
      yprDeg: { yaw: ypr.yaw * DEG, pitch: ypr.pitch * DEG, roll: ypr.roll * DEG },
      jointsDeg: Object.fromEntries(model.dofNames.map((name, k) => [name, finalQ[k] * DEG])),
    },
    momentumResidual: {
      maxAbs: audit.maxAbs, relative: audit.relative, peakShapeMomentum: audit.peakShapeMomentum, atTime: audit.atTime, points: audit.points,
    },
    rangeViolations: findRangeViolations(model, plan),
    peakJointRateDegS: peakJointRates(model, plan),
    samples: { rateHz, dofs: [...model.dofNames], frames },
    solver: {
      method: `Magnus, 6th order (3 Gauss–Legendre nodes), adaptive; ${mode}`,
      rhsEvaluations: track.stats.rhsEvaluations, steps: track.stats.steps, rejectedSteps: track.stats.rejectedSteps,
      pieces: track.stats.pieces, tolerances: { relative: tol.rtol, absolute: tol.atol },
    },
  };
}

/** Validates untrusted JSON (body, then sequence against it) and simulates; issues name the field at fault. */
export function simulateJson(
  bodyJson: unknown, sequenceJson: unknown, options: EngineOptions = {},
): { ok: true; result: SimulationResult } | { ok: false; issues: ContractIssue[]; which: 'body' | 'sequence' } {
  const b = validateBody(bodyJson);
  if (!b.ok) return { ok: false, issues: b.issues, which: 'body' };
  const s = validateSequence(sequenceJson, b.value);
  if (!s.ok) return { ok: false, issues: s.issues, which: 'sequence' };
  return { ok: true, result: simulate(b.value, s.value, options) };
}
