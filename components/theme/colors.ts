/**
 * Holonaut's palette: a dark cabin-night ground with an amber signal colour and a teal second accent.
 * Every value is a CSS/React Native colour string. Use the names, never the hex values, in components.
 */
export const colors = {
  /** App background behind every screen. */
  background: '#0E1621',
  /** Cards, panels, the tab bar. */
  surface: '#152232',
  /** Raised elements on a surface: inputs, selected rows, menus. */
  raised: '#1B2B3F',
  /** Hairlines and input borders. */
  border: '#26384A',
  /** Stronger border for focus-less emphasis (hovered rows, active segments). */
  borderStrong: '#34495E',
  /** Primary text. */
  text: '#E6EDF3',
  /** Secondary text: hints, metadata, inactive tabs. */
  muted: '#8AA0B4',
  /** Signal colour: primary actions, the active tab, focus rings. */
  accent: '#FFB454',
  /** Text drawn on top of `accent`. */
  onAccent: '#1A1206',
  /** Second accent for information and the product mark. */
  teal: '#4FD1C5',
  /** Errors and destructive actions. */
  danger: '#FF6B6B',
  /** Success and "enabled" states. */
  success: '#7BD88F',
  /** Translucent tints behind badges and banners (colour at ~14% opacity). */
  accentTint: 'rgba(255, 180, 84, 0.14)',
  tealTint: 'rgba(79, 209, 197, 0.14)',
  dangerTint: 'rgba(255, 107, 107, 0.14)',
  successTint: 'rgba(123, 216, 143, 0.14)',
  mutedTint: 'rgba(138, 160, 180, 0.14)',
  /** Dimmed backdrop behind sheets and menus. */
  scrim: 'rgba(5, 9, 14, 0.72)',
} as const;

/** A colour name from the palette. */
export type ColorName = keyof typeof colors;
