/**
 * Registers the worker written after `expo export` (server/dev/service-worker.mjs): it keeps the app
 * shell, fonts and screens so the app opens with no connection. Production web builds only: under
 * `npm run dev` there is no worker, so the dev server's reloads are never answered from a cache.
 */
export function registerServiceWorker(): void {
  if (process.env.NODE_ENV !== 'production') return;
  if (typeof navigator === 'undefined' || !('serviceWorker' in navigator)) return;
  // Served from the site's root so it may answer for every page. Workbox's client is loaded after the
  // first paint, not with the first screen's JavaScript.
  void import('workbox-window').then(({ Workbox }) => new Workbox('/sw.js', { scope: '/' }).register()).catch(() => undefined);
}
