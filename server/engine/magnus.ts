/**
 * A sixth-order Magnus integrator for an attitude whose body rate depends on time only.
 *
 * With the joint motion prescribed, ω = −I_lock⁻¹h is a function of t alone, so Ṙ = R[ω(t)]× is a
 * linear ODE on SO(3): one step is R(t+h) = R(t)·exp([θ]×), where θ is the Magnus expansion of
 * ω over the step. This evaluates ω only at the three Gauss–Legendre nodes of each step (no
 * intermediate attitudes: the stages are independent of the state), stays on the unit sphere by
 * construction, and estimates the local error by the fourth-order truncation of the same series
 * (embedded: no extra evaluations).
 *
 * Formulas: S. Blanes, F. Casas, J. Ros, "Improved high order integrators based on the Magnus
 * expansion", BIT 40 (2000) 434–450, and S. Blanes, F. Casas, J.A. Oteo, J. Ros, "The Magnus
 * expansion and some of its applications", Phys. Rep. 470 (2009), §4 (the three-node sixth-order
 * method written with the moments α₁, α₂, α₃), for Y' = A(t)Y with A = −[ω]× acting on Y = Rᵀ;
 * the commutator of so(3) is the cross product, [[a]×, [b]×] = [a × b]×.
 */

/** Gauss–Legendre nodes on [0, 1] (three points: exact quadrature to degree 5). */
export const GAUSS_NODES = [0.5 - Math.sqrt(15) / 10, 0.5, 0.5 + Math.sqrt(15) / 10] as const;

const SQRT15_3 = Math.sqrt(15) / 3;

/**
 * Rotation vector of one Magnus step (rad, in the body frame at the step's start): from ω at the
 * three Gauss nodes (`w`: node-major, 9 numbers from `o`, rad/s) over `h` seconds. Writes θ to
 * out[0..2]. The body then turns by R ← R·exp([θ]×).
 */
export function magnusTheta(w: ArrayLike<number>, o: number, h: number, out: Float64Array): void {
  const k2 = h * SQRT15_3, k3 = (10 * h) / 3;
  magnusFromMoments(
    h * w[o + 3], h * w[o + 4], h * w[o + 5],
    k2 * (w[o + 6] - w[o]), k2 * (w[o + 7] - w[o + 1]), k2 * (w[o + 8] - w[o + 2]),
    k3 * (w[o + 6] - 2 * w[o + 3] + w[o]), k3 * (w[o + 7] - 2 * w[o + 4] + w[o + 1]), k3 * (w[o + 8] - 2 * w[o + 5] + w[o + 2]),
    out, 0,
  );
}

/**
 * The sixth-order Magnus rotation vector from the three combinations of ω's moments over a step
 * (rad): β₁ ≈ h·ω(mid), β₂ ≈ 12·∫(τ/h − ½)ω dτ, β₃ ≈ 180·∫(τ/h − ½)²ω dτ − 15·∫ω dτ (the
 * reference's α = −β, since A = −[ω]×). Writes θ to out[oo..oo+2].
 */
export function magnusFromMoments(
  b1x: number, b1y: number, b1z: number, b2x: number, b2y: number, b2z: number, b3x: number, b3y: number, b3z: number,
  out: Float64Array, oo: number,
): void {
  // C₁ = α₁ × α₂ = β₁ × β₂.
  const c1x = b1y * b2z - b1z * b2y, c1y = b1z * b2x - b1x * b2z, c1z = b1x * b2y - b1y * b2x;
  // C₂ = −(1/60) α₁ × (2α₃ + C₁), written for β: −(1/60) β₁ × (2β₃ − C₁).
  const ux = 2 * b3x - c1x, uy = 2 * b3y - c1y, uz = 2 * b3z - c1z;
  const c2x = -(b1y * uz - b1z * uy) / 60, c2y = -(b1z * ux - b1x * uz) / 60, c2z = -(b1x * uy - b1y * ux) / 60;
  // θ = −Ω = β₁ + β₃/12 + (1/240)(20β₁ + β₃ + C₁) × (β₂ − C₂).
  const px = 20 * b1x + b3x + c1x, py = 20 * b1y + b3y + c1y, pz = 20 * b1z + b3z + c1z;
  const qx = b2x - c2x, qy = b2y - c2y, qz = b2z - c2z;
  out[oo] = b1x + b3x / 12 + (py * qz - pz * qy) / 240;
  out[oo + 1] = b1y + b3y / 12 + (pz * qx - px * qz) / 240;
  out[oo + 2] = b1z + b3z / 12 + (px * qy - py * qx) / 240;
}

