/** A number with a fixed count of decimals, or an em dash when absent. */
export function fixed(value: number | null | undefined, decimals: number): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '—';
  const text = value.toFixed(decimals);
  // A tiny negative (float noise around zero) would print as "-0.000": show it as the zero it rounds to.
  return /^-0\.?0*$/.test(text) ? text.slice(1) : text;
}

/** A moment of inertia, kg·m²: 3 significant digits (segment moments span 1e-4 … 1e1). */
export function moment(value: number | null | undefined): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '—';
  if (value !== 0 && Math.abs(value) < 0.01) return value.toExponential(2);
  return value.toPrecision(3);
}

/** A 3-vector in metres as "x, y, z" with 3 decimals (millimetres). */
export function vector(v: readonly number[] | null | undefined): string {
  if (!v) return '—';
  return v.map((x) => fixed(x, 3)).join(', ');
}

/** A comparison value for display: numbers at 4 significant digits, text as is. */
export function comparisonValue(v: string | number | null): string {
  if (v === null) return '—';
  // Below 1e-9 (float noise around an exact zero, e.g. a symmetric body's lateral CoM) reads as 0.
  if (typeof v === 'number') return Math.abs(v) < 1e-9 ? '0' : Math.abs(v) < 0.01 ? v.toExponential(3) : String(Number(v.toPrecision(4)));
  return v.length > 80 ? `${v.slice(0, 77)}…` : v;
}
