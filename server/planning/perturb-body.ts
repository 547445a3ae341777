/**
 * A body with its segment parameters scaled, for the dispersion run: each segment's mass by
 * (1 + mass error) and its lengths by (1 + length error). A length scale moves the segment's CoM
 * and its children's joint origins proportionally and scales its inertia by mass·length², as for a
 * uniformly scaled rigid body; joint axes and ranges stay.
 */
import type { Body } from '../../shared/contracts/body.ts';

/** Relative errors of one segment (e.g. 0.03 = +3 %). */
export interface SegmentScale {
  mass: number;
  length: number;
}

/** Returns a new body; `scales` has one entry per segment, in body order. */
export function perturbBody(body: Body, scales: readonly SegmentScale[]): Body {
  const byName = new Map(body.segments.map((s, i) => [s.name, scales[i]]));
  return {
    ...body,
    segments: body.segments.map((s, i) => {
      const { mass, length } = scales[i];
      const m = 1 + mass, l = 1 + length;
      const parent = s.parent ? byName.get(s.parent) : undefined;
      const pl = 1 + (parent?.length ?? 0);
      return {
        ...s,
        mass: s.mass * m,
        com: s.com.map((c) => c * l) as typeof s.com,
        inertia: s.inertia.map((v) => v * m * l * l) as typeof s.inertia,
        ...(s.joint ? { joint: { ...s.joint, origin: s.joint.origin.map((c) => c * pl) as typeof s.joint.origin } } : {}),
      };
    }),
  };
}