/**
 * out = q ⊗ exp(θ/2) for a unit quaternion q [w,x,y,z] (from `qo`) and a body-frame rotation
 * vector θ (rad, from `to`), renormalised; out may alias q.
 */
export function quatTimesExp(q: ArrayLike<number>, qo: number, theta: ArrayLike<number>, to: number, out: Float64Array, oo: number): void {
  const tx = theta[to], ty = theta[to + 1], tz = theta[to + 2];
  const a = Math.sqrt(tx * tx + ty * ty + tz * tz);
  const half = a / 2;
  // sin(a/2)/a, with its series below 1e-4 rad (error < 1e-18).
  const k = a > 1e-4 ? Math.sin(half) / a : 0.5 - (a * a) / 48;
  const c = Math.cos(half);
  const ex = tx * k, ey = ty * k, ez = tz * k;
  const q0 = q[qo], q1 = q[qo + 1], q2 = q[qo + 2], q3 = q[qo + 3];
  const r0 = q0 * c - q1 * ex - q2 * ey - q3 * ez;
  const r1 = q0 * ex + q1 * c + q2 * ez - q3 * ey;
  const r2 = q0 * ey - q1 * ez + q2 * c + q3 * ex;
  const r3 = q0 * ez + q1 * ey - q2 * ex + q3 * c;
  const n = Math.sqrt(r0 * r0 + r1 * r1 + r2 * r2 + r3 * r3);
  out[oo] = r0 / n; out[oo + 1] = r1 / n; out[oo + 2] = r2 / n; out[oo + 3] = r3 / n;
}

/**
 * Body-frame rotation vector θ (rad) with exp(θ/2) = q⁻¹ ⊗ p for unit quaternions q and p
 * ([w,x,y,z]); the short way round. Writes out[0..2].
 */
export function quatLogBetween(q: ArrayLike<number>, qo: number, p: ArrayLike<number>, po: number, out: Float64Array): void {
  const a0 = q[qo], a1 = -q[qo + 1], a2 = -q[qo + 2], a3 = -q[qo + 3];
  const b0 = p[po], b1 = p[po + 1], b2 = p[po + 2], b3 = p[po + 3];
  let w = a0 * b0 - a1 * b1 - a2 * b2 - a3 * b3;
  let x = a0 * b1 + a1 * b0 + a2 * b3 - a3 * b2;
  let y = a0 * b2 - a1 * b3 + a2 * b0 + a3 * b1;
  let z = a0 * b3 + a1 * b2 - a2 * b1 + a3 * b0;
  if (w < 0) { w = -w; x = -x; y = -y; z = -z; }
  const s = Math.sqrt(x * x + y * y + z * z);
  // θ = 2·atan2(s, w)·v/s, with its series for tiny s (atan2 keeps full precision near 0).
  const k = s > 1e-8 ? (2 * Math.atan2(s, w)) / s : 2 / w;
  out[0] = x * k; out[1] = y * k; out[2] = z * k;
}

/** Nodes the local error estimate looks back over (this step's three and four before them). */
export const ESTIMATE_NODES = 7;

/** Scratch of the local error estimate. */
export interface EstimateWork {
  /** Node positions relative to the step's midpoint, in step lengths. */
  y: Float64Array;
  /** Divided differences of ω, 3 per node. */
  m: Float64Array;
  /** θ from the moments of the polynomial through all the nodes, rad. */
  theta: Float64Array;
}

/** Allocates estimate scratch. */
export function createEstimateWork(): EstimateWork {
  return { y: new Float64Array(ESTIMATE_NODES), m: new Float64Array(3 * ESTIMATE_NODES), theta: new Float64Array(3) };
}

