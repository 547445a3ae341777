/**
 * The momentum audit of an attitude track: the total angular momentum H about the system CoM that
 * the sampled motion — the integrated attitudes and the prescribed joint angles — actually has,
 * relative to the peak shape momentum. It takes nothing from the integrator but its output.
 *
 * At each sample the root's angular velocity is the track's own: the rate ω(t) = −I_lock⁻¹h that
 * the audit evaluates itself, plus the rate at which the track departs from that rate's flow —
 * between consecutive samples the audit re-integrates ω with its own sixth-order Magnus step (not
 * the integrator's Gauss nodes, steps or interpolant), and the defect d = log((qₖ ⊗ exp θ)⁻¹ ⊗ qₖ₊₁)
 * over Δt is the track's excess rate on that interval. Inside a piece, with evenly spaced samples,
 * the step's moments come from the degree-6 polynomial through ω at seven points half a sample
 * apart (three samples either side and the midpoints between them: one new evaluation per
 * interval); elsewhere from ω at the four Gauss–Lobatto nodes of the interval. With that rate,
 * every segment's pose is differenced on a short stencil (momentum-audit.ts: no I_lock / h /
 * analytic-velocity code of the engine) and H summed. So:
 * - a wrong formula for ω shows as H ≠ 0 through the independent differencing;
 * - an integrator that follows a wrong ω, or a wrong attitude at a sample, shows through the
 *   defects (I·d/Δt: a 1e-6 rad error at 60 Hz is ≈6e-5 rad/s of rate);
 * - a healthy run stays at the integration and rounding floor (≈1e-10 of the peak shape momentum).
 * H is checked with the defect on either side of each sample; the larger counts.
 */
import type { BodyModel } from '../../shared/kinematics/body-model.ts';
import { PlanRate, type RateSource } from './integrate-attitude.ts';
import type { MotionPlan } from './joint-motion.ts';
import { LOBATTO_NODES, magnusFromWeights, magnusLobatto, momentWeights, quatLogBetween, quatTimesExp } from './magnus.ts';
import { auditAt, createAuditWork } from './momentum-audit.ts';

/** Sample intervals shorter than this (s) give no defect: rounding over Δt would swamp it (e.g. a last sample 1e-9 s before the end). */
export const MIN_DEFECT_INTERVAL_S = 1e-3;

/**
 * Longest stretch (s) the audit re-integrates in one Magnus step: longer sample intervals are split
 * (at 60 Hz and above, one step per interval; its own error then stays near 1e-12 rad).
 */
export const MAX_REINTEGRATION_STEP_S = 1 / 60;

/**
 * The seven-point window of an interval [tₖ, tₖ₊₁] (in its lengths from its midpoint): samples
 * k−1 … k+2 and the midpoints between them. Moment weights of the interpolating polynomial over
 * the interval; interpolation error ≈ 2e-3·(Δt/2)⁷·|ω⁽⁷⁾| (common practice bound), below 1e-12 rad
 * per 60 Hz interval for limb motions of a second's period.
 */
const WINDOW_NODES = [-1.5, -1, -0.5, 0, 0.5, 1, 1.5] as const;
const [WINDOW_M0, WINDOW_M1, WINDOW_M2] = momentWeights(WINDOW_NODES, -0.5, 0.5);

/** Samples count as evenly spaced when their spacings agree to this fraction. */
const EVEN_SPACING = 1e-9;
/** What the audit found. */
export interface TrackAudit {
  /** Max ‖H‖ over the samples, kg·m²/s. */
  maxAbs: number;
  /** maxAbs over the peak shape momentum (0 if nothing moves). */
  relative: number;
  /** Peak ‖h‖ over the samples, kg·m²/s. */
  peakShapeMomentum: number;
  /** Time of the max, s. */
  atTime: number;
  /** Samples audited. */
  points: number;
  /** Evaluations of ω(t) the audit made (not the integrator's). */
  rateEvaluations: number;
}

