/**
 * Joint motion prescribed by a sequence: one piece per step (one per spline interval for a track),
 * each evaluating every dof's angle (rad) and analytic rate (rad/s) at a time. Pieces are the
 * integrator's boundaries, since joint rates may jump between steps and a track's third derivative
 * jumps at every frame.
 */
import type { Sequence, TrackStep } from '../../shared/contracts/sequence.ts';
import { stepDuration } from '../../shared/contracts/sequence.ts';
import type { BodyModel } from '../../shared/kinematics/body-model.ts';
import { minimumJerk, minimumJerkSlope } from '../../shared/math/minimum-jerk.ts';
import { naturalCubicSpline, uniformKnots } from '../../shared/math/natural-cubic-spline.ts';

const DEG = Math.PI / 180;

/** One step compiled: [t0, t1] in seconds from the sequence start; angles in rad. */
export interface MotionPiece {
  /** Step kind. */
  readonly kind: 'move' | 'harmonic' | 'hold' | 'track';
  /** Index of the step in the sequence. */
  readonly step: number;
  /** Start and end time, s. */
  readonly t0: number;
  readonly t1: number;
  /** All dofs' angles at t0, rad. */
  readonly from: Float64Array;
  /** move: all dofs' angles at t1, rad. */
  readonly to: Float64Array;
  /** harmonic: indices of the moving dofs and their offset (rad), amplitude (rad), phase (rad); angular frequency (rad/s). */
  readonly hDofs: Int32Array;
  readonly hOffset: Float64Array;
  readonly hAmplitude: Float64Array;
  readonly hPhase: Float64Array;
  /** harmonic: cos and sin of each phase (sin(ωt + φ) is then one sine and one cosine for all dofs). */
  readonly hPhaseCos: Float64Array;
  readonly hPhaseSin: Float64Array;
  readonly omega: number;
  /** track: indices of the tracked dofs and their cubic on this interval, 4 per dof: a (rad), b (rad/s), c (rad/s²), d (rad/s³), θ = a + b·u + c·u² + d·u³ with u = t − t0. */
  readonly tDofs: Int32Array;
  readonly tCoeffs: Float64Array;
  /** Indices of the dofs whose angle changes within the piece (ascending); the others stay at `from`. */
  readonly moving: Int32Array;
}

/** The whole prescribed motion. */
export interface MotionPlan {
  readonly pieces: readonly MotionPiece[];
  /** Total duration, s. */
  readonly duration: number;
  /** Angles at t = 0, rad. */
  readonly start: Float64Array;
}

/** Empty lists shared by every piece that has none (zero length: nothing in them can change). */
const NO_DOFS = new Int32Array(0);
const NO_VALUES = new Float64Array(0);

/**
 * A track step as one piece per frame interval: each tracked dof's natural cubic spline through its
 * frames (degrees → rad), knots at k/rateHz from `t` (s). Updates `cur` to the last frame; returns the end time.
 */
function compileTrack(model: BodyModel, step: TrackStep, index: number, t: number, cur: Float64Array, pieces: MotionPiece[]): number {
  const n = step.frames.length;
  const knots = uniformKnots(n, step.rateHz);
  const tDofs = Int32Array.from(step.dofs.map((name) => model.dofIndex.get(name)!));
  const splines = step.dofs.map((_, j) => naturalCubicSpline(knots, step.frames.map((f) => f[j] * DEG)));
  const moving = Int32Array.from(tDofs).sort();
  const empty = NO_VALUES;
  for (let i = 0; i < n - 1; i++) {
    const from = cur.slice();
    const tCoeffs = new Float64Array(4 * tDofs.length);
    for (let j = 0; j < tDofs.length; j++) tCoeffs.set(splines[j].coeffs.subarray(4 * i, 4 * i + 4), 4 * j);
    const piece: MotionPiece = {
      kind: 'track', step: index, t0: t + knots[i], t1: t + knots[i + 1], from, to: from, hDofs: NO_DOFS, hOffset: empty, hAmplitude: empty,
      hPhase: empty, hPhaseCos: empty, hPhaseSin: empty, omega: 0, tDofs, tCoeffs, moving,
    };
    pieces.push(piece);
    // The next interval starts where this one ends (the spline is continuous there).
    evalPiece(piece, piece.t1, cur, null);
  }
  // End exactly on the last frame (the cubic's end value differs from it by rounding only).
  for (let j = 0; j < tDofs.length; j++) cur[tDofs[j]] = step.frames[n - 1][j] * DEG;
  return t + knots[n - 1];
}

