import Feather from '@expo/vector-icons/Feather';
import type { ComponentProps } from 'react';

/** Any Feather icon name (the product uses one icon family so strokes and sizes match). */
export type IconName = ComponentProps<typeof Feather>['name'];

/** Props of {@link Icon}. */
export interface IconProps {
  /** Feather icon name. */
  name: IconName;
  /** Side in px; default 18. */
  size?: number;
  /** Colour string; default the primary text colour. */
  color?: string;
}

/** A decorative icon (hidden from screen readers: pair it with text or give its parent a label). */
export function Icon({ name, size = 18, color = '#E6EDF3' }: IconProps) {
  return <Feather name={name} size={size} color={color} aria-hidden />;
}

/** The icon font to preload with `useFonts` (otherwise the first icons render as empty boxes). */
export const iconFont = Feather.font;
