/**
 * Natural cubic spline (second derivative zero at both ends) through (x_i, y_i). The coefficients
 * come from commons-math-interpolation, a port of Apache Commons Math's SplineInterpolator (a
 * well-known natural-spline implementation), so the product does not carry its own tridiagonal solver.
 */
import { computeCubicPolyCoefficients } from 'commons-math-interpolation';

/** A piecewise cubic: on [x_i, x_{i+1}], y = a + b·u + c·u² + d·u³ with u = x − x_i. */
export interface CubicSpline {
  /** Knots x_0 < x_1 < … < x_n (n + 1 of them). */
  readonly knots: Float64Array;
  /** Four coefficients a, b, c, d per interval (4n entries), in y's units per power of x's. */
  readonly coeffs: Float64Array;
}

/** Fewest points a track or an imported column may have. */
export const MIN_SPLINE_POINTS = 4;

/**
 * The natural cubic spline through the points. `x` must be strictly increasing and finite, with at
 * least 3 points (callers validate first: this throws on bad input).
 */
export function naturalCubicSpline(x: ArrayLike<number>, y: ArrayLike<number>): CubicSpline {
  const blocks = computeCubicPolyCoefficients(x, y);
  const coeffs = new Float64Array(4 * blocks.length);
  // The package trims trailing zero coefficients: missing entries are zeros.
  blocks.forEach((c, i) => { for (let k = 0; k < c.length; k++) coeffs[4 * i + k] = c[k]; });
  return { knots: Float64Array.from(x), coeffs };
}

/** Index of the interval holding x (clamped to the first and last interval). */
function splineInterval(s: CubicSpline, x: number): number {
  const n = s.knots.length - 1;
  let lo = 0, hi = n - 1;
  if (x <= s.knots[0]) return 0;
  if (x >= s.knots[n - 1]) return n - 1;
  // Binary search: knots[lo] ≤ x < knots[hi + 1].
  while (lo < hi) {
    const mid = (lo + hi + 1) >> 1;
    if (s.knots[mid] <= x) lo = mid; else hi = mid - 1;
  }
  return lo;
}

/** Value of the spline at x (extrapolates the end cubics outside [x_0, x_n]). */
export function splineValue(s: CubicSpline, x: number): number {
  const i = splineInterval(s, x), u = x - s.knots[i], c = s.coeffs;
  return c[4 * i] + u * (c[4 * i + 1] + u * (c[4 * i + 2] + u * c[4 * i + 3]));
}

/** First derivative of the spline at x. */
export function splineSlope(s: CubicSpline, x: number): number {
  const i = splineInterval(s, x), u = x - s.knots[i], c = s.coeffs;
  return c[4 * i + 1] + u * (2 * c[4 * i + 2] + 3 * u * c[4 * i + 3]);
}

/** Second derivative of the spline at x. */
export function splineCurvature(s: CubicSpline, x: number): number {
  const i = splineInterval(s, x), u = x - s.knots[i], c = s.coeffs;
  return 2 * c[4 * i + 2] + 6 * u * c[4 * i + 3];
}

/** Uniform knots 0, 1/rate, …, (n − 1)/rate (s). */
export function uniformKnots(n: number, rateHz: number): Float64Array {
  const out = new Float64Array(n);
  for (let k = 0; k < n; k++) out[k] = k / rateHz;
  return out;
}

/** Resamples a spline at a uniform rate from x_0 to x_n: floor((x_n − x_0)·rate) + 1 values. */
export function resampleUniform(s: CubicSpline, rateHz: number): number[] {
  const x0 = s.knots[0], span = s.knots[s.knots.length - 1] - x0;
  const n = Math.floor(span * rateHz + 1e-9);
  const out: number[] = [];
  for (let k = 0; k <= n; k++) out.push(splineValue(s, x0 + k / rateHz));
  return out;
}
