import type { DeLevaRow } from './data/de-leva-1996-table4.ts';

/** Which body axis a segment's long axis lies along in the reference posture. */
export type LongAxis = 'z' | 'x';

/**
 * Principal moments about the segment CoM from de Leva's radii of gyration: I = m (r·L)², as a
 * diagonal tensor (flat row-major) in the segment frame (x anterior, y left, z head, in the reference posture).
 * Axis convention (decided here, pinned by tests): `rgSag` is about the sagittal axis — the
 * anteroposterior axis, body x — so it governs rotation in the frontal plane (the thorax, wider than
 * deep, has rgSag > rgTrans); `rgTrans` is about the transverse (mediolateral) axis, body y;
 * `rgLong` about the long axis. The foot lies along body x: its long axis is x and its `rgSag` axis,
 * normal to the sole, is body z.
 */
export function deLevaPrincipalInertia(row: DeLevaRow, mass: number, length: number, longAxis: LongAxis = 'z'): number[] {
  const sag = mass * (row.rgSag * length) ** 2;
  const trans = mass * (row.rgTrans * length) ** 2;
  const long = mass * (row.rgLong * length) ** 2;
  const [xx, yy, zz] = longAxis === 'z' ? [sag, trans, long] : [long, trans, sag];
  return [xx, 0, 0, 0, yy, 0, 0, 0, zz];
}
