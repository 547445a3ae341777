import type { ReactNode } from 'react';
import { Text as RNText, type TextProps as RNTextProps } from 'react-native';

import { colors, typeScale, type TypeVariant } from '@/components/theme';

/** Colour roles for text. */
export type TextTone = 'default' | 'muted' | 'accent' | 'teal' | 'danger' | 'success' | 'onAccent';

const toneColor: Record<TextTone, string> = {
  default: colors.text,
  muted: colors.muted,
  accent: colors.accent,
  teal: colors.teal,
  danger: colors.danger,
  success: colors.success,
  onAccent: colors.onAccent,
};

/** Props of {@link Text}: every React Native Text prop plus a type-scale variant and a colour tone. */
export interface TextProps extends RNTextProps {
  /** Type-scale role; default `body`. */
  variant?: TypeVariant;
  /** Colour role; default `default` (primary text colour). */
  tone?: TextTone;
  children?: ReactNode;
}

/** Text in the product's font and type scale. Use it instead of React Native's Text everywhere. */
export function Text({ variant = 'body', tone = 'default', style, ...rest }: TextProps) {
  return <RNText {...rest} style={[typeScale[variant], { color: toneColor[tone] }, style]} />;
}