/** ∫ y^k dy over [−½, ½], k = 0 … ESTIMATE_NODES + 1. */
const CENTRED_MOMENTS = Float64Array.from({ length: ESTIMATE_NODES + 2 }, (_, k) => (k % 2 === 1 ? 0 : (2 * Math.pow(0.5, k + 1)) / (k + 1)));

/**
 * Local error estimate (rad) of the Magnus step [t, t+h] with rotation vector θ, whose ω at its
 * three Gauss nodes are the last three of the seven nodes (`ts`, s, ascending; `ws`, rad/s, 3 per
 * node); the four before them belong to the preceding steps of the same smooth stretch. The same
 * sixth-order formula is fed with the moments ∫(τ/h − ½)ⁿω dτ (n = 0, 1, 2) of the degree-6
 * polynomial through all seven nodes instead of the Gauss sums; the difference is the Gauss
 * quadrature's error on that polynomial, i.e. the leading term of the step's own quadrature error
 * (h⁷ω⁽⁶⁾/2016000 for ∫ω; Abramowitz & Stegun 25.4.30), including what it does to the
 * commutator terms. (Nodes that include the step's Gauss nodes cannot give a degree-5 estimate:
 * the Gauss rule integrates that exactly.)
 */
export function localErrorEstimate(ts: ArrayLike<number>, ws: ArrayLike<number>, h: number, theta: ArrayLike<number>, work: EstimateWork): number {
  const { y, m: d } = work;
  const N = ESTIMATE_NODES;
  const mid = ts[N - 2];
  for (let k = 0; k < N; k++) y[k] = (ts[k] - mid) / h;
  // The polynomial through the nodes in Newton form (divided differences dⱼ, basis Nⱼ(y) = Π_{i<j}(y − yᵢ)),
  // then its moments Bₙ/h = ∫ yⁿ p(y) dy = Σⱼ dⱼ ∫ yⁿ Nⱼ(y) dy over [−½, ½] (O(N²), no linear system).
  for (let k = 0; k < 3 * N; k++) d[k] = ws[k];
  newtonDifferences7(y, 0, d);
  // Nⱼ's coefficients on locals (n_q = 0 above degree j: the full sums and updates below add and
  // keep exact zeros, so they equal the triangular ones); odd centred moments vanish.
  const M0 = CENTRED_MOMENTS[0], M2 = CENTRED_MOMENTS[2], M4 = CENTRED_MOMENTS[4], M6 = CENTRED_MOMENTS[6], M8 = CENTRED_MOMENTS[8];
  let n0 = 1, n1 = 0, n2 = 0, n3 = 0, n4 = 0, n5 = 0, n6 = 0, n7 = 0;
  let p0x = 0, p0y = 0, p0z = 0, p1x = 0, p1y = 0, p1z = 0, p2x = 0, p2y = 0, p2z = 0;
  for (let j = 0; j < N; j++) {
    // ∫ yⁿ Nⱼ(y) dy from Nⱼ's monomial coefficients (degree j).
    const a0 = n0 * M0 + n2 * M2 + n4 * M4 + n6 * M6, a1 = n1 * M2 + n3 * M4 + n5 * M6, a2 = n0 * M2 + n2 * M4 + n4 * M6 + n6 * M8;
    const fx = d[3 * j], fy = d[3 * j + 1], fz = d[3 * j + 2];
    p0x += a0 * fx; p0y += a0 * fy; p0z += a0 * fz;
    p1x += a1 * fx; p1y += a1 * fy; p1z += a1 * fz;
    p2x += a2 * fx; p2y += a2 * fy; p2z += a2 * fz;
    // Nⱼ₊₁ = Nⱼ·(y − yⱼ).
    const yj = y[j];
    n7 = n6 - yj * n7; n6 = n5 - yj * n6; n5 = n4 - yj * n5; n4 = n3 - yj * n4; n3 = n2 - yj * n3; n2 = n1 - yj * n2; n1 = n0 - yj * n1; n0 = -yj * n0;
  }
  // β₁ = h(9/4 B₀ − 15 B₂), β₂ = 12h B₁, β₃ = h(180 B₂ − 15 B₀).
  magnusFromMoments(
    h * (2.25 * p0x - 15 * p2x), h * (2.25 * p0y - 15 * p2y), h * (2.25 * p0z - 15 * p2z),
    12 * h * p1x, 12 * h * p1y, 12 * h * p1z,
    h * (180 * p2x - 15 * p0x), h * (180 * p2y - 15 * p0y), h * (180 * p2z - 15 * p0z),
    work.theta, 0,
  );
  const ex = work.theta[0] - theta[0], ey = work.theta[1] - theta[1], ez = work.theta[2] - theta[2];
  return Math.sqrt(ex * ex + ey * ey + ez * ez);
}