/** Indices (ascending) of the dofs whose angle differs between `from` and `to`. */
function changedDofs(from: Float64Array, to: Float64Array): Int32Array {
  let n = 0;
  for (let k = 0; k < from.length; k++) if (to[k] !== from[k]) n++;
  const out = new Int32Array(n);
  for (let k = 0, j = 0; k < from.length; k++) if (to[k] !== from[k]) out[j++] = k;
  return out;
}

/** Compiles a validated sequence for a model. */
export function compileMotion(model: BodyModel, seq: Sequence): MotionPlan {
  const nd = model.dofCount;
  const cur = new Float64Array(nd);
  for (const [name, v] of Object.entries(seq.start)) cur[model.dofIndex.get(name)!] = v * DEG;
  const start = cur.slice();
  const pieces: MotionPiece[] = [];
  let t = 0;
  const empty = NO_VALUES;
  seq.steps.forEach((step, index) => {
    if (step.kind === 'track') {
      t = compileTrack(model, step, index, t, cur, pieces);
      return;
    }
    const d = stepDuration(step);
    const from = cur.slice();
    let to = from;
    let hDofs = NO_DOFS, hOffset = empty, hAmplitude = empty, hPhase = empty, hPhaseCos = empty, hPhaseSin = empty, omega = 0;
    if (step.kind === 'move') {
      to = from.slice();
      for (const [name, v] of Object.entries(step.to)) to[model.dofIndex.get(name)!] = v * DEG;
    } else if (step.kind === 'harmonic') {
      const entries = Object.entries(step.joints);
      hDofs = Int32Array.from(entries.map(([name]) => model.dofIndex.get(name)!));
      hOffset = Float64Array.from(entries.map(([, j]) => j.offset * DEG));
      hAmplitude = Float64Array.from(entries.map(([, j]) => j.amplitude * DEG));
      hPhase = Float64Array.from(entries.map(([, j]) => j.phase * DEG));
      omega = (2 * Math.PI) / step.period;
      hPhaseCos = hPhase.map(Math.cos); hPhaseSin = hPhase.map(Math.sin);
    }
    const moving = step.kind === 'move' ? changedDofs(from, to) : step.kind === 'harmonic' ? Int32Array.from(hDofs).sort() : NO_DOFS;
    const piece: MotionPiece = { kind: step.kind, step: index, t0: t, t1: t + d, from, to, hDofs, hOffset, hAmplitude, hPhase, hPhaseCos, hPhaseSin, omega, tDofs: NO_DOFS, tCoeffs: empty, moving };
    pieces.push(piece);
    // The next step starts where this one ends.
    evalPiece(piece, piece.t1, cur, null);
    t += d;
  });
  return { pieces, duration: t, start };
}

/**
 * Angles q (rad) and, if qd is given, rates (rad/s) of every dof at time t (s) within the piece.
 * Minimum-jerk: θ = θ₀ + Δθ(10τ³ − 15τ⁴ + 6τ⁵) (Flash & Hogan 1985); harmonic: offset + A·sin(ωt + φ).
 */
