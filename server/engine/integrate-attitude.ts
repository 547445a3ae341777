/**
 * Attitude integration: Ṙ = R[ω(t)]× with ω = −I_lock⁻¹h, by the sixth-order Magnus method
 * (magnus.ts) with step-size control, piece by piece (joint rates may jump between steps, so no
 * integration step straddles a step boundary), with attitudes at requested times.
 */
import type { BodyModel } from '../../shared/kinematics/body-model.ts';
import { evalMoving, evalPiece, type MotionPiece, type MotionPlan } from './joint-motion.ts';
import { bodyRate, createMomentumWork, type MomentumWork, restrictToPiece } from './locked-momentum.ts';
import {
  createEstimateWork, createRatePolynomial, ESTIMATE_NODES, type EstimateWork, fitRatePolynomial, GAUSS_NODES, localErrorEstimate, magnusTheta,
  polynomialTheta, quatLogBetween, quatTimesExp, type RatePolynomial,
} from './magnus.ts';
import type { RateNodes } from './rate-nodes.ts';
import { mergeRigidSegments } from './rigid-merge.ts';

/** Integrator settings. */
export interface IntegratorOptions {
  /** Relative tolerance (default 1e-10). */
  rtol: number;
  /** Absolute tolerance, rad (default = rtol). */
  atol: number;
  /** Max accepted plus rejected steps per piece (default 100,000). */
  maxSteps?: number;
  /** Records ω at the nodes of every accepted step here (the momentum audit's reference rate). */
  nodes?: RateNodes;
}

/** Integrator statistics. */
export interface IntegratorStats {
  /** Evaluations of ω(t) by the stepping (rejected steps included); samples not counted. */
  rhsEvaluations: number;
  /** Evaluations of ω(t) spent on the attitudes at requested times (3 per time in a piece's first or last step), and on each piece's two ends when nodes are recorded. */
  sampleEvaluations: number;
  steps: number;
  rejectedSteps: number;
  pieces: number;
}

/** Result of integrating a plan. */
export interface AttitudeTrack {
  /** Final attitude [w,x,y,z], unit (not yet sign-canonical). */
  final: Float64Array;
  /** Attitude at each requested time, 4 per time ([w,x,y,z], unit). */
  outputs: Float64Array;
  stats: IntegratorStats;
}

/** The body rate ω(t) the integrator follows, one motion piece at a time. */
export interface RateSource {
  /** Makes `piece` the one later `rate` calls belong to. */
  setPiece(piece: MotionPiece): void;
  /** Writes ω (rad/s, root frame) at time t (s) of the current piece to out[o..o+2]. */
  rate(t: number, out: Float64Array, o: number): void;
}

/**
 * ω(t) = −I_lock⁻¹h of a plan on a model (dof-less segments folded into their parents: the same
 * I_lock and h), restricted to each piece's moving segments.
 */
export class PlanRate implements RateSource {
  /** Calls to `rate` so far. */
  evaluations = 0;
  private readonly rhsModel: BodyModel;
  private readonly work: MomentumWork;
  private readonly q: Float64Array;
  private readonly qd: Float64Array;
  private piece: MotionPiece | null = null;

  constructor(model: BodyModel) {
    this.rhsModel = mergeRigidSegments(model);
    this.work = createMomentumWork(this.rhsModel);
    this.q = new Float64Array(model.dofCount);
    this.qd = new Float64Array(model.dofCount);
  }

  setPiece(piece: MotionPiece): void {
    if (this.piece === piece) return;
    this.piece = piece;
    restrictToPiece(this.rhsModel, piece, this.work);
    // The dofs at rest keep these angles (and zero rates); `rate` rewrites only the moving ones.
    evalPiece(piece, piece.t0, this.q, this.qd);
  }

  rate(t: number, out: Float64Array, o: number): void {
    const piece = this.piece;
    if (!piece) throw new Error('PlanRate: no piece selected');
    this.evaluations++;
    evalMoving(piece, t, this.q, this.qd);
    const w = bodyRate(this.rhsModel, this.q, this.qd, this.work);
    out[o] = w[0]; out[o + 1] = w[1]; out[o + 2] = w[2];
  }

