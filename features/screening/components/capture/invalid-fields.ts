import { createContext } from 'react';

/**
 * Number fields of a capture step say when they hold text that is not kept (out of range, not a number):
 * `report(id, label, testID)` while it is so (the test id brings the field into view), `report(id, null)` once fixed, emptied or gone. Capture then stops
 * Next and says which, instead of moving on with the value silently left out (our choice).
 */
export const InvalidFieldsContext = createContext<((id: string, label: string | null, testID?: string) => void) | null>(null);
