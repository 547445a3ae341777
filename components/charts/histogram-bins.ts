/**
 * Bins for the robustness histogram: equal-width bins from 0 to a nice upper edge that shows the
 * tolerance and most of the spread; the few errors beyond it are counted in the last bin (the
 * chart says so). Pure, so it can be unit-tested.
 */
import { niceDomain } from './plot-scale';

/** The bins of a set of non-negative values. */
export interface Bins {
  /** Left edge of bin k is edges[k]; the last edge closes the last bin. */
  edges: number[];
  counts: number[];
  /** Values beyond the last edge, counted in the last bin. */
  beyond: number;
}

/** Bins `values` (degrees ≥ 0) so that `mark` (the tolerance) and the 99th percentile are in range. */
export function histogramBins(values: readonly number[], mark: number, binCount = 24): Bins {
  const sorted = [...values].filter(Number.isFinite).sort((a, b) => a - b);
  const p99 = sorted.length ? sorted[Math.min(sorted.length - 1, Math.floor(0.99 * sorted.length))] : 1;
  const hi = niceDomain(0, Math.max(p99, mark * 1.25, 1e-6), 6).domain[1];
  const width = hi / binCount;
  const edges = Array.from({ length: binCount + 1 }, (_v, k) => k * width);
  const counts = new Array<number>(binCount).fill(0);
  let beyond = 0;
  for (const v of sorted) {
    if (v > hi) beyond++;
    counts[Math.min(binCount - 1, Math.max(0, Math.floor(v / width)))]++;
  }
  return { edges, counts, beyond };
}
