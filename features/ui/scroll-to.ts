/**
 * Brings the element with this id (a view's `nativeID` on the web) to the top of the screen. Does nothing
 * where there is no document (native), so callers need not ask.
 */
export function scrollToId(id: string, smooth = false): void {
  if (typeof document === 'undefined') return;
  document.getElementById(id)?.scrollIntoView({ block: 'start', ...(smooth ? { behavior: 'smooth' as const } : {}) });
}
