import { useEffect, useRef } from 'react';
import { KEPT_FORM_PREFIX as PREFIX, keptFormStore as store } from './kept-form-keys';

/**
 * A half-written note or clearance survives leaving the page (a physiotherapist called away between
 * patients came back to an empty form): the form's values are kept in this tab's session storage under
 * `care.kept.<key>` until they are saved or emptied, and are removed at sign-out (`forgetKeptForms`).
 * Session storage, not the device's: gone when the tab closes (our choice, for words about a child).
 */
export function useKeptForm<V extends object>(key: string, values: V, initial: V, restore: (values: V) => void) {
  const restored = useRef(false);
  useEffect(() => {
    const raw = store()?.getItem(PREFIX + key);
    restored.current = true;
    if (!raw) return;
    try {
      restore({ ...initial, ...(JSON.parse(raw) as Partial<V>) });
    } catch {
      store()?.removeItem(PREFIX + key);
    }
    // Once, when the form opens.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [key]);
  const json = JSON.stringify(values);
  useEffect(() => {
    if (!restored.current) return;
    if (json === JSON.stringify(initial)) store()?.removeItem(PREFIX + key);
    else store()?.setItem(PREFIX + key, json);
    // `initial` is the form's constant start.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [key, json]);
}
