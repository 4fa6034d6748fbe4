// The device's one outbox, its connectivity, the draft copies and the photos waiting to upload: the
// singletons the screens use. Features register how each kind of change is sent (`registerSender`), so
// this folder knows nothing of screening. Loaded only through `loadDevice()` (device-handle.ts): screens
// import the handle, never this module, so the store stays out of the chunk every page loads.
import { ApiError, apiUrl } from '@/features/api/client';
import { checkPhotoBudget, PHOTO_BUDGET_BYTES } from './budget';
import { connectivity, notifyDeviceWipe, setDeviceSession } from './device-handle';
import { deviceDrafts, deviceMeta, devicePhotos, hasIndexedDb, idbOutboxStorage, wipeDevice, type StoredPhoto } from './device-store';
import { JsonCopies } from './json-copies';
import { Outbox, waitedOnPhone, type OutboxEntry, type OutboxKind, type OutboxStorage } from './outbox';

export { deviceCache } from './device-store';

type Sender = (entry: OutboxEntry) => Promise<void>;
const senders = new Map<OutboxKind, Sender>();

/** How a kind of change is sent; until a sender is registered its entries wait. */
export function registerSender<K extends OutboxKind>(kind: K, sender: (entry: Extract<OutboxEntry, { kind: K }>) => Promise<void>): void {
  // Entries reach a sender only through `senders.get(entry.kind)`, so the kind always matches.
  senders.set(kind, sender as Sender);
  outbox.kick();
}

function memoryOutboxStorage(): OutboxStorage {
  const rows = new Map<number, OutboxEntry>();
  let seq = 0;
  return {
    all: async () => [...rows.values()],
    add: async (e) => {
      seq += 1;
      const stored = { ...e, seq };
      rows.set(seq, stored);
      return stored;
    },
    put: async (e) => void rows.set(e.seq, e),
    remove: async (s) => void rows.delete(s),
  };
}

const keep = hasIndexedDb();

export const outbox = new Outbox({
  storage: keep ? idbOutboxStorage : memoryOutboxStorage(),
  isOnline: () => connectivity.isOnline(),
  newKey: () => globalThis.crypto.randomUUID(),
  // One tab sends at a time: every tab of the app shares the device's queue.
  exclusive: globalThis.navigator?.locks ? (fn) => globalThis.navigator.locks.request('squadline-outbox', fn) : undefined,
  send: async (entry) => {
    const sender = senders.get(entry.kind);
    // Not loaded yet (the screens that register it load lazily): try again shortly.
    if (!sender) throw new ApiError(0, 'not_ready', 'Getting ready to send.');
    try {
      await sender(entry);
    } catch (e) {
      // No answer at all: offline, whatever the browser says; any answer, even a refusal, is a connection.
      connectivity.setReachable(!(e instanceof ApiError && e.status === 0 && e.code === 'offline'));
      throw e;
    }
    connectivity.setReachable(true);
  },
});

/**
 * While the server could not be reached and the browser still says it is online (a hall's Wi-Fi with no
 * way out), asks the health route every few seconds (our choice: 5 s) and once the browser says it is
 * back, so that the status and the outbox follow the connection when it returns.
 */
const PROBE_MS = 5_000;
let probe: ReturnType<typeof setInterval> | null = null;
const tryReach = () =>
  void fetch(apiUrl('/health'), { cache: 'no-store', credentials: 'include' }).then(
    () => connectivity.setReachable(true),
    () => undefined,
  );
const followReach = () => {
  const browserOnline = typeof navigator === 'undefined' || navigator.onLine !== false;
  const stuck = browserOnline && !connectivity.isOnline();
  if (stuck && probe === null) {
    tryReach();
    probe = setInterval(tryReach, PROBE_MS);
  } else if (!stuck && probe !== null) {
    clearInterval(probe);
    probe = null;
  }
};
connectivity.subscribe(followReach);
// Found unreachable before this module loaded (a kept round read first): probe from now.
followReach();

/** When the connection last came back (ms), for `waitedOnPhone`; null while it has not gone. */
let backOnlineAt: number | null = null;
let wasOnline = connectivity.isOnline();
connectivity.subscribe(() => {
  const online = connectivity.isOnline();
  if (online && !wasOnline) backOnlineAt = Date.now();
  wasOnline = online;
  if (online) outbox.kick();
});

/**
 * Screens' submits that waited on this phone and have since reached the server, by assessment id: a
 * round the tester goes back to says so once, with the names (they were sent while the tester was on
 * another screen). Kept in memory for this visit; `forget` once said.
 */
