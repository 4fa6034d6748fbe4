/**
 * Brings the element with this id (a view's `nativeID` on the web) to the top of the screen, below the
 * phone's top bar when there is one. Does nothing where there is no document (native), so callers need
 * not ask.
 *
 * `settle`: for a page still drawing what sits above the element (charts loading in the background),
 * the element is brought back to the top each time the drawing moves it, for a second and a half after
 * the tap (our choice of time).
 */
export function scrollToId(id: string, smooth = false, settle = false): void {
  if (typeof document === 'undefined') return;
  // The phone's top bar (the menu button's row) covers the top of the page: the element stops below it.
  const bar = document.querySelector('[data-testid="menu-button"]')?.parentElement?.getBoundingClientRect();
  const margin = Math.max(0, bar?.bottom ?? 0) + 8;
  const go = (behaviour: 'smooth' | 'auto') => {
    const el = document.getElementById(id);
    if (!el) return;
    el.style.scrollMarginTop = `${margin}px`;
    el.scrollIntoView({ block: 'start', behavior: behaviour });
  };
  go(smooth ? 'smooth' : 'auto');
  if (!settle) return;
  let checks = 0;
  const timer = setInterval(() => {
    checks += 1;
    const top = document.getElementById(id)?.getBoundingClientRect().top;
    // Moved away by something drawn above it (a smooth scroll still under way lands within the first checks).
    if (top !== undefined && checks > 2 && Math.abs(top - margin) > 120) go('auto');
    if (checks >= 6) clearInterval(timer);
  }, 250);
}
