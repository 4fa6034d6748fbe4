/**
 * Web: a pre-rendered page is on screen before its scripts run (server/dev/route-chunks.mjs), and a tap
 * on it does nothing until the app has taken it over. Marks the page (`<html data-started>`) once the
 * first render is committed, so that anything arriving at a fresh page (browser tests, after each full
 * page load: test/e2e/fixtures.ts) can wait for it.
 */
export function markAppStarted(): void {
  if (typeof document !== 'undefined') document.documentElement.setAttribute('data-started', '');
}
