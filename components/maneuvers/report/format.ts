/**
 * Number formatting for the maneuver screens: fixed decimals, a proper minus sign and the unit.
 * Angles in degrees, times in seconds, momentum in kg·m²/s (the interfaces' units).
 */

/** "−12.3°" (one decimal by default). */
export function fmtDeg(v: number, decimals = 1): string {
  return `${fmtNum(v, decimals)}°`;
}

/** "4.50 s". */
export function fmtSeconds(v: number, decimals = 2): string {
  return `${fmtNum(v, decimals)} s`;
}

/** "120 °/s". */
export function fmtRate(v: number, decimals = 0): string {
  return `${fmtNum(v, decimals)} °/s`;
}

/** Fixed decimals with a typographic minus; "—" for a missing or non-finite value. */
export function fmtNum(v: number | null | undefined, decimals = 2): string {
  if (v == null || !Number.isFinite(v)) return '—';
  const s = v.toFixed(decimals);
  // "-0.0" reads as a sign error: show it as 0.
  if (Number(s) === 0) return (0).toFixed(decimals);
  return s.startsWith('-') ? `−${s.slice(1)}` : s;
}

/** Scientific notation for tiny audit residuals: "3.2 × 10⁻⁹". */
export function fmtSci(v: number, digits = 2): string {
  if (!Number.isFinite(v)) return '—';
  if (v === 0) return '0';
  const [mant, exp] = v.toExponential(digits - 1).split('e');
  const sup = exp.replace('+', '').replace('-', '⁻').replace(/\d/g, (d) => '⁰¹²³⁴⁵⁶⁷⁸⁹'[Number(d)]);
  return `${mant.replace('-', '−')} × 10${sup}`;
}

/** Local date and time, e.g. "3 Mar 2031, 14:05". */
export function fmtWhen(iso: string | null | undefined): string {
  if (!iso) return '—';
  const d = new Date(iso);
  if (Number.isNaN(d.getTime())) return '—';
  return d.toLocaleString(undefined, { day: 'numeric', month: 'short', year: 'numeric', hour: '2-digit', minute: '2-digit' });
}

/** First 12 characters of a hash, enough to compare by eye. */
export function shortHash(h: string | null | undefined): string {
  return h ? h.slice(0, 12) : '—';
}