/** Gauss–Lobatto nodes on [0, 1] (four points, both ends included: exact quadrature to degree 5). */
export const LOBATTO_NODES = [0, 0.5 - Math.sqrt(5) / 10, 0.5 + Math.sqrt(5) / 10, 1] as const;
const LOBATTO_WEIGHTS = [1 / 12, 5 / 12, 5 / 12, 1 / 12] as const;
/** Each Lobatto node's weights in the moments ∫(τ/h − ½)ⁿ ω dτ / h, n = 0, 1, 2 (for magnusFromWeights). */
const LOBATTO_M0 = Float64Array.from(LOBATTO_WEIGHTS);
const LOBATTO_M1 = LOBATTO_M0.map((a, k) => a * (LOBATTO_NODES[k] - 0.5));
const LOBATTO_M2 = LOBATTO_M1.map((b, k) => b * (LOBATTO_NODES[k] - 0.5));

/**
 * The sixth-order Magnus rotation vector (rad) over a step of h seconds from ω at the four
 * Gauss–Lobatto nodes (`w`: node-major, 12 numbers, rad/s), through the moments of ω (any
 * quadrature of order six serves; Blanes, Casas & Ros 2000). Its end nodes are shared with the
 * neighbouring steps: the momentum audit re-integrates between samples with it, independently of
 * the integrator's Gauss nodes. Writes θ to out[0..2].
 */
export function magnusLobatto(w: ArrayLike<number>, h: number, out: Float64Array): void {
  magnusFromWeights(w, LOBATTO_M0, LOBATTO_M1, LOBATTO_M2, 4, h, out);
}

/**
 * The sixth-order Magnus rotation vector (rad) over a step of h seconds from ω at `count` nodes
 * (`w`: node-major, 3 per node, rad/s) and each node's weights in the three moments
 * ∫(τ/h − ½)ⁿ ω dτ / h (n = 0, 1, 2: `m0`, `m1`, `m2`) — any interpolatory rule exact to degree 5
 * on the step serves, including one whose nodes lie outside it. Writes θ to out[0..2].
 */
export function magnusFromWeights(w: ArrayLike<number>, m0: ArrayLike<number>, m1: ArrayLike<number>, m2: ArrayLike<number>, count: number, h: number, out: Float64Array): void {
  let p0x = 0, p0y = 0, p0z = 0, p1x = 0, p1y = 0, p1z = 0, p2x = 0, p2y = 0, p2z = 0;
  for (let k = 0; k < count; k++) {
    const a = m0[k], b = m1[k], c = m2[k];
    const fx = w[3 * k], fy = w[3 * k + 1], fz = w[3 * k + 2];
    p0x += a * fx; p0y += a * fy; p0z += a * fz;
    p1x += b * fx; p1y += b * fy; p1z += b * fz;
    p2x += c * fx; p2y += c * fy; p2z += c * fz;
  }
  magnusFromMoments(
    h * (2.25 * p0x - 15 * p2x), h * (2.25 * p0y - 15 * p2y), h * (2.25 * p0z - 15 * p2z),
    12 * h * p1x, 12 * h * p1y, 12 * h * p1z,
    h * (180 * p2x - 15 * p0x), h * (180 * p2y - 15 * p0y), h * (180 * p2z - 15 * p0z),
    out, 0,
  );
}

