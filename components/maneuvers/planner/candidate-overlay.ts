/**
 * Puts several candidates' attitude tracks on one time axis for the overlaid plots: the plot draws
 * every line against one `x`, while candidates last different times and were thinned at different
 * instants. Pure functions (no React) so they can be tested on their own.
 */

/** One candidate's angle against time (ascending `t`, same length as `values`). */
export interface TimedValues {
  t: readonly number[];
  values: readonly number[];
}

/**
 * A shared time axis from 0 to the longest end: `points` evenly spaced instants plus every
 * candidate's own end, so each line reaches its final value exactly.
 */
export function overlayGrid(ends: readonly number[], points = 300): number[] {
  const last = Math.max(0, ...ends.filter(Number.isFinite));
  const grid = Array.from({ length: points }, (_, i) => (last * i) / (points - 1));
  for (const e of ends) if (Number.isFinite(e) && e >= 0) grid.push(e);
  return [...new Set(grid)].sort((a, b) => a - b);
}

/**
 * The track's value at each grid instant by linear interpolation between its samples; NaN outside
 * its time span (the plot then ends that line at the candidate's end).
 */
export function valuesOnGrid(track: TimedValues, grid: readonly number[]): number[] {
  const { t, values } = track;
  const out: number[] = [];
  let k = 0;
  for (const x of grid) {
    if (!t.length || x < t[0] || x > t[t.length - 1]) {
      out.push(NaN);
      continue;
    }
    while (k < t.length - 2 && t[k + 1] < x) k++;
    // Grid and track both ascend: k only moves forward.
    const t0 = t[k];
    const t1 = t[Math.min(k + 1, t.length - 1)];
    const v0 = values[k];
    const v1 = values[Math.min(k + 1, t.length - 1)];
    out.push(t1 === t0 ? v0 : v0 + ((x - t0) / (t1 - t0)) * (v1 - v0));
  }
  return out;
}

/** The angle equal to `angleDeg` modulo 360° nearest to `nearDeg` (a target line drawn beside unwrapped tracks). */
export function nearestTurn(angleDeg: number, nearDeg: number): number {
  return angleDeg + 360 * Math.round((nearDeg - angleDeg) / 360);
}
