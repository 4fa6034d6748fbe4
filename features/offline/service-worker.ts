/** Native apps have no service worker: nothing to register. */
export function registerServiceWorker(): void {}
