import type { PressableStateCallbackType } from 'react-native';

/** Pressable's style-callback state; react-native-web also reports `hovered` and `focused` (keyboard focus). */
export type WebPressState = PressableStateCallbackType & { hovered?: boolean; focused?: boolean };

/** Reads the web-only hover and focus flags from Pressable's style-callback state. */
export function webPressState(state: PressableStateCallbackType): WebPressState {
  return state;
}
