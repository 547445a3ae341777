import { colors } from '@/components/theme';

/**
 * Series colours of the report plots, chosen to stay apart on the dark ground and for common
 * colour-vision deficiencies (amber / teal / lilac differ in lightness as well as hue).
 */
export const plotColors = {
  /** Yaw, and the first joint series. */
  yaw: colors.accent,
  /** Pitch. */
  pitch: colors.teal,
  /** Roll. */
  roll: '#B9A4FF',
  /** A joint's angle line. */
  joint: colors.teal,
  /** The allowed range band behind a joint's line. */
  band: 'rgba(123, 216, 143, 0.12)',
  /** The band's edges (the joint limits). */
  bandEdge: 'rgba(123, 216, 143, 0.55)',
  /** Out-of-range stretches. */
  violation: colors.danger,
  /** Grid lines. */
  grid: 'rgba(138, 160, 180, 0.18)',
  /** Axis labels. */
  axisText: colors.muted,
} as const;

/**
 * Line colours of overlaid planner suggestions (suggestion 1 first), apart from one another in
 * lightness as well as hue on the dark ground; the target line stays muted and dashed.
 */
export const candidateColors = [colors.accent, colors.teal, '#B9A4FF', '#FF8FB8', '#9FD3FF', '#D9E27A', '#F2F2F2', '#FF9F6B'] as const;
