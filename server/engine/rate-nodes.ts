/**
 * The integrator's accepted nodes — ω(t) at the Gauss nodes of its accepted steps, recorded piece
 * by piece — and ω between them by interpolation: the momentum audit's reference rate, at no new
 * evaluations. ω depends on time only (the joint motion is prescribed), so these values carry none
 * of the integrator's state (its attitudes, steps or interpolant); the audit still derives the rate
 * the track actually has from the integrated attitudes (track-audit.ts).
 */
import type { RateSource } from './integrate-attitude.ts';
import type { MotionPiece, MotionPlan } from './joint-motion.ts';

/** Nodes of the interpolating polynomial (degree 6: the order of the integrator's own estimate). */
const WINDOW = 7;

/** Recorded nodes of one integration, and ω between them (a RateSource over the same plan). */
export class RateNodes implements RateSource {
  /** Node times, s, ascending within each piece. */
  private t: Float64Array;
  /** ω at the nodes, rad/s (root frame), 3 per node. */
  private w: Float64Array;
  private count = 0;
  /** Per piece: its first node and one past its last (equal: no nodes, e.g. a hold). */
  private readonly first: Int32Array;
  private readonly end: Int32Array;
  private readonly pieces: readonly MotionPiece[];
  /** The piece `rate` reads. */
  private piece = -1;
  /**
   * Barycentric weights of each window, WINDOW per first node, made when a window is first read and
   * kept (the audit reads each window for its samples and again for the midpoints between them);
   * `lambdaSize[s]`: the size of the window at s they were made for (0: none). Dropped when a node is added.
   */
  private lambda: Float64Array | null = null;
  private lambdaSize: Uint8Array | null = null;

  constructor(plan: MotionPlan, capacity = 1024) {
    this.pieces = plan.pieces;
    this.first = new Int32Array(plan.pieces.length);
    this.end = new Int32Array(plan.pieces.length);
    this.t = new Float64Array(capacity);
    this.w = new Float64Array(3 * capacity);
  }

  /** Nodes recorded so far. */
  get size(): number {
    return this.count;
  }

  /** Records ω (w[o..o+2], rad/s) at time t (s) of piece p; nodes of a piece come in ascending time, pieces in order. */
  add(p: number, t: number, w: ArrayLike<number>, o: number): void {
    if (this.count === this.t.length) {
      const t2 = new Float64Array(2 * this.count), w2 = new Float64Array(6 * this.count);
      t2.set(this.t); w2.set(this.w);
      this.t = t2; this.w = w2;
    }
    this.lambda = null; this.lambdaSize = null;
    if (this.first[p] === this.end[p]) this.first[p] = this.end[p] = this.count;
    const i = this.count++;
    this.t[i] = t;
    this.w[3 * i] = w[o]; this.w[3 * i + 1] = w[o + 1]; this.w[3 * i + 2] = w[o + 2];
    this.end[p] = this.count;
  }

  setPiece(piece: MotionPiece): void {
    const ps = this.pieces, p = this.piece;
    if (p >= 0 && ps[p] === piece) return;
    // Audits walk the pieces in order: try the next one before searching.
    const next = p + 1 < ps.length && ps[p + 1] === piece ? p + 1 : ps.indexOf(piece);
    if (next < 0) throw new Error('RateNodes: piece not in the plan');
    this.piece = next;
  }

  /**
   * ω (rad/s) at time t of the current piece into out[o..o+2]: the polynomial through the seven
   * nodes of the piece nearest t (fewer if the piece has fewer), in barycentric form; zero in a
   * piece without nodes (nothing moves).
   */
  rate(t: number, out: Float64Array, o: number): void {
    const p = this.piece;
    if (p < 0) throw new Error('RateNodes: no piece selected');
    const a = this.first[p], b = this.end[p], T = this.t, W = this.w;
    if (a === b) { out[o] = 0; out[o + 1] = 0; out[o + 2] = 0; return; }
    const m = Math.min(WINDOW, b - a);
    // i: the first node at or after t (binary search).
    let lo = a, hi = b;
    while (lo < hi) { const mid = (lo + hi) >> 1; if (T[mid] < t) lo = mid + 1; else hi = mid; }
    // The window that keeps t nearest its middle node, inside the piece.
    let s = lo > a && lo < b && t - T[lo - 1] < T[lo] - t ? lo - (m >> 1) - 1 : lo - (m >> 1);
    if (s < a) s = a;
    if (s > b - m) s = b - m;
    if (!this.lambda || !this.lambdaSize) { this.lambda = new Float64Array(WINDOW * this.count); this.lambdaSize = new Uint8Array(this.count); }
    const lam = this.lambda, l0 = WINDOW * s;
    if (this.lambdaSize[s] !== m) {
      for (let j = 0; j < m; j++) {
        let d = 1;
        const tj = T[s + j];
        for (let k = 0; k < m; k++) if (k !== j) d *= tj - T[s + k];
        lam[l0 + j] = 1 / d;
      }
      this.lambdaSize[s] = m;
    }
    let den = 0, x = 0, y = 0, z = 0;
    for (let j = 0; j < m; j++) {
      const e = t - T[s + j], n = 3 * (s + j);
      if (e === 0) { out[o] = W[n]; out[o + 1] = W[n + 1]; out[o + 2] = W[n + 2]; return; }
      const c = lam[l0 + j] / e;
      den += c; x += c * W[n]; y += c * W[n + 1]; z += c * W[n + 2];
    }
    out[o] = x / den; out[o + 1] = y / den; out[o + 2] = z / den;
  }
}
