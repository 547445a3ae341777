/** Sample quantiles for the robustness figures. */

/** Quantile by linear interpolation between order statistics (Hyndman & Fan 1996, definition 7: R's and NumPy's default). */
export function quantile(sorted: readonly number[], p: number): number {
  if (!sorted.length) return NaN;
  const h = (sorted.length - 1) * p;
  const lo = Math.floor(h), hi = Math.ceil(h);
  return sorted[lo] + (h - lo) * (sorted[hi] - sorted[lo]);
}
