import type { RefObject } from 'react';
import type { TextInput } from 'react-native';

/** Native: the app draws its fields itself, so nothing can be typed before it starts. */
export function useTypedBeforeStart(
  _ref: RefObject<TextInput | null>,
  _label: string,
  _value: string | undefined,
  _onChangeText: ((text: string) => void) | undefined,
): void {}