/** Index of the piece that owns time t (the first whose end is ≥ t); −1 without pieces. */
export function pieceIndexAt(plan: MotionPlan, t: number): number {
  for (let p = 0; p < plan.pieces.length; p++) if (t <= plan.pieces[p].t1) return p;
  return plan.pieces.length - 1;
}

/** What the audit takes besides the track. */
export interface AuditOptions {
  /** Skip the audit: nothing is computed and every figure is NaN. */
  skip?: boolean;
  /**
   * The reference rate the track's departure is measured from (default: the audit's own
   * evaluations of ω). The integrator's recorded nodes (rate-nodes.ts) serve at no new evaluations:
   * ω depends on time only, and the rate the track has is still derived from its attitudes.
   */
  reference?: RateSource;
}

/**
 * Audits attitudes `attitudes` ([w,x,y,z] per time, body → inertial) at ascending `times` (s) of
 * a plan on a model.
 */
export function auditTrack(model: BodyModel, plan: MotionPlan, times: ArrayLike<number>, attitudes: Float64Array, options: AuditOptions = {}): TrackAudit {
  const n = times.length;
  if (options.skip) return { maxAbs: NaN, relative: NaN, peakShapeMomentum: NaN, atTime: 0, points: n, rateEvaluations: 0 };
  const own = options.reference ? null : new PlanRate(model);
  const rate: RateSource = options.reference ?? (own as PlanRate);
  const owner = new Int32Array(n);
  // The reference ω (root frame, rad/s) at every sample.
  const omega = new Float64Array(3 * n);
  for (let k = 0; k < n; k++) {
    const p = pieceIndexAt(plan, times[k]);
    owner[k] = p;
    if (p < 0) continue;
    rate.setPiece(plan.pieces[p]);
    rate.rate(times[k], omega, 3 * k);
  }

  // The track's excess rate on each interval k → k+1 (body frame, rad/s; NaN: none).
  const excess = new Float64Array(3 * Math.max(0, n - 1)).fill(NaN);
  // ω at each interval's midpoint (evaluated once, when a window first needs it).
  const mid = new Float64Array(3 * Math.max(0, n - 1));
  const midDone = new Uint8Array(Math.max(0, n - 1));
  const w = new Float64Array(3 * WINDOW_NODES.length), theta = new Float64Array(3), u = new Float64Array(4), d = new Float64Array(3);
  for (let k = 0; k + 1 < n; k++) {
    const ta = times[k], tb = times[k + 1], dt = tb - ta;
    if (owner[k] < 0 || dt < MIN_DEFECT_INTERVAL_S) continue;
    u[0] = attitudes[4 * k]; u[1] = attitudes[4 * k + 1]; u[2] = attitudes[4 * k + 2]; u[3] = attitudes[4 * k + 3];
    if (k >= 1 && k + 2 < n && owner[k - 1] === owner[k + 2] && dt <= MAX_REINTEGRATION_STEP_S * (1 + EVEN_SPACING)
      && Math.abs(ta - times[k - 1] - dt) <= EVEN_SPACING * dt && Math.abs(times[k + 2] - tb - dt) <= EVEN_SPACING * dt) {
      // Samples k−1 … k+2 lie in one piece (after its start, up to its end), evenly spaced: one Magnus step on the window.
      rate.setPiece(plan.pieces[owner[k + 2]]);
      for (let j = 0; j < 3; j++) {
        const s = k - 1 + j;
        if (!midDone[s]) { rate.rate((times[s] + times[s + 1]) / 2, mid, 3 * s); midDone[s] = 1; }
        for (let c = 0; c < 3; c++) { w[6 * j + c] = omega[3 * s + c]; w[6 * j + 3 + c] = mid[3 * s + c]; }
      }
      w[18] = omega[3 * k + 6]; w[19] = omega[3 * k + 7]; w[20] = omega[3 * k + 8];
      magnusFromWeights(w, WINDOW_M0, WINDOW_M1, WINDOW_M2, WINDOW_NODES.length, dt, theta);
      quatTimesExp(u, 0, theta, 0, u, 0);
    } else {
      // Split at step boundaries (joint rates may jump there): Magnus steps on Gauss–Lobatto nodes.
      for (let p = owner[k]; p <= owner[k + 1]; p++) {
        const piece = plan.pieces[p];
        const u0 = Math.max(ta, piece.t0), u1 = Math.min(tb, piece.t1), span = u1 - u0;
        if (span <= 0) continue;
        rate.setPiece(piece);
        const m = Math.ceil(span / MAX_REINTEGRATION_STEP_S - 1e-9), hs = span / m;
        for (let i = 0; i < m; i++) {
          const v0 = u0 + i * hs, v1 = i === m - 1 ? u1 : u0 + (i + 1) * hs;
          for (let j = 0; j < 4; j++) {
            // End nodes at a sample of this piece reuse its rate; an inner end node, the sub-step before's.
            if (j === 0 && i === 0 && u0 === ta && p === owner[k]) { w[0] = omega[3 * k]; w[1] = omega[3 * k + 1]; w[2] = omega[3 * k + 2]; }
            else if (j === 0 && i > 0) { w[0] = w[9]; w[1] = w[10]; w[2] = w[11]; }
            else if (j === 3 && i === m - 1 && u1 === tb && p === owner[k + 1]) { w[9] = omega[3 * k + 3]; w[10] = omega[3 * k + 4]; w[11] = omega[3 * k + 5]; }
            else rate.rate(j === 3 ? v1 : v0 + LOBATTO_NODES[j] * (v1 - v0), w, 3 * j);
          }
          magnusLobatto(w, v1 - v0, theta);
          quatTimesExp(u, 0, theta, 0, u, 0);
        }
      }
    }
    quatLogBetween(u, 0, attitudes, 4 * (k + 1), d);
    excess[3 * k] = d[0] / dt; excess[3 * k + 1] = d[1] / dt; excess[3 * k + 2] = d[2] / dt;
  }

  // H at each sample with the rate the track has on either side (root frame: the same norm as in the
  // world frame); the peak shape momentum from the same differenced poses.
  const work = createAuditWork(model);
  let maxH = 0, atTime = 0, peakH = 0;
  for (let k = 0; k < n; k++) {
    const p = owner[k];
    if (p < 0) continue;
    w[0] = omega[3 * k]; w[1] = omega[3 * k + 1]; w[2] = omega[3 * k + 2];
    auditAt(model, plan.pieces[p], times[k], w, work);
    const { H, lock: L, shape } = work;
    peakH = Math.max(peakH, Math.sqrt(shape[0] * shape[0] + shape[1] * shape[1] + shape[2] * shape[2]));
    // Without a defect on either side (a lone sample, or intervals under MIN_DEFECT_INTERVAL_S), H as it stands.
    let checked = false;
    for (let side = 0; side < 3; side++) {
      const i = k - 1 + side;
      let ex = 0, ey = 0, ez = 0;
      if (side < 2) {
        if (i < 0 || i >= n - 1 || Number.isNaN(excess[3 * i])) continue;
        // L·δ is what the excess rate δ adds to H.
        ex = excess[3 * i]; ey = excess[3 * i + 1]; ez = excess[3 * i + 2];
        checked = true;
      } else if (checked) break;
      const hx = H[0] + L[0] * ex + L[1] * ey + L[2] * ez;
      const hy = H[1] + L[3] * ex + L[4] * ey + L[5] * ez;
      const hz = H[2] + L[6] * ex + L[7] * ey + L[8] * ez;
      const norm = Math.sqrt(hx * hx + hy * hy + hz * hz);
      if (norm > maxH) { maxH = norm; atTime = times[k]; }
    }
  }
  return { maxAbs: maxH, relative: peakH > 0 ? maxH / peakH : 0, peakShapeMomentum: peakH, atTime, points: n, rateEvaluations: own ? own.evaluations : 0 };
}