let sentAfterWaiting: readonly string[] = [];
const sentListeners = new Set<() => void>();
const publishSent = (next: readonly string[]) => {
  sentAfterWaiting = next;
  sentListeners.forEach((l) => l());
};
export const sentSubmits = {
  ids: (): readonly string[] => sentAfterWaiting,
  forget(ids: readonly string[]): void {
    publishSent(sentAfterWaiting.filter((id) => !ids.includes(id)));
  },
  subscribe(listener: () => void): () => void {
    sentListeners.add(listener);
    return () => {
      sentListeners.delete(listener);
    };
  },
};
outbox.onEvent((e) => {
  if (e.type === 'sent' && e.entry.kind === 'submit' && waitedOnPhone(e.entry, Date.now(), backOnlineAt) && !sentAfterWaiting.includes(e.entry.assessmentId)) {
    publishSent([...sentAfterWaiting, e.entry.assessmentId]);
  }
});

// A photo discarded from the queue leaves the device with it.
outbox.onEvent((e) => {
  if (e.type === 'discarded' && e.entry.kind === 'photo' && e.entry.photo) void forgetPhoto(e.entry.photo.blobId).catch(() => undefined);
});

/** Local copies of drafts (see features/screening/draft), kept on the device. */
export const draftCopies = new JsonCopies<unknown>(keep ? deviceDrafts : null);

const OWNER_KEY = 'owner';
let started: { userId: string; ready: Promise<void> } | null = null;

/**
 * Opens the device's store for the signed-in person. If the data on the device belongs to someone
 * else (they never signed out), it is removed first: one person's work never reaches another's session.
 */
export function startDevice(userId: string): Promise<void> {
  if (started?.userId === userId) return started.ready;
  const ready = (async () => {
    if (keep) {
      try {
        const owner = await deviceMeta.get<string>(OWNER_KEY);
        if (owner && owner !== userId) {
          await wipeDevice();
          draftCopies.clear();
          outbox.reset();
        }
        await deviceMeta.set(OWNER_KEY, userId);
      } catch {
        // IndexedDB refused (private mode, quota): work with what is in memory.
      }
    }
    await Promise.all([draftCopies.hydrate(), outbox.load().catch(() => undefined)]);
    outbox.setUser(userId);
  })();
  started = { userId, ready };
  return ready;
}

/** Everything kept on the device is removed (sign-out). */
export async function wipeOnSignOut(): Promise<void> {
  notifyDeviceWipe();
  outbox.setUser(null);
  outbox.reset();
  publishSent([]);
  setDeviceSession(null);
  forgetLegacyCopies();
  draftCopies.clear();
  photoUrls.forEach((url) => URL.revokeObjectURL?.(url));
  photoUrls.clear();
  started = null;
  await wipeDevice().catch(() => undefined);
}

/** Changes made on this device and not on the server yet. */
export function waitingCount(): number {
  return outbox.getState().entries.length;
}

// ---------------------------------------------------------------------------------------------------
// Photos waiting on the device
// ---------------------------------------------------------------------------------------------------

const photoUrls = new Map<string, string>();

/** Keeps a scaled photo on the device, within the budget; throws with a message when it does not fit. */
export async function keepPhoto(input: { assessmentId: string; userId: string; blob: Blob }): Promise<StoredPhoto> {
  const used = keep ? await devicePhotos.bytes() : 0;
  const check = checkPhotoBudget(used, input.blob.size, PHOTO_BUDGET_BYTES);
  if (!check.ok) throw new ApiError(507, 'device_storage_full', check.message);
  const photo: StoredPhoto = {
    id: globalThis.crypto.randomUUID(),
    assessmentId: input.assessmentId,
    userId: input.userId,
    blob: input.blob,
    bytes: input.blob.size,
    createdAt: new Date().toISOString(),
  };
  if (keep) await devicePhotos.put(photo);
  else memoryPhotos.set(photo.id, photo);
  return photo;
}

const memoryPhotos = new Map<string, StoredPhoto>();

export async function photoBlob(id: string): Promise<Blob | null> {
  const p = keep ? await devicePhotos.get(id) : memoryPhotos.get(id);
  return p?.blob ?? null;
}

/** An object URL for showing a waiting photo (made once per photo). */
export async function photoUrl(id: string): Promise<string | null> {
  const known = photoUrls.get(id);
  if (known) return known;
  const blob = await photoBlob(id);
  if (!blob) return null;
  const url = URL.createObjectURL(blob);
  photoUrls.set(id, url);
  return url;
}

/** The server has the photo: it leaves the device. */
export async function forgetPhoto(id: string): Promise<void> {
  if (keep) await devicePhotos.remove(id);
  else memoryPhotos.delete(id);
}

export async function photoBytesOnDevice(): Promise<number> {
  return keep ? devicePhotos.bytes() : [...memoryPhotos.values()].reduce((s, p) => s + p.bytes, 0);
}

/** Drafts kept by earlier versions of the app in localStorage. */
function forgetLegacyCopies(): void {
  try {
    const store = globalThis.localStorage;
    if (!store) return;
    const keys: string[] = [];
    for (let i = 0; i < store.length; i += 1) {
      const k = store.key(i);
      if (k?.startsWith('squadline.screening.draft.')) keys.push(k);
    }
    keys.forEach((k) => store.removeItem(k));
  } catch {
    // storage blocked: nothing kept there either
  }
}
