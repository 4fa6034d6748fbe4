/**
 * Runs `fn` once the page has loaded and the main thread is idle (at the latest 5 s after the load
 * event): for work no first screen needs, so that it never adds to the page's start-up. Web only; a
 * no-op where there is no document (native, pre-rendering).
 */
export function afterLoadWhenIdle(fn: () => void): void {
  if (typeof window === 'undefined' || typeof document === 'undefined') return;
  const whenIdle = () => (typeof requestIdleCallback === 'function' ? requestIdleCallback(fn, { timeout: 5000 }) : setTimeout(fn, 0));
  if (document.readyState === 'complete') whenIdle();
  else window.addEventListener('load', whenIdle, { once: true });
}
