/**
 * React Native's types give a Pressable's style callback only `pressed`; react-native-web also
 * reports `hovered` and `focused`, which the web build uses for hover and keyboard-focus rings.
 */
import type { PressableStateCallbackType } from 'react-native';

export type WebPressableState = PressableStateCallbackType & {
  readonly hovered?: boolean;
  readonly focused?: boolean;
};