export function evalPiece(piece: MotionPiece, t: number, q: Float64Array, qd: Float64Array | null): void {
  const { from } = piece;
  const nd = from.length;
  if (piece.kind === 'move') {
    const T = piece.t1 - piece.t0;
    const tau = (t - piece.t0) / T;
    const s = minimumJerk(tau);
    const sd = minimumJerkSlope(tau) / T;
    const to = piece.to;
    for (let k = 0; k < nd; k++) {
      const delta = to[k] - from[k];
      q[k] = from[k] + delta * s;
      if (qd) qd[k] = delta * sd;
    }
    return;
  }
  for (let k = 0; k < nd; k++) q[k] = from[k];
  if (qd) qd.fill(0);
  if (piece.kind === 'harmonic') evalHarmonic(piece, t, q, qd);
  else if (piece.kind === 'track') evalTrack(piece, t, q, qd);
}

/** The tracked dofs of a piece: their cubic on this interval (Horner), clamped to [t0, t1]. */
function evalTrack(piece: MotionPiece, t: number, q: Float64Array, qd: Float64Array | null): void {
  const { tDofs, tCoeffs } = piece;
  const u = Math.min(piece.t1 - piece.t0, Math.max(0, t - piece.t0));
  for (let j = 0; j < tDofs.length; j++) {
    const a = tCoeffs[4 * j], b = tCoeffs[4 * j + 1], c = tCoeffs[4 * j + 2], d = tCoeffs[4 * j + 3];
    q[tDofs[j]] = a + u * (b + u * (c + u * d));
    if (qd) qd[tDofs[j]] = b + u * (2 * c + 3 * u * d);
  }
}

/** The harmonic dofs of a piece: sin(ωt + φ) = sin ωt cos φ + cos ωt sin φ (one sine, one cosine per call). */
function evalHarmonic(piece: MotionPiece, t: number, q: Float64Array, qd: Float64Array | null): void {
  const { hDofs, hOffset, hAmplitude, hPhaseCos, hPhaseSin, omega } = piece;
  const wt = omega * (t - piece.t0);
  const sw = Math.sin(wt), cw = Math.cos(wt);
  for (let j = 0; j < hDofs.length; j++) {
    const pc = hPhaseCos[j], ps = hPhaseSin[j];
    q[hDofs[j]] = hOffset[j] + hAmplitude[j] * (sw * pc + cw * ps);
    if (qd) qd[hDofs[j]] = hAmplitude[j] * omega * (cw * pc - sw * ps);
  }
}

/**
 * Like evalPiece, but writes only the piece's moving dofs (`piece.moving`): for a q/qd pair that
 * already holds this piece's values of the others (angles `from`, rates 0), e.g. after one evalPiece.
 */
export function evalMoving(piece: MotionPiece, t: number, q: Float64Array, qd: Float64Array): void {
  if (piece.kind === 'move') {
    const { from, to, moving } = piece;
    const T = piece.t1 - piece.t0;
    const tau = (t - piece.t0) / T;
    const s = minimumJerk(tau);
    const sd = minimumJerkSlope(tau) / T;
    for (let j = 0; j < moving.length; j++) {
      const k = moving[j];
      const delta = to[k] - from[k];
      q[k] = from[k] + delta * s;
      qd[k] = delta * sd;
    }
  } else if (piece.kind === 'harmonic') evalHarmonic(piece, t, q, qd);
  else if (piece.kind === 'track') evalTrack(piece, t, q, qd);
}

/** The piece containing t (the first whose end is ≥ t); the last piece beyond the end. */
export function pieceAt(plan: MotionPlan, t: number): MotionPiece | undefined {
  for (const p of plan.pieces) if (t <= p.t1) return p;
  return plan.pieces[plan.pieces.length - 1];
}

/** Joint angles (rad) of the whole plan at time t; the start angles when there are no steps. */
export function anglesAt(plan: MotionPlan, t: number, q: Float64Array): void {
  const p = pieceAt(plan, t);
  if (p) evalPiece(p, t, q, null);
  else q.set(plan.start);
}
