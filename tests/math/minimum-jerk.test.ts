/**
 * The minimum-jerk blend against its closed form (Flash & Hogan 1985): s(τ) = 10τ³ − 15τ⁴ + 6τ⁵ is
 * the quintic with s(0) = 0, s(1) = 1 and zero velocity and acceleration at both ends; its peak
 * slope is 15/8 at τ = ½.
 */
import { describe, expect, it } from 'vitest';

import { MINIMUM_JERK_PEAK_SLOPE, minimumJerk, minimumJerkSlope } from '../../shared/math/minimum-jerk.ts';

const H = 1e-5;
const slopeFd = (t: number) => (minimumJerk(t + H) - minimumJerk(t - H)) / (2 * H);

describe('minimum-jerk blend', () => {
  it('ends: s(0) = 0, s(1) = 1, clamped outside [0, 1]', () => {
    expect(minimumJerk(0)).toBe(0);
    expect(minimumJerk(1)).toBe(1);
    expect(minimumJerk(-0.5)).toBe(0);
    expect(minimumJerk(1.5)).toBe(1);
  });

  it('symmetric about the midpoint: s(½) = ½ and s(1 − τ) = 1 − s(τ)', () => {
    expect(minimumJerk(0.5)).toBe(0.5);
    for (const t of [0.1, 0.23, 0.4]) expect(minimumJerk(1 - t)).toBeCloseTo(1 - minimumJerk(t), 15);
  });

  it('the slope equals the central difference of s and the closed form 30τ²(1 − τ)²', () => {
    for (const t of [0.05, 0.3, 0.5, 0.77, 0.95]) {
      expect(minimumJerkSlope(t)).toBeCloseTo(slopeFd(t), 8);
      expect(minimumJerkSlope(t)).toBeCloseTo(30 * t * t * (1 - t) ** 2, 14);
    }
  });

  it('rest at both ends: zero velocity and zero acceleration at τ = 0 and τ = 1', () => {
    expect(minimumJerkSlope(0)).toBe(0);
    expect(minimumJerkSlope(1)).toBe(0);
    const accel = (t: number) => (minimumJerkSlope(t + H) - minimumJerkSlope(t - H)) / (2 * H);
    expect(Math.abs(accel(H))).toBeLessThan(1e-3);
    expect(Math.abs(accel(1 - H))).toBeLessThan(1e-3);
  });

  it('peak slope 15/8 at τ = ½, and no τ exceeds it', () => {
    expect(MINIMUM_JERK_PEAK_SLOPE).toBe(1.875);
    expect(minimumJerkSlope(0.5)).toBe(MINIMUM_JERK_PEAK_SLOPE);
    for (let t = 0; t <= 1; t += 0.01) expect(minimumJerkSlope(t)).toBeLessThanOrEqual(MINIMUM_JERK_PEAK_SLOPE);
  });
});
