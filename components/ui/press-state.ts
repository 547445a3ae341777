import type { PressableStateCallbackType, StyleProp, ViewStyle } from 'react-native';

/** Pressable's style-callback state; react-native-web also reports `hovered` and `focused` (keyboard focus). */
export type WebPressState = PressableStateCallbackType & { hovered?: boolean; focused?: boolean };

/**
 * A Pressable style callback that reads the web-only hover and focus flags as well:
 * `style={pressStyle(({ pressed, hovered }) => [styles.base, hovered && styles.hover])}`.
 */
export function pressStyle(styleOf: (state: WebPressState) => StyleProp<ViewStyle>): (state: PressableStateCallbackType) => StyleProp<ViewStyle> {
  return styleOf;
}
