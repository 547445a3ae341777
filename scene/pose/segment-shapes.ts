/**
 * Drawing sizes of each segment, read from its mass and inertia: the uniform elliptic cylinder with
 * the same mass and principal moments (length L along the axis of least inertia, semi-axes r_i, r_j):
 *   I_i = m(r_j²/4 + L²/12),  I_j = m(r_i²/4 + L²/12),  I_k = m(r_i² + r_j²)/4
 * ⇒ L² = 6(I_i + I_j − I_k)/m,  r_j² = 4(I_i/m − L²/12),  r_i² = 4(I_j/m − L²/12).
 * The view draws an ellipsoid with those semi-axes (L/2 along the long axis) centred on the CoM,
 * so a heavier suit or a carried tool shows as a bulkier segment.
 */
import type { BodyModel } from '@/shared/kinematics/body-model';

/** One segment's drawing shape in its own frame. */
export interface SegmentShape {
  /** Centre (the segment CoM), segment frame, m. */
  centre: [number, number, number];
  /** Semi-axes along the segment frame's x, y, z, m (each ≥ MIN_SEMI_AXIS_M). */
  semiAxes: [number, number, number];
  /** Index (0 = x, 1 = y, 2 = z) of the long axis (least inertia). */
  longAxis: 0 | 1 | 2;
}

/** Smallest semi-axis drawn, m (a point mass or a rod still shows). */
export const MIN_SEMI_AXIS_M = 0.012;

/** Shapes for every segment, in model order. Uses the diagonal of the segment-frame inertia. */
export function segmentShapes(model: BodyModel): SegmentShape[] {
  const shapes: SegmentShape[] = [];
  for (let s = 0; s < model.segmentCount; s++) {
    const m = model.mass[s];
    const I = [model.inertia[9 * s], model.inertia[9 * s + 4], model.inertia[9 * s + 8]];
    const k = (I[0] <= I[1] && I[0] <= I[2] ? 0 : I[1] <= I[2] ? 1 : 2);
    const i = (k + 1) % 3, j = (k + 2) % 3;
    const L2 = Math.max(0, (6 * (I[i] + I[j] - I[k])) / m);
    const rj2 = Math.max(0, 4 * (I[i] / m - L2 / 12));
    const ri2 = Math.max(0, 4 * (I[j] / m - L2 / 12));
    const semi: [number, number, number] = [0, 0, 0];
    semi[k] = Math.sqrt(L2) / 2; semi[i] = Math.sqrt(ri2); semi[j] = Math.sqrt(rj2);
    for (let a = 0; a < 3; a++) semi[a] = Math.max(MIN_SEMI_AXIS_M, semi[a]);
    shapes.push({ centre: [model.com[3 * s], model.com[3 * s + 1], model.com[3 * s + 2]], semiAxes: semi, longAxis: k });
  }
  return shapes;
}

/** Which side a segment is drawn as: its own colour for left, right and the midline. */
export type BodySide = 'left' | 'right' | 'centre';

/**
 * The side of a segment: by name (`l_…`/`left…` vs `r_…`/`right…`) when it says, else by where its
 * CoM sits in the reference posture (y > 1 cm: left, y < −1 cm: right; the body frame's y points left).
 */
export function segmentSide(name: string, comYRoot: number): BodySide {
  if (/^(l_|left)/i.test(name)) return 'left';
  if (/^(r_|right)/i.test(name)) return 'right';
  if (comYRoot > 0.01) return 'left';
  if (comYRoot < -0.01) return 'right';
  return 'centre';
}
