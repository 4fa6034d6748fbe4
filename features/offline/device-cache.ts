// Server answers kept on the device for the rounds the tester opened, so those screens open (and
// reload) without a connection. Only what a screen asks to keep is written; it is removed at sign-out.
// Light: the store is loaded (device-handle.ts) only when something is written or read back.
import { ApiError } from '@/features/api/client';
import { connectivity, loadDevice } from './device-handle';

const hasIndexedDb = () => typeof globalThis.indexedDB !== 'undefined';
const store = async () => (await loadDevice()).deviceCache;

const NOT_KEPT = 'No connection, and this screen was not opened on this phone while online. Open it once with a connection to keep it for courtside use.';

/**
 * Fetch first; without a connection (no answer at all) answer from the device. `keep` decides whether
 * a fresh answer is written to the device (the caller's privacy rule), and under which round.
 */
export async function deviceBacked<T>(key: string, scope: string, fetcher: () => Promise<T>, keep: (data: T) => { roundId: string | null } | null): Promise<T> {
  if (!hasIndexedDb()) return fetcher();
  if (connectivity.isOnline()) {
    try {
      const data = await fetcher();
      connectivity.setReachable(true);
      const where = keep(data);
      if (where)
        await store()
          .then((c) => c.put({ key, scope, roundId: where.roundId, data, savedAt: new Date().toISOString() }))
          .catch(() => undefined);
      return data;
    } catch (e) {
      if (!(e instanceof ApiError) || e.status !== 0) throw e;
      // No answer at all: the device is offline whatever the browser says (device.ts probes until back).
      if (e.code === 'offline') connectivity.setReachable(false);
    }
  }
  const kept = await store()
    .then((c) => c.get(key))
    .catch(() => undefined);
  if (kept && kept.scope === scope) return kept.data as T;
  throw new ApiError(0, 'offline', NOT_KEPT);
}

/** Writes a value the screens changed on this device (a submit waiting to be sent, a new draft version). */
export async function updateKept<T>(key: string, change: (data: T) => T): Promise<void> {
  if (!hasIndexedDb()) return;
  const kept = await store()
    .then((c) => c.get(key))
    .catch(() => undefined);
  if (!kept) return;
  await store()
    .then((c) => c.put({ ...kept, data: change(kept.data as T), savedAt: new Date().toISOString() }))
    .catch(() => undefined);
}

export async function readKept<T>(key: string, scope: string): Promise<T | null> {
  if (!hasIndexedDb()) return null;
  const kept = await store()
    .then((c) => c.get(key))
    .catch(() => undefined);
  return kept && kept.scope === scope ? (kept.data as T) : null;
}

/** Every kept answer under a key prefix, in one club (the rounds kept on this phone). */
export async function keptWithPrefix<T>(prefix: string, scope: string): Promise<T[]> {
  if (!hasIndexedDb()) return [];
  try {
    const cache = await store();
    const keys = (await cache.keys()).map(String).filter((k) => k.startsWith(prefix));
    const items = await Promise.all(keys.map((k) => cache.get(k)));
    return items.filter((i) => i && i.scope === scope).map((i) => i!.data as T);
  } catch {
    return [];
  }
}