/**
 * Weights of the moments ∫ yⁿ p(y) dy over [a, b] (n = 0, 1, 2) of the polynomial p through values
 * at `nodes` (any distinct points): solves Σₖ Wₖ⁽ⁿ⁾ yₖʲ = ∫ y^(n+j) dy, j = 0 … count − 1.
 */
export function momentWeights(nodes: readonly number[], a: number, b: number): [Float64Array, Float64Array, Float64Array] {
  const N = nodes.length, W = N + 3, m = new Float64Array(N * W);
  const integral = (k: number) => (Math.pow(b, k + 1) - Math.pow(a, k + 1)) / (k + 1);
  for (let j = 0; j < N; j++) {
    for (let k = 0; k < N; k++) m[W * j + k] = Math.pow(nodes[k], j);
    m[W * j + N] = integral(j); m[W * j + N + 1] = integral(j + 1); m[W * j + N + 2] = integral(j + 2);
  }
  solveAugmented(m, N);
  const out: [Float64Array, Float64Array, Float64Array] = [new Float64Array(N), new Float64Array(N), new Float64Array(N)];
  for (let k = 0; k < N; k++) for (let n = 0; n < 3; n++) out[n][k] = m[W * k + N + n];
  return out;
}

/** The degree-6 polynomial through ω at seven nodes, for attitudes inside a step without new evaluations. */
export interface RatePolynomial {
  /** Centre and half-span of the nodes, s: u = (t − centre)/scale ∈ [−1, 1]. */
  centre: number;
  scale: number;
  /** Coefficients of u⁰ … u⁶, 3 per power (rad/s). */
  c: Float64Array;
  /** Scratch: the scaled node positions, and the divided differences / the coefficients shifted to an interval's midpoint. */
  m: Float64Array;
  d: Float64Array;
}

/** Allocates a rate polynomial. */
export function createRatePolynomial(): RatePolynomial {
  return { centre: 0, scale: 1, c: new Float64Array(3 * ESTIMATE_NODES), m: new Float64Array(ESTIMATE_NODES), d: new Float64Array(3 * ESTIMATE_NODES) };
}

/**
 * Fits the polynomial through seven nodes from index `first` (`ts`, s; `ws`, rad/s, 3 per node).
 */
export function fitRatePolynomial(ts: ArrayLike<number>, ws: ArrayLike<number>, first: number, poly: RatePolynomial): void {
  const N = ESTIMATE_NODES, { m: u, d, c } = poly;
  let lo = Infinity, hi = -Infinity;
  for (let k = first; k < first + N; k++) { lo = Math.min(lo, ts[k]); hi = Math.max(hi, ts[k]); }
  poly.centre = (lo + hi) / 2;
  poly.scale = (hi - lo) / 2;
  for (let k = 0; k < N; k++) u[k] = (ts[first + k] - poly.centre) / poly.scale;
  for (let k = 0; k < 3 * N; k++) d[k] = ws[3 * first + k];
  newtonDifferences7(u, 0, d);
  // Newton form to monomials, innermost first: p ← p·(u − uⱼ) + dⱼ for j = N−2 … 0 (per component, on locals).
  const u0 = u[0], u1 = u[1], u2 = u[2], u3 = u[3], u4 = u[4], u5 = u[5];
  for (let k = 0; k < 3; k++) {
    let c0 = d[18 + k], c1 = 0, c2 = 0, c3 = 0, c4 = 0, c5 = 0, c6 = 0;
    c1 = c0 - u5 * c1; c0 = d[15 + k] - u5 * c0;
    c2 = c1 - u4 * c2; c1 = c0 - u4 * c1; c0 = d[12 + k] - u4 * c0;
    c3 = c2 - u3 * c3; c2 = c1 - u3 * c2; c1 = c0 - u3 * c1; c0 = d[9 + k] - u3 * c0;
    c4 = c3 - u2 * c4; c3 = c2 - u2 * c3; c2 = c1 - u2 * c2; c1 = c0 - u2 * c1; c0 = d[6 + k] - u2 * c0;
    c5 = c4 - u1 * c5; c4 = c3 - u1 * c4; c3 = c2 - u1 * c3; c2 = c1 - u1 * c2; c1 = c0 - u1 * c1; c0 = d[3 + k] - u1 * c0;
    c6 = c5 - u0 * c6; c5 = c4 - u0 * c5; c4 = c3 - u0 * c4; c3 = c2 - u0 * c3; c2 = c1 - u0 * c2; c1 = c0 - u0 * c1; c0 = d[k] - u0 * c0;
    c[k] = c0; c[3 + k] = c1; c[6 + k] = c2; c[9 + k] = c3; c[12 + k] = c4; c[15 + k] = c5; c[18 + k] = c6;
  }
}

