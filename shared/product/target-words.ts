/**
 * A sequence target in words, the one wording the composer, review, rehearsable list and cue card
 * use: whole degrees, axis components to two decimals with trailing zeros dropped, no tolerance
 * (each shows it beside the target in its own way). Zod-free (type import only): the web client uses it.
 */
import type { SequenceTarget } from '../contracts/maneuver.ts';

/** `v` to `decimals`, trailing zeros dropped, −0 as 0, negative with `minus`. */
function num(v: number, decimals: number, minus: string): string {
  const r = Number(v.toFixed(decimals));
  return r < 0 ? `${minus}${-r}` : String(Math.abs(r));
}

/**
 * "yaw 90°, pitch -20°, roll 0°" or "60° about [0, 0.71, 0.71]". `minus`: the sign for negative
 * values ('-' in plain text and the printed card, '−' on screen).
 */
export function targetWords(t: SequenceTarget, minus = '-'): string {
  const deg = (v: number) => `${num(v, 0, minus)}°`;
  if (t.mode === 'ypr') return `yaw ${deg(t.yprDeg.yaw)}, pitch ${deg(t.yprDeg.pitch)}, roll ${deg(t.yprDeg.roll)}`;
  return `${deg(t.axisAngle.angleDeg)} about [${t.axisAngle.axis.map((a) => num(a, 2, minus)).join(', ')}]`;
}
