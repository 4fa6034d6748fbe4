// Whether the device believes it has a connection: the browser's online/offline events. A request that
// fails without an answer is handled by the outbox's retry; this only decides when to try and what the
// status says.
type Listener = () => void;

export type Connectivity = { isOnline(): boolean; subscribe(l: Listener): () => void };

export function browserConnectivity(): Connectivity {
  const listeners = new Set<Listener>();
  const win = globalThis.window as (Window & typeof globalThis) | undefined;
  if (win?.addEventListener) {
    const notify = () => listeners.forEach((l) => l());
    win.addEventListener('online', notify);
    win.addEventListener('offline', notify);
  }
  return {
    isOnline: () => (typeof navigator === 'undefined' || typeof navigator.onLine !== 'boolean' ? true : navigator.onLine),
    subscribe(l) {
      listeners.add(l);
      return () => listeners.delete(l);
    },
  };
}
