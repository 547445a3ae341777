import { StyleSheet } from 'react-native';

import { spacing } from './spacing';

/**
 * Children one spacing step apart (`<View style={gaps.md}>`): the layout most panels, lists and forms
 * use, written once here instead of a `{ gap: spacing.md }` entry in every component's style sheet.
 */
export const gaps = StyleSheet.create({
  xxs: { gap: spacing.xxs },
  xs: { gap: spacing.xs },
  sm: { gap: spacing.sm },
  md: { gap: spacing.md },
  lg: { gap: spacing.lg },
  xl: { gap: spacing.xl },
});
