/**
 * Axis arithmetic for the report's SVG plots: linear scales and "nice" tick values (1, 2, 5 × 10ⁿ).
 * Pure functions, no React, so they can be unit-tested and reused by any plot.
 */

/** A linear map from a data interval onto a pixel interval. */
export interface LinearScale {
  /** Data value → pixel coordinate. */
  (value: number): number;
  /** Data interval [lo, hi] the scale was built for. */
  domain: readonly [number, number];
}

/** Linear scale mapping `domain` onto `range` (pixels); a zero-width domain maps to the range's middle. */
export function linearScale(domain: readonly [number, number], range: readonly [number, number]): LinearScale {
  const [d0, d1] = domain;
  const [r0, r1] = range;
  const span = d1 - d0;
  const f = ((v: number) => (span === 0 ? (r0 + r1) / 2 : r0 + ((v - d0) / span) * (r1 - r0))) as LinearScale;
  f.domain = domain;
  return f;
}

/**
 * The 1-2-5 step nearest to span/count (on a log scale: the switch points are √2, √10 and √50, as in
 * d3-array's tickStep, which the tests compare with), e.g. 0.2, 5, 50.
 */
export function niceStep(span: number, count: number): number {
  if (!(span > 0) || !(count > 0)) return 1;
  const raw = span / count;
  const mag = 10 ** Math.floor(Math.log10(raw));
  const norm = raw / mag;
  const nice = norm < Math.SQRT2 ? 1 : norm < Math.sqrt(10) ? 2 : norm < Math.sqrt(50) ? 5 : 10;
  return nice * mag;
}

/**
 * Widens [lo, hi] to whole tick steps and lists the ticks (about `count` of them), like d3-scale's
 * nice() then ticks() (the tests compare them).
 * A degenerate interval (lo = hi) is widened by ±1 so a flat line still gets an axis.
 */
export function niceDomain(lo: number, hi: number, count = 5): { domain: [number, number]; ticks: number[] } {
  if (!Number.isFinite(lo) || !Number.isFinite(hi)) return { domain: [0, 1], ticks: [0, 1] };
  if (lo === hi) {
    lo -= 1;
    hi += 1;
  }
  // Widen to whole steps, then re-step the widened span until the step settles (as d3's nice() does):
  // a span that grows past a switch point would otherwise get twice the ticks asked for.
  let step = niceStep(hi - lo, count);
  let start = Math.floor(lo / step) * step;
  let end = Math.ceil(hi / step) * step;
  for (let i = 0; i < 10; i++) {
    const next = niceStep(end - start, count);
    if (next === step) break;
    step = next;
    start = Math.floor(start / step) * step;
    end = Math.ceil(end / step) * step;
  }
  const ticks: number[] = [];
  // Index-based so floating-point steps do not drift (0.1 + 0.2 …).
  for (let i = 0; start + i * step <= end + step * 1e-9; i++) ticks.push(roundTick(start + i * step, step));
  return { domain: [start, end], ticks };
}

/** Rounds a tick to the step's decimals so labels read "0.2", not "0.20000000000000001". */
function roundTick(v: number, step: number): number {
  const decimals = Math.max(0, -Math.floor(Math.log10(step)) + 1);
  return Number(v.toFixed(decimals));
}

/** Short tick label: no trailing zeros, a proper minus sign. */
export function formatTick(v: number): string {
  const s = String(Number(v.toPrecision(6)));
  return s.startsWith('-') ? `−${s.slice(1)}` : s;
}

/**
 * Removes ±360° jumps from an angle series (degrees) so a yaw passing ±180° draws as one line.
 * Returns a new array; the first value is kept as is.
 */
export function unwrapDegrees(values: readonly number[]): number[] {
  const out: number[] = [];
  let offset = 0;
  values.forEach((v, i) => {
    if (i > 0) {
      const d = v + offset - out[i - 1];
      if (d > 180) offset -= 360;
      else if (d < -180) offset += 360;
    }
    out.push(v + offset);
  });
  return out;
}

/** SVG path `M x y L x y …` of a polyline; non-finite points break the line. */
export function polylinePath(xs: readonly number[], ys: readonly number[]): string {
  let d = '';
  let pen = false;
  for (let i = 0; i < xs.length; i++) {
    const x = xs[i];
    const y = ys[i];
    if (!Number.isFinite(x) || !Number.isFinite(y)) {
      pen = false;
      continue;
    }
    d += `${pen ? 'L' : 'M'}${x.toFixed(1)} ${y.toFixed(1)}`;
    pen = true;
  }
  return d;
}
