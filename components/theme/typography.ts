import type { TextStyle } from 'react-native';

/**
 * Font family names as registered by `useFonts` in app/_layout.tsx (Inter, from @expo-google-fonts/inter).
 * Use a family per weight instead of `fontWeight`, so the browser never synthesises bold.
 */
export const fonts = {
  regular: 'Inter_400Regular',
  medium: 'Inter_500Medium',
  semibold: 'Inter_600SemiBold',
  bold: 'Inter_700Bold',
} as const;

/** The type scale: font family, size and line height in px for each text role. */
export const typeScale = {
  /** Screen titles. */
  title: { fontFamily: fonts.bold, fontSize: 24, lineHeight: 30, letterSpacing: -0.3 },
  /** Section and card headings. */
  heading: { fontFamily: fonts.semibold, fontSize: 17, lineHeight: 24 },
  /** Running text. */
  body: { fontFamily: fonts.regular, fontSize: 15, lineHeight: 22 },
  /** Emphasised running text (names in lists). */
  bodyStrong: { fontFamily: fonts.semibold, fontSize: 15, lineHeight: 22 },
  /** Form labels, button text. */
  label: { fontFamily: fonts.medium, fontSize: 14, lineHeight: 20 },
  /** Metadata, hints, captions. */
  caption: { fontFamily: fonts.regular, fontSize: 13, lineHeight: 18 },
  /** Small capitals above groups ("PEOPLE", "FILTERS"). */
  overline: { fontFamily: fonts.semibold, fontSize: 11, lineHeight: 16, letterSpacing: 1.1, textTransform: 'uppercase' },
  /** Numbers that must line up (tables, units). */
  numeric: { fontFamily: fonts.medium, fontSize: 14, lineHeight: 20, fontVariant: ['tabular-nums'] },
} as const satisfies Record<string, TextStyle>;

/** A text role from the type scale. */
export type TypeVariant = keyof typeof typeScale;
