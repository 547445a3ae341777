import type { GearItem } from '../../shared/contracts/suit.ts';
import { combineMassProperties, massProperties } from './mass-properties.ts';
import type { ModelSegment } from './standard-human.ts';

/**
 * The model carrying gear: each item is a rigid mass fixed to its segment at `position` (segment
 * frame), combined with the segment by the parallel-axis theorem. Returns new segments.
 */
export function applyGear(segments: ModelSegment[], gear: GearItem[]): ModelSegment[] {
  return segments.map((seg) =>
    gear
      .filter((item) => item.segment === seg.name)
      .reduce(
        (s, item) => ({ ...s, props: combineMassProperties(s.props, massProperties(item.mass, item.position, item.inertia)) }),
        seg,
      ),
  );
}
