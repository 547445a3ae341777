/**
 * The 15 segments of the standard human model: the published 14-segment set (de Leva 1996,
 * from Zatsiorsky–Seluyanov data) with the trunk split at the waist into upper and lower trunk.
 * Listed parents before children, in the order the derived body lists them, with their display
 * labels for screens and tables.
 */
import { labelledNames } from '../contracts/labelled-names.ts';
import { limbOnBothSides } from './body-sides.ts';

const SEGMENTS = labelledNames([
  ['upper_trunk', 'Upper trunk'],
  ['head_neck', 'Head and neck'],
  ...limbOnBothSides([['upper_arm', 'upper arm'], ['forearm', 'forearm'], ['hand', 'hand']]),
  ['lower_trunk', 'Lower trunk (pelvis)'],
  ...limbOnBothSides([['thigh', 'thigh'], ['shank', 'shank'], ['foot', 'foot']]),
]);

export const SEGMENT_NAMES = SEGMENTS.names;

/** One segment name of the standard human model. */
export type SegmentName = (typeof SEGMENT_NAMES)[number];

export const SEGMENT_LABELS = SEGMENTS.labels;

/** True when `name` is one of the standard human model's segments. */
export const isSegmentName = SEGMENTS.has;

/** The mirror partner of a segment (left ↔ right); trunk and head map to themselves. */
export function mirrorSegmentName(name: SegmentName): SegmentName {
  if (name.startsWith('l_')) return `r_${name.slice(2)}` as SegmentName;
  if (name.startsWith('r_')) return `l_${name.slice(2)}` as SegmentName;
  return name;
}