  /** The shape momentum h (root frame, kg·m²/s) of the last `rate` call. */
  shapeMomentum(): Float64Array {
    return this.work.h;
  }
}

/**
 * Builds the quaternion right-hand side q̇ = ½ q ⊗ (0, ω) for one piece (a general-purpose ODE
 * solver's view of the same problem: the odex cross-check and the benchmark's RK4 use it).
 * `counter.n` counts evaluations.
 */
export function attitudeRhs(model: BodyModel, work: MomentumWork, piece: MotionPiece, counter: { n: number }) {
  const q = new Float64Array(model.dofCount);
  const qd = new Float64Array(model.dofCount);
  // The dofs at rest keep the values the first evaluation writes.
  let first = true;
  return (t: number, y: number[]): number[] => {
    counter.n++;
    if (work.piece !== piece) restrictToPiece(model, piece, work);
    if (first) { evalPiece(piece, t, q, qd); first = false; } else evalMoving(piece, t, q, qd);
    const w = bodyRate(model, q, qd, work);
    const wx = w[0], wy = w[1], wz = w[2];
    return [
      0.5 * (-y[1] * wx - y[2] * wy - y[3] * wz),
      0.5 * (y[0] * wx + y[2] * wz - y[3] * wy),
      0.5 * (y[0] * wy - y[1] * wz + y[3] * wx),
      0.5 * (y[0] * wz + y[1] * wy - y[2] * wx),
    ];
  };
}

/** Step-size controller (common practice: safety 0.8, growth within [0.2, 2]). */
const SAFETY = 0.8, MIN_FACTOR = 0.2, MAX_FACTOR = 2;
/** Exponent of the controller: both estimates are of the local error, O(h⁷). */
const ERROR_EXPONENT = 1 / 7;
/** First trial step of a plan, s (the controller adapts it within a step or two). */
const FIRST_STEP_S = 0.05;

/**
 * Per-step bound on the local error estimate, rad, for the tolerances: a twentieth of the tighter
 * one, so that the errors of a few hundred steps add up to about rtol on the final attitude, and
 * samples stay consistent enough for the momentum audit's 1e-9 floor
 * (tests/engine/magnus-integrator.test.ts checks that against odex at a tight tolerance).
 */
export function stepTolerance(rtol: number, atol: number): number {
  return 0.05 * Math.min(rtol, atol);
}

/** Preallocated buffers of one integration. */
interface StepWork {
  /** ω at the Gauss nodes of the current step, node-major, rad/s. */
  w: Float64Array;
  /** The last ESTIMATE_NODES nodes (times, s; ω, rad/s): those of the accepted steps before, then the current step's. */
  histT: Float64Array;
  histW: Float64Array;
  /** Nodes of accepted steps in the history so far (within the piece). */
  histCount: number;
  est: EstimateWork;
  /** The rate polynomial for attitudes inside a step. */
  poly: RatePolynomial;
  /** The last nine accepted nodes of the piece (times, s; ω, rad/s): the last three steps'. */
  ringT: Float64Array;
  ringW: Float64Array;
  /** A step whose inner sample times wait for the next step's nodes: its start (s), attitude and sample range. */
  pending: boolean;
  pendT: number;
  pendQ: Float64Array;
  pendFrom: number;
  pendTo: number;
  /** The two halves of a piece's first step (step doubling), and ω there. */
  wA: Float64Array;
  thetaA: Float64Array;
  thetaB: Float64Array;
  qTmp: Float64Array;
  /** θ of the current step, rad. */
  theta: Float64Array;
  /** ω at the nodes of a partial step (samples), and its θ. */
  ws: Float64Array;
  thetaS: Float64Array;
  /** Where accepted nodes are recorded (null: nowhere), and the current piece's index. */
  record: RateNodes | null;
  piece: number;
}

/** The outputs of an integration asked for no times (zero length: shared). */
const NO_OUTPUTS = new Float64Array(0);