/**
 * Divided differences in place (Newton's interpolation form) for the seven nodes x[xo … xo+6]: on
 * entry d holds the values there (3 per node), on exit d[3j … 3j+2] = f[x₀ … xⱼ]. Written out for
 * seven nodes (the integrator calls it for every step and every sampled step): the reciprocals of
 * the node gaps once, then each component's table on locals — the same operations, in the same
 * order, as the textbook double loop.
 */
function newtonDifferences7(x: ArrayLike<number>, xo: number, d: Float64Array): void {
  const x0 = x[xo], x1 = x[xo + 1], x2 = x[xo + 2], x3 = x[xo + 3], x4 = x[xo + 4], x5 = x[xo + 5], x6 = x[xo + 6];
  // r{j}{k} = 1/(x_k − x_{k−j}).
  const r16 = 1 / (x6 - x5), r15 = 1 / (x5 - x4), r14 = 1 / (x4 - x3), r13 = 1 / (x3 - x2), r12 = 1 / (x2 - x1), r11 = 1 / (x1 - x0);
  const r26 = 1 / (x6 - x4), r25 = 1 / (x5 - x3), r24 = 1 / (x4 - x2), r23 = 1 / (x3 - x1), r22 = 1 / (x2 - x0);
  const r36 = 1 / (x6 - x3), r35 = 1 / (x5 - x2), r34 = 1 / (x4 - x1), r33 = 1 / (x3 - x0);
  const r46 = 1 / (x6 - x2), r45 = 1 / (x5 - x1), r44 = 1 / (x4 - x0);
  const r56 = 1 / (x6 - x1), r55 = 1 / (x5 - x0);
  const r66 = 1 / (x6 - x0);
  for (let c = 0; c < 3; c++) {
    const d0 = d[c];
    let d1 = d[3 + c], d2 = d[6 + c], d3 = d[9 + c], d4 = d[12 + c], d5 = d[15 + c], d6 = d[18 + c];
    d6 = (d6 - d5) * r16; d5 = (d5 - d4) * r15; d4 = (d4 - d3) * r14; d3 = (d3 - d2) * r13; d2 = (d2 - d1) * r12; d1 = (d1 - d0) * r11;
    d6 = (d6 - d5) * r26; d5 = (d5 - d4) * r25; d4 = (d4 - d3) * r24; d3 = (d3 - d2) * r23; d2 = (d2 - d1) * r22;
    d6 = (d6 - d5) * r36; d5 = (d5 - d4) * r35; d4 = (d4 - d3) * r34; d3 = (d3 - d2) * r33;
    d6 = (d6 - d5) * r46; d5 = (d5 - d4) * r45; d4 = (d4 - d3) * r44;
    d6 = (d6 - d5) * r56; d5 = (d5 - d4) * r55;
    d6 = (d6 - d5) * r66;
    d[3 + c] = d1; d[6 + c] = d2; d[9 + c] = d3; d[12 + c] = d4; d[15 + c] = d5; d[18 + c] = d6;
  }
}

/**
 * The sixth-order Magnus rotation vector (rad) over [a, b] (s) of the fitted polynomial rate, from
 * its exact moments. Writes out[0..2].
 */
