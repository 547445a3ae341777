/**
 * The 15 segments of the standard human model: the published 14-segment set (de Leva 1996,
 * from Zatsiorsky–Seluyanov data) with the trunk split at the waist into upper and lower trunk.
 * Listed parents before children, in the order the derived body lists them.
 */
export const SEGMENT_NAMES = [
  'upper_trunk',
  'head_neck',
  'l_upper_arm',
  'l_forearm',
  'l_hand',
  'r_upper_arm',
  'r_forearm',
  'r_hand',
  'lower_trunk',
  'l_thigh',
  'l_shank',
  'l_foot',
  'r_thigh',
  'r_shank',
  'r_foot',
] as const;

/** One segment name of the standard human model. */
export type SegmentName = (typeof SEGMENT_NAMES)[number];

/** Display labels for screens and tables. */
export const SEGMENT_LABELS: Record<SegmentName, string> = {
  upper_trunk: 'Upper trunk',
  head_neck: 'Head and neck',
  l_upper_arm: 'Left upper arm',
  l_forearm: 'Left forearm',
  l_hand: 'Left hand',
  r_upper_arm: 'Right upper arm',
  r_forearm: 'Right forearm',
  r_hand: 'Right hand',
  lower_trunk: 'Lower trunk (pelvis)',
  l_thigh: 'Left thigh',
  l_shank: 'Left shank',
  l_foot: 'Left foot',
  r_thigh: 'Right thigh',
  r_shank: 'Right shank',
  r_foot: 'Right foot',
};

/** The mirror partner of a segment (left ↔ right); trunk and head map to themselves. */
export function mirrorSegmentName(name: SegmentName): SegmentName {
  if (name.startsWith('l_')) return `r_${name.slice(2)}` as SegmentName;
  if (name.startsWith('r_')) return `l_${name.slice(2)}` as SegmentName;
  return name;
}