/** Allocates the buffers of one integration. */
function createStepWork(): StepWork {
  return {
    w: new Float64Array(9), histT: new Float64Array(ESTIMATE_NODES), histW: new Float64Array(3 * ESTIMATE_NODES), histCount: 0, est: createEstimateWork(), poly: createRatePolynomial(),
    ringT: new Float64Array(9), ringW: new Float64Array(27), pending: false, pendT: 0, pendQ: new Float64Array(4), pendFrom: 0, pendTo: 0, wA: new Float64Array(9), thetaA: new Float64Array(3), thetaB: new Float64Array(3),
    qTmp: new Float64Array(4), theta: new Float64Array(3), ws: new Float64Array(9), thetaS: new Float64Array(3),
    record: null, piece: 0,
  };
}

/**
 * The buffers of the last finished integration, taken by the next one (the planner's and
 * robustness runs' inner loops integrate thousands of times): one integration runs at a time per
 * thread, and one that throws leaves none here, so the next allocates afresh.
 */
let spareStepWork: StepWork | null = null;

/** ω at the Gauss nodes of [t, t+h] into w, then θ into `theta`. */
function magnusStep(source: RateSource, t: number, h: number, w: Float64Array, theta: Float64Array): void {
  source.rate(t + GAUSS_NODES[0] * h, w, 0);
  source.rate(t + GAUSS_NODES[1] * h, w, 3);
  source.rate(t + GAUSS_NODES[2] * h, w, 6);
  magnusTheta(w, 0, h, theta);
}

/**
 * A piece's first step has no step before it for the two-step estimate: it is taken as two
 * half steps (kept: more accurate) and checked against one full step (step doubling). Leaves θ of
 * the two halves combined in sw.theta and the second half's ω in sw.w; returns the estimate, rad.
 */
function firstStep(source: RateSource, t: number, h: number, sw: StepWork): number {
  const half = h / 2;
  magnusStep(source, t, half, sw.wA, sw.thetaA);
  magnusStep(source, t + half, half, sw.w, sw.thetaB);
  const q = sw.qTmp;
  q[0] = 1; q[1] = 0; q[2] = 0; q[3] = 0;
  quatTimesExp(q, 0, sw.thetaA, 0, q, 0);
  quatTimesExp(q, 0, sw.thetaB, 0, q, 0);
  // One full step against the halves.
  magnusStep(source, t, h, sw.ws, sw.thetaS);
  quatLogBetween(IDENTITY, 0, q, 0, sw.theta);
  const ex = sw.theta[0] - sw.thetaS[0], ey = sw.theta[1] - sw.thetaS[1], ez = sw.theta[2] - sw.thetaS[2];
  return Math.sqrt(ex * ex + ey * ey + ez * ez);
}

const IDENTITY = Float64Array.of(1, 0, 0, 0);

/**
 * Accepts a step's three nodes (start t, length h, ω in w) into the history: they are written to
 * the last three slots (unless `inPlace`: the estimate already put them there), then everything
 * moves down three slots, so the first four slots hold the four latest accepted nodes.
 */
function pushNodes(sw: StepWork, t: number, h: number, w: Float64Array, inPlace: boolean): void {
  const { histT, histW } = sw;
  if (!inPlace) {
    for (let j = 0; j < 3; j++) {
      histT[ESTIMATE_NODES - 3 + j] = t + GAUSS_NODES[j] * h;
      for (let c = 0; c < 3; c++) histW[3 * (ESTIMATE_NODES - 3 + j) + c] = w[3 * j + c];
    }
  }
  // Shifts by hand: a typed array's copyWithin is a builtin call, several per step.
  for (let j = 0; j < ESTIMATE_NODES - 3; j++) histT[j] = histT[j + 3];
  for (let j = 0; j < 3 * (ESTIMATE_NODES - 3); j++) histW[j] = histW[j + 9];
  sw.histCount += 3;
  const { ringT, ringW } = sw;
  for (let j = 0; j < 6; j++) ringT[j] = ringT[j + 3];
  for (let j = 0; j < 18; j++) ringW[j] = ringW[j + 9];
  for (let j = 0; j < 3; j++) {
    ringT[6 + j] = t + GAUSS_NODES[j] * h;
    for (let c = 0; c < 3; c++) ringW[3 * (6 + j) + c] = w[3 * j + c];
  }
  const rec = sw.record;
  if (rec) for (let j = 0; j < 3; j++) rec.add(sw.piece, t + GAUSS_NODES[j] * h, w, 3 * j);
}

