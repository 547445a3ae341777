import type { SuitConfig } from '../../shared/contracts/suit.ts';
import { combineMassProperties, massProperties } from './mass-properties.ts';
import type { ModelSegment } from './standard-human.ts';

/**
 * The model wearing a suit: each segment's added mass is fixed to it (parallel-axis theorem; the
 * added CoM defaults to the segment's own CoM), suited ranges replace the unsuited ones for the dofs
 * the suit lists, and locked dofs are removed (their joints stay at the reference angle).
 * Returns new segments; the input is not changed.
 */
export function applySuit(segments: ModelSegment[], suit: SuitConfig): ModelSegment[] {
  const known = new Set(segments.flatMap((s) => s.joint?.dofs.map((d) => d.name) ?? []));
  for (const name of [...Object.keys(suit.ranges), ...suit.lockedDofs]) {
    if (!known.has(name as never)) throw new Error(`suit "${suit.id}": dof "${name}" is not in the body`);
  }
  const locked = new Set<string>(suit.lockedDofs);
  return segments.map((seg) => {
    const add = suit.segments[seg.name];
    const props =
      add && add.mass > 0
        ? combineMassProperties(seg.props, massProperties(add.mass, add.com ?? seg.props.com, add.inertia ?? [0, 0, 0]))
        : seg.props;
    const joint = seg.joint && {
      origin: seg.joint.origin,
      dofs: seg.joint.dofs
        .filter((d) => !locked.has(d.name))
        .map((d) => ({ ...d, ...(suit.ranges[d.name] ?? {}) })),
    };
    return { ...seg, props, ...(joint ? { joint } : {}) };
  });
}
