// Whether the device has a connection: the browser's online/offline events, and whether the server
// answered lately (`setReachable`, from the device store: a hall's Wi-Fi with no way out, or a browser that
// says it is online when it is not, leaves `navigator.onLine` true while nothing gets through). A request
// that fails without an answer is handled by the outbox's retry; this only decides when to try and what
// the status says.
type Listener = () => void;

export type Connectivity = { isOnline(): boolean; subscribe(l: Listener): () => void; setReachable(reachable: boolean): void };

export function browserConnectivity(): Connectivity {
  const listeners = new Set<Listener>();
  const notify = () => listeners.forEach((l) => l());
  const win = globalThis.window as (Window & typeof globalThis) | undefined;
  if (win?.addEventListener) {
    win.addEventListener('online', notify);
    win.addEventListener('offline', notify);
  }
  let reachable = true;
  return {
    isOnline: () => reachable && (typeof navigator === 'undefined' || typeof navigator.onLine !== 'boolean' ? true : navigator.onLine),
    setReachable(next) {
      if (next === reachable) return;
      reachable = next;
      notify();
    },
    subscribe(l) {
      listeners.add(l);
      return () => listeners.delete(l);
    },
  };
}
