import { useEffect, type RefObject } from 'react';
import type { TextInput } from 'react-native';

/**
 * Web: the pre-rendered page shows its fields before the app has started (on a slow connection, seconds
 * before), and the browser may fill them in itself (saved e-mail and password). React keeps what the
 * field holds when it takes the page over, but the form's state starts empty and its next render would
 * clear the field. So, once the field is mounted, text found in it and not in the form is handed to the
 * form as if typed.
 */
export function useTypedBeforeStart(ref: RefObject<TextInput | null>, value: string | undefined, onChangeText: ((text: string) => void) | undefined): void {
  useEffect(() => {
    const field = ref.current as unknown as { value?: unknown } | null;
    const typed = typeof field?.value === 'string' ? field.value : '';
    if (typed && !value) onChangeText?.(typed);
    // Only what was there when the app started; from then on the form owns the field.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, []);
}