/** Records ω at a piece's end t (one evaluation, counted with the samples'). */
function recordEnd(source: RateSource, t: number, sw: StepWork, stats: IntegratorStats): void {
  source.rate(t, sw.ws, 0);
  stats.sampleEvaluations++;
  (sw.record as RateNodes).add(sw.piece, t, sw.ws, 0);
}

/**
 * The attitudes at the pending step's inner sample times: from its start, by the Magnus formula on
 * the polynomial through the seven nodes around that step (two before it, its three, two after:
 * interpolation, no new evaluations), or — at the end of a piece, with no step after it — by a
 * Magnus step from its start with three new evaluations each.
 */
function flushPending(sw: StepWork, times: ArrayLike<number>, outputs: Float64Array, source: RateSource, stats: IntegratorStats, centred: boolean): void {
  if (!sw.pending) return;
  sw.pending = false;
  if (centred) fitRatePolynomial(sw.ringT, sw.ringW, 1, sw.poly);
  for (let i = sw.pendFrom; i < sw.pendTo; i++) {
    if (times[i] <= sw.pendT) { outputs.set(sw.pendQ, 4 * i); continue; }
    if (centred) polynomialTheta(sw.poly, sw.pendT, times[i], sw.thetaS);
    else {
      magnusStep(source, sw.pendT, times[i] - sw.pendT, sw.ws, sw.thetaS);
      stats.sampleEvaluations += 3;
    }
    quatTimesExp(sw.pendQ, 0, sw.thetaS, 0, outputs, 4 * i);
  }
}

/**
 * Integrates the attitude over the plan from identity. `times` lists ascending times (s) at which
 * the attitude is wanted (a time on a step boundary belongs to the earlier step); they fill
 * `outputs` in order. Each is reached from the start of the integration step that contains it by
 * the same sixth-order Magnus formula, on the polynomial through the rate at that step's nodes and
 * its neighbours' (flushPending): an interpolant about as accurate as the step, at no extra
 * evaluations except in a piece's first and last steps.
 * `source` is the body rate to follow (default: the plan's own).
 */
