/**
 * The minimum-jerk blend (Flash & Hogan 1985): the path between two rest positions that minimises
 * the integral of squared jerk, s(τ) = 10τ³ − 15τ⁴ + 6τ⁵ for τ = t/T in [0, 1]. The engine's `move`
 * steps, their range and rate checks and the planner's rate sizing all use it from here.
 */

/** Fraction of the way s(τ) = 10τ³ − 15τ⁴ + 6τ⁵ at τ (clamped to [0, 1]). */
export function minimumJerk(tau: number): number {
  const u = tau < 0 ? 0 : tau > 1 ? 1 : tau;
  const u2 = u * u;
  return u2 * u * (10 - 15 * u + 6 * u2);
}

/** ds/dτ = 30τ²(1 − τ)² at τ (clamped to [0, 1]); divide by T for the rate per second. */
export function minimumJerkSlope(tau: number): number {
  const u = tau < 0 ? 0 : tau > 1 ? 1 : tau;
  const u2 = u * u;
  return 30 * u2 * (1 - 2 * u + u2);
}

/** Peak of ds/dτ, reached at τ = ½: 15/8, so a blend's peak rate is 15/8 of its mean rate. */
export const MINIMUM_JERK_PEAK_SLOPE = 15 / 8;
