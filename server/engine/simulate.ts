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
import { integrateAttitude } from './integrate-attitude.ts';
import { compileMotion, evalPiece, type MotionPlan } from './joint-motion.ts';
import { findRangeViolations, peakJointRates } from './joint-range.ts';
import { bodyRate, createMomentumWork, restrictToPiece } from './locked-momentum.ts';
import { auditAt, createAuditWork } from './momentum-audit.ts';
import { mergeRigidSegments } from './rigid-merge.ts';
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
  /** Skip the momentum audit (reported as NaN); only for benchmarks isolating the integrator. */
  skipAudit?: boolean;
}

/** Sample times 0, 1/rate, 2/rate, … and the end (s). */
export function sampleTimes(duration: number, rateHz: number): number[] {
  const out: number[] = [];
  const n = Math.floor(duration * rateHz + 1e-9);
  for (let k = 0; k <= n; k++) out.push(Math.min(duration, k / rateHz));
  if (duration - out[out.length - 1] > 1e-12) out.push(duration);
  return out;
}

/** Index of the piece that owns time t (the first whose end is ≥ t). */
function pieceIndexAt(plan: MotionPlan, t: number): number {
  for (let p = 0; p < plan.pieces.length; p++) if (t <= plan.pieces[p].t1) return p;
  return plan.pieces.length - 1;
}

/** Simulates a validated body and sequence. Throws only on internal failure (e.g. integrator divergence). */
export function simulate(body: Body, sequence: Sequence, options: EngineOptions = {}): SimulationResult {
  const model = compileBody(body);
  const plan = compileMotion(model, sequence);
  return simulateModel(model, plan, options);
}

/** Simulates a compiled model and plan (the benchmark's entry: no re-compilation). */
export function simulateModel(model: BodyModel, plan: MotionPlan, options: EngineOptions = {}): SimulationResult {
  const rateHz = options.rateHz ?? DEFAULT_RATE_HZ;
  const rtol = options.rtol ?? DEFAULT_RTOL;
  const atol = options.atol ?? rtol;
  const times = sampleTimes(plan.duration, rateHz);
  const nd = model.dofCount;

  const owner = times.map((t) => pieceIndexAt(plan, t));
  const track = integrateAttitude(model, plan, { rtol, atol }, times);

  // Samples, momentum audit, peak shape momentum.
  // The rate the integrator follows is computed on its model (dof-less segments folded into their
  // parents); the audit poses every segment of the full model itself.
  const rhsModel = mergeRigidSegments(model);
  const work = createMomentumWork(rhsModel);
  const audit = createAuditWork(model);
  const q = new Float64Array(nd), qd = new Float64Array(nd), a = new Float64Array(4);
  const frames: SimulationResult['samples']['frames'] = [];
  let maxH = 0, atTime = 0, peakH = 0;
  let o = 0;
  for (let s = 0; s < times.length; s++) {
    const t = times[s], p = owner[s];
    a[0] = track.outputs[o]; a[1] = track.outputs[o + 1]; a[2] = track.outputs[o + 2]; a[3] = track.outputs[o + 3];
    o += 4;
    if (p < 0) {
      frames.push({ t, attitude: { w: 1, x: 0, y: 0, z: 0 }, jointsDeg: Array.from(plan.start, (v) => v * DEG) });
      continue;
    }
    const piece = plan.pieces[p];
    evalPiece(piece, t, q, qd);
    const jointsDeg = new Array<number>(nd);
    for (let k = 0; k < nd; k++) jointsDeg[k] = q[k] * DEG;
    frames.push({ t, attitude: { w: a[0], x: a[1], y: a[2], z: a[3] }, jointsDeg });
    // The rate the integrator follows here (for the audit's root motion) and the shape momentum.
    if (work.piece !== piece) restrictToPiece(rhsModel, piece, work);
    const omega = bodyRate(rhsModel, q, qd, work);
    peakH = Math.max(peakH, Math.hypot(work.h[0], work.h[1], work.h[2]));
    if (options.skipAudit) continue;
    const H = auditAt(model, piece, t, a, omega, audit);
    if (H > maxH) { maxH = H; atTime = t; }
  }

  // Final state.
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
      maxAbs: options.skipAudit ? NaN : maxH,
      relative: options.skipAudit ? NaN : peakH > 0 ? maxH / peakH : 0,
      peakShapeMomentum: peakH, atTime, points: times.length,
    },
    rangeViolations: findRangeViolations(model, plan),
    peakJointRateDegS: peakJointRates(model, plan),
    samples: { rateHz, dofs: [...model.dofNames], frames },
    solver: {
      method: 'Magnus, 6th order (3 Gauss–Legendre nodes), adaptive',
      rhsEvaluations: track.stats.rhsEvaluations, steps: track.stats.steps, rejectedSteps: track.stats.rejectedSteps,
      pieces: track.stats.pieces, tolerances: { relative: rtol, absolute: atol },
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