export function polynomialTheta(poly: RatePolynomial, a: number, b: number, out: Float64Array): void {
  const { c, d } = poly, S = poly.scale;
  const um = ((a + b) / 2 - poly.centre) / S, r = (b - a) / (2 * S), sigma = b - a;
  // Bₙ = ∫ ((t − t_mid)/σ)ⁿ ω dt = S^(n+1)/σⁿ Σ_j d_j ∫_{−r}^{r} v^(n+j) dv, with the integrals
  // 2r^(j+n+1)/(j+n+1) for even j+n (rp = r^(j+1), running).
  const r2 = r * r;
  const rp0 = r, rp1 = rp0 * r, rp2 = rp1 * r, rp3 = rp2 * r, rp4 = rp3 * r, rp5 = rp4 * r, rp6 = rp5 * r;
  const a00 = (2 * rp0) / 1, a20 = (2 * rp0 * r2) / 3, a11 = (2 * rp1 * r) / 3, a02 = (2 * rp2) / 3, a22 = (2 * rp2 * r2) / 5, a13 = (2 * rp3 * r) / 5;
  const a04 = (2 * rp4) / 5, a24 = (2 * rp4 * r2) / 7, a15 = (2 * rp5 * r) / 7, a06 = (2 * rp6) / 7, a26 = (2 * rp6 * r2) / 9;
  for (let k = 0; k < 3; k++) {
    let e0 = c[k], e1 = c[3 + k], e2 = c[6 + k], e3 = c[9 + k], e4 = c[12 + k], e5 = c[15 + k];
    const e6 = c[18 + k];
    // Taylor shift to the interval's midpoint: p(u) = Σ e_j (u − um)^j (repeated synthetic division, on locals).
    e5 += um * e6; e4 += um * e5; e3 += um * e4; e2 += um * e3; e1 += um * e2; e0 += um * e1;
    e5 += um * e6; e4 += um * e5; e3 += um * e4; e2 += um * e3; e1 += um * e2;
    e5 += um * e6; e4 += um * e5; e3 += um * e4; e2 += um * e3;
    e5 += um * e6; e4 += um * e5; e3 += um * e4;
    e5 += um * e6; e4 += um * e5;
    e5 += um * e6;
    d[k] = e0 * a00 + e2 * a02 + e4 * a04 + e6 * a06;
    d[3 + k] = e1 * a11 + e3 * a13 + e5 * a15;
    d[6 + k] = e0 * a20 + e2 * a22 + e4 * a24 + e6 * a26;
  }
  const k0 = S, k1 = (S * S) / sigma, k2 = (S * S * S) / (sigma * sigma);
  const b0x = d[0] * k0, b0y = d[1] * k0, b0z = d[2] * k0, b1x = d[3] * k1, b1y = d[4] * k1, b1z = d[5] * k1, b2x = d[6] * k2, b2y = d[7] * k2, b2z = d[8] * k2;
  magnusFromMoments(
    2.25 * b0x - 15 * b2x, 2.25 * b0y - 15 * b2y, 2.25 * b0z - 15 * b2z,
    12 * b1x, 12 * b1y, 12 * b1z,
    180 * b2x - 15 * b0x, 180 * b2y - 15 * b0y, 180 * b2z - 15 * b0z,
    out, 0,
  );
}

/** Solves an N×N system with 3 right-hand sides in place (rows of [A | b₁ b₂ b₃]; partial pivoting); solutions in the last 3 columns. */
function solveAugmented(m: Float64Array, N: number): void {
  const W = N + 3;
  for (let c = 0; c < N; c++) {
    let piv = c;
    for (let j = c + 1; j < N; j++) if (Math.abs(m[W * j + c]) > Math.abs(m[W * piv + c])) piv = j;
    if (piv !== c) for (let k = 0; k < W; k++) { const tmp = m[W * c + k]; m[W * c + k] = m[W * piv + k]; m[W * piv + k] = tmp; }
    const dd = m[W * c + c];
    for (let j = c + 1; j < N; j++) {
      const f = m[W * j + c] / dd;
      if (f !== 0) for (let k = c; k < W; k++) m[W * j + k] -= f * m[W * c + k];
    }
  }
  for (let c = N - 1; c >= 0; c--) {
    for (let r = N; r < W; r++) {
      let s = m[W * c + r];
      for (let k = c + 1; k < N; k++) s -= m[W * c + k] * m[W * k + r];
      m[W * c + r] = s / m[W * c + c];
    }
  }
}
