import type { Theme } from 'expo-router';

import { colors, fonts } from '@/components/theme';

/** The navigation containers' theme (scene backgrounds, tab bar, borders) in Holonaut's palette. */
export function navigationTheme(base: Theme): Theme {
  return {
    ...base,
    dark: true,
    colors: {
      ...base.colors,
      primary: colors.accent,
      background: colors.background,
      card: colors.surface,
      text: colors.text,
      border: colors.border,
      notification: colors.danger,
    },
    fonts: {
      regular: { fontFamily: fonts.regular, fontWeight: '400' },
      medium: { fontFamily: fonts.medium, fontWeight: '500' },
      bold: { fontFamily: fonts.semibold, fontWeight: '600' },
      heavy: { fontFamily: fonts.bold, fontWeight: '700' },
    },
  };
}
