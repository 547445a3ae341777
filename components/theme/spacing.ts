/** Spacing steps in density-independent pixels (a 4-px grid). Use these for padding, margins and gaps. */
export const spacing = {
  xxs: 2,
  xs: 4,
  sm: 8,
  md: 12,
  lg: 16,
  xl: 24,
  xxl: 32,
  xxxl: 48,
} as const;

/** Corner radii in pixels. */
export const radii = {
  sm: 6,
  md: 10,
  lg: 14,
  pill: 999,
} as const;

/** Layout widths in pixels. */
export const layout = {
  /** At or above this window width, lists and details sit side by side and the tab bar becomes a sidebar. */
  wideBreakpoint: 1024,
  /** Width of the list column of a split view on wide screens. */
  listColumnWidth: 380,
  /** Content never grows wider than this (keeps line lengths readable on big monitors). */
  maxContentWidth: 1280,
  /** Forms and single-column content stay this narrow. */
  formMaxWidth: 520,
  /** Smallest touch target side (WCAG 2.5.5 recommends 44 px). */
  touchTarget: 44,
} as const;
