/**
 * The report plots' axis arithmetic against d3-scale (scaleLinear, nice, ticks), a general-purpose
 * reference library, plus the plot-specific helpers (tick labels, angle unwrapping, SVG paths).
 */
import { scaleLinear } from 'd3-scale';
import { describe, expect, it } from 'vitest';

import { formatTick, linearScale, niceDomain, niceStep, polylinePath, unwrapDegrees } from '../../components/charts/plot-scale.ts';

/** Data intervals of the kinds the report plots: seconds, degrees, tiny residuals, negative spans. */
const DOMAINS: [number, number][] = [
  [0, 12.4], [0, 1], [-37.2, 182.5], [-0.0042, 0.0131], [3.2e-10, 8.7e-9], [0, 600], [-180, 180], [1.03, 1.07], [-5, -0.3], [0, 95],
];

describe('linearScale', () => {
  it('maps like d3 scaleLinear, inverted pixel ranges included', () => {
    for (const d of DOMAINS) {
      const ours = linearScale(d, [300, 20]);
      const ref = scaleLinear().domain(d).range([300, 20]);
      for (const v of [d[0], d[1], (d[0] + d[1]) / 2, d[0] - 0.3 * (d[1] - d[0])]) expect(ours(v)).toBeCloseTo(ref(v), 9);
      expect(ours.domain).toEqual(d);
    }
  });

  it('a zero-width domain maps to the middle of the range, as d3 does', () => {
    expect(linearScale([2, 2], [0, 100])(2)).toBe(50);
    expect(scaleLinear().domain([2, 2]).range([0, 100])(2)).toBe(50);
  });
});

describe('niceDomain and niceStep', () => {
  for (const count of [4, 5, 8]) {
    it(`${count} ticks: the widened domain and its ticks equal d3's nice(${count}) and ticks(${count})`, () => {
      for (const [lo, hi] of DOMAINS) {
        const ours = niceDomain(lo, hi, count);
        const ref = scaleLinear().domain([lo, hi]).nice(count);
        const [r0, r1] = ref.domain();
        const tol = (r1 - r0) * 1e-12;
        expect(Math.abs(ours.domain[0] - r0)).toBeLessThanOrEqual(tol);
        expect(Math.abs(ours.domain[1] - r1)).toBeLessThanOrEqual(tol);
        const ticks = ref.ticks(count);
        expect(ours.ticks.length).toBe(ticks.length);
        ours.ticks.forEach((t, k) => expect(Math.abs(t - ticks[k])).toBeLessThanOrEqual(tol));
      }
    });
  }

  it('steps switch at √2, √10 and √50 of the decade (1 → 2 → 5 → 10)', () => {
    expect(niceStep(1.41, 1)).toBe(1);
    expect(niceStep(1.42, 1)).toBe(2);
    expect(niceStep(3.16, 1)).toBe(2);
    expect(niceStep(3.17, 1)).toBe(5);
    expect(niceStep(7.07, 1)).toBe(5);
    expect(niceStep(7.08, 1)).toBe(10);
  });

  it('ticks read as short decimals (no 0.30000000000000004)', () => {
    expect(niceDomain(0, 1, 10).ticks).toEqual([0, 0.1, 0.2, 0.3, 0.4, 0.5, 0.6, 0.7, 0.8, 0.9, 1]);
  });

  it('a flat line (lo = hi) is widened by ±1; non-finite data gets [0, 1]; a bad span gets step 1', () => {
    expect(niceDomain(3, 3, 4)).toEqual({ domain: [2, 4], ticks: [2, 2.5, 3, 3.5, 4] });
    expect(niceDomain(Number.NaN, 1)).toEqual({ domain: [0, 1], ticks: [0, 1] });
    expect(niceDomain(0, Number.POSITIVE_INFINITY)).toEqual({ domain: [0, 1], ticks: [0, 1] });
    expect(niceStep(0, 5)).toBe(1);
    expect(niceStep(-2, 5)).toBe(1);
  });
});

describe('tick labels, angle unwrapping and paths', () => {
  it('formatTick: no trailing zeros, six significant digits, a true minus sign', () => {
    expect(formatTick(0.5)).toBe('0.5');
    expect(formatTick(-2)).toBe('−2');
    expect(formatTick(0.1 + 0.2)).toBe('0.3');
    expect(formatTick(1e-9)).toBe('1e-9');
  });

  it('unwrapDegrees: a yaw crossing ±180° stays one line; the first value is kept', () => {
    expect(unwrapDegrees([170, 179, -178, -170, 175])).toEqual([170, 179, 182, 190, 175]);
    expect(unwrapDegrees([-170, -179, 178])).toEqual([-170, -179, -182]);
    expect(unwrapDegrees([])).toEqual([]);
  });

  it('polylinePath: M then L, one decimal; a non-finite point lifts the pen', () => {
    expect(polylinePath([0, 1.25, 2, 3], [10, 11, Number.NaN, 12])).toBe('M0.0 10.0L1.3 11.0M3.0 12.0');
    expect(polylinePath([], [])).toBe('');
  });
});