export function integrateAttitude(
  model: BodyModel, plan: MotionPlan, opts: IntegratorOptions, times: ArrayLike<number> = [], source: RateSource = new PlanRate(model),
): AttitudeTrack {
  const outputs = times.length ? new Float64Array(4 * times.length) : NO_OUTPUTS;
  const stats: IntegratorStats = { rhsEvaluations: 0, sampleEvaluations: 0, steps: 0, rejectedSteps: 0, pieces: plan.pieces.length };
  // The buffers of the integration before (if it finished), else new ones; every field is written before it is read.
  const sw = spareStepWork ?? createStepWork();
  spareStepWork = null;
  sw.record = opts.nodes ?? null;
  sw.piece = 0; sw.histCount = 0; sw.pending = false;
  const tol = stepTolerance(opts.rtol, opts.atol);
  const maxSteps = opts.maxSteps ?? 100_000;
  const q = Float64Array.of(1, 0, 0, 0);
  let next = 0;
  // Times before the first piece (or with no pieces) take the initial attitude.
  const t00 = plan.pieces.length ? plan.pieces[0].t0 : Infinity;
  while (next < times.length && (times[next] <= t00 || !plan.pieces.length)) { outputs.set(q, 4 * next); next++; }
  let h = FIRST_STEP_S;
  for (let p = 0; p < plan.pieces.length; p++) {
    const piece = plan.pieces[p];
    source.setPiece(piece);
    sw.piece = p;
    const span = piece.t1 - piece.t0;
    // Nothing moves in a hold: ω = 0 exactly, the attitude stays.
    const still = piece.moving.length === 0;
    let t = piece.t0, tries = 0;
    sw.histCount = 0;
    sw.pending = false;
    // Recording: ω at the piece's ends too, so that the nodes span it (no extrapolation there).
    const record = !still && sw.record !== null;
    if (record) recordEnd(source, piece.t0, sw, stats);
    while (t < piece.t1) {
      const left = piece.t1 - t;
      // The last step lands on the boundary; a remainder under half a step is shared with the one before.
      const hTry = still || h >= left ? left : left < 1.5 * h ? left / 2 : h;
      if (!still) {
        let est: number;
        if (sw.histCount >= ESTIMATE_NODES - 3) {
          magnusStep(source, t, hTry, sw.w, sw.theta);
          stats.rhsEvaluations += 3;
          // The current step's nodes after the last four accepted ones.
          for (let j = 0; j < 3; j++) {
            sw.histT[ESTIMATE_NODES - 3 + j] = t + GAUSS_NODES[j] * hTry;
            for (let c = 0; c < 3; c++) sw.histW[3 * (ESTIMATE_NODES - 3 + j) + c] = sw.w[3 * j + c];
          }
          est = localErrorEstimate(sw.histT, sw.histW, hTry, sw.theta, sw.est);
        } else {
          est = firstStep(source, t, hTry, sw);
          stats.rhsEvaluations += 9;
        }
        const err = est / tol;
        if (!(err <= 1)) {
          if (Number.isNaN(err)) throw new Error(`integrator produced NaN in step ${piece.step} at t = ${t} s`);
          stats.rejectedSteps++;
          if (++tries > maxSteps || hTry < 1e-12 * Math.max(1, span)) {
            throw new Error(`integrator did not converge in step ${piece.step} (step size ${hTry.toExponential(2)} s at t = ${t} s)`);
          }
          h = hTry * Math.max(MIN_FACTOR, SAFETY * Math.pow(err, -ERROR_EXPONENT));
          continue;
        }
        h = hTry * Math.min(MAX_FACTOR, Math.max(MIN_FACTOR, err > 0 ? SAFETY * Math.pow(err, -ERROR_EXPONENT) : MAX_FACTOR));
      }
      const tEnd = hTry === left ? piece.t1 : t + hTry;
      // Requested times inside (t, tEnd]. In a piece's first step (no nodes before it), a Magnus
      // step from t with its own three evaluations; otherwise they wait for the next step's nodes
      // (flushPending). A time on tEnd takes the step's end.
      const withHistory = !still && sw.histCount >= ESTIMATE_NODES - 3;
      const from = next;
      while (next < times.length && times[next] <= tEnd) {
        const s = times[next] - t;
        if (still || s <= 0) outputs.set(q, 4 * next);
        else if (times[next] === tEnd) quatTimesExp(q, 0, sw.theta, 0, outputs, 4 * next);
        else if (!withHistory) {
          magnusStep(source, t, s, sw.ws, sw.thetaS);
          stats.sampleEvaluations += 3;
          quatTimesExp(q, 0, sw.thetaS, 0, outputs, 4 * next);
        }
        next++;
      }
      // Keep the accepted nodes for the next estimate (after step doubling: both halves').
      if (withHistory) pushNodes(sw, t, hTry, sw.w, true);
      else if (!still) { pushNodes(sw, t, hTry / 2, sw.wA, false); pushNodes(sw, t + hTry / 2, hTry / 2, sw.w, false); }
      // The step before now has nodes on both sides; this one waits if it has inner times.
      flushPending(sw, times, outputs, source, stats, true);
      if (withHistory) {
        let to = next;
        while (to > from && times[to - 1] >= tEnd) to--;
        if (to > from) { sw.pending = true; sw.pendT = t; sw.pendQ.set(q); sw.pendFrom = from; sw.pendTo = to; }
      }
      if (!still) quatTimesExp(q, 0, sw.theta, 0, q, 0);
      stats.steps++;
      if (++tries > maxSteps) throw new Error(`integrator did not converge in step ${piece.step} (more than ${maxSteps} steps)`);
      t = tEnd;
    }
    flushPending(sw, times, outputs, source, stats, false);
    if (record) recordEnd(source, piece.t1, sw, stats);
  }
  // Times past the end (rounding) take the final attitude.
  while (next < times.length) { outputs.set(q, 4 * next); next++; }
  sw.record = null;
  spareStepWork = sw;
  return { final: q, outputs, stats };
}
