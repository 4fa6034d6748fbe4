import { useLayoutEffect, useState, type RefObject } from 'react';
import type { TextInput } from 'react-native';

type Field = HTMLInputElement | HTMLTextAreaElement;
type Before = { field: Field; focused: boolean };

/**
 * Web: the pre-rendered page shows its fields before the app has started (on a slow connection, seconds
 * before), and the browser may fill them in itself (saved e-mail and password). The app renders the page
 * afresh (server/dev/route-chunks.mjs, step 6): its own fields replace the pre-rendered ones in one
 * commit. So, while the app's page renders, the pre-rendered field with the same label is found; right
 * after the commit, what it holds is handed to the form as if typed, and if it had the focus, the new
 * field takes it, with the caret where it was.
 */
export function useTypedBeforeStart(
  ref: RefObject<TextInput | null>,
  label: string,
  value: string | undefined,
  onChangeText: ((text: string) => void) | undefined,
): void {
  const [before] = useState(() => preRenderedField(label));
  useLayoutEffect(() => {
    if (!before) return;
    const { field: old } = before;
    const field = ref.current as unknown as Field | null;
    const typed = old.value;
    if (typed && !value) {
      if (field) field.value = typed; // shown at once; the form's own render follows
      onChangeText?.(typed);
    }
    if (before.focused && field && document.activeElement !== field) {
      field.focus();
      if (old.selectionStart !== null && old.selectionEnd !== null) field.setSelectionRange(old.selectionStart, old.selectionEnd);
    }
    // Only what was there when the app took the page over; from then on the form owns the field.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, []);
}

/**
 * The field of the pre-rendered page (not one the app made) with this label, if any: the focused one,
 * else one holding text, else the first. Its focus is followed until the app's commit removes it; the
 * browser blurs a focused field as it removes it, which is told apart from a person leaving the field by
 * the field still being in the page a moment later.
 */
export function preRenderedField(label: string): Before | null {
  if (typeof document === 'undefined') return null;
  const found = [...document.querySelectorAll<Field>('input, textarea')].filter(
    (f) => f.getAttribute('aria-label') === label && !Object.keys(f).some((k) => k.startsWith('__reactFiber')),
  );
  const field = found.find((f) => f === document.activeElement) ?? found.find((f) => f.value) ?? found[0];
  if (!field) return null;
  const before: Before = { field, focused: document.activeElement === field };
  field.addEventListener('focus', () => (before.focused = true));
  field.addEventListener('blur', () => queueMicrotask(() => field.isConnected && (before.focused = false)));
  return before;
}
