// The light side of the device store: what every screen may import without downloading it. The store
// itself (IndexedDB through `idb`, the outbox, the draft copies, the photos waiting: `device.ts`) is
// loaded by `loadDevice()`, once, after sign-in (DeviceGate), and this module is the only place that
// imports it. Metro moves a module that two lazily loaded chunks import into the chunk every page loads,
// the sign-in page included; a single `import()` keeps the store in a chunk of its own.
import { useSyncExternalStore } from 'react';
import { browserConnectivity } from './connectivity';
import type * as DeviceModule from './device';
import type { Outbox, OutboxEntry, OutboxKind, OutboxState } from './outbox';

export type Device = typeof DeviceModule;
export type { OutboxEntry, OutboxKind, OutboxState };

/** Whether the browser believes it has a connection (a few lines; needed before the store loads). */
export const connectivity = browserConnectivity();

/** Same name as in device-store.ts (a test checks they agree). */
export const DEVICE_DB_NAME = 'squadline-device';

let loaded: Device | null = null;
let loading: Promise<Device> | null = null;

/** Loads the device store (once). */
export function loadDevice(): Promise<Device> {
  loading ??= import('./device').then((m) => (loaded = m));
  return loading;
}

/** The store if it has been loaded, else null (screens of people who do not screen may never load it). */
export function loadedDevice(): Device | null {
  return loaded;
}

function device(): Device {
  if (!loaded) throw new Error('The device store is not loaded yet: screens that queue changes render inside DeviceGate.');
  return loaded;
}

/**
 * An object whose members are read from `target()` at each use, so a module may hold it from load time
 * while the real object exists only once the store has loaded. Methods are bound to the real object.
 */
export function lateBound<T extends object>(target: () => T): T {
  return new Proxy({} as T, {
    get(_unused, key) {
      const real = target();
      const value: unknown = Reflect.get(real, key, real);
      return typeof value === 'function' ? value.bind(real) : value;
    },
  });
}

/** The device's one outbox (usable once DeviceGate has let the screens render). */
export const outbox: Outbox = lateBound(() => device().outbox);
/** Local copies of drafts (see features/screening/draft), kept on the device. */
export const draftCopies: Device['draftCopies'] = lateBound(() => device().draftCopies);

// ---------------------------------------------------------------------------------------------------
// Who is signed in, and the wipe listeners: plain state, known before the store loads.
// ---------------------------------------------------------------------------------------------------

let session: { userId: string; clubId: string } | null = null;

/** Who is signed in and in which club: stamped on every change queued on this device. */
export function setDeviceSession(next: { userId: string; clubId: string } | null): void {
  session = next;
}

export function deviceSession(): { userId: string; clubId: string } {
  if (!session) throw new Error('No one is signed in on this device.');
  return session;
}

const wipeListeners = new Set<() => void>();
/** Features drop what they hold in memory when the device is wiped. */
export function onDeviceWipe(listener: () => void): () => void {
  wipeListeners.add(listener);
  return () => wipeListeners.delete(listener);
}

/** Called by the store when it wipes the device (sign-out). */
export function notifyDeviceWipe(): void {
  wipeListeners.forEach((l) => l());
}

// ---------------------------------------------------------------------------------------------------
// Calls that wait for the store
// ---------------------------------------------------------------------------------------------------

export const startDevice = async (userId: string) => (await loadDevice()).startDevice(userId);
export const keepPhoto: Device['keepPhoto'] = async (input) => (await loadDevice()).keepPhoto(input);
export const photoBlob = async (id: string) => (await loadDevice()).photoBlob(id);
export const photoUrl = async (id: string) => (await loadDevice()).photoUrl(id);
export const forgetPhoto = async (id: string) => (await loadDevice()).forgetPhoto(id);
/** How a kind of change is sent; until a sender is registered its entries wait. */
export const registerSender: Device['registerSender'] = (kind, sender) => device().registerSender(kind, sender);

/** Everything kept on the device is removed (sign-out), whether or not this page loaded the store. */
export async function wipeOnSignOut(): Promise<void> {
  if (loaded || (await deviceDataMayExist())) await (await loadDevice()).wipeOnSignOut();
  else notifyDeviceWipe();
  session = null;
}

/**
 * Whether this browser may hold a device database (someone screened here). Where the browser cannot
 * list its databases, assume it may.
 */
export async function deviceDataMayExist(): Promise<boolean> {
  const idb = globalThis.indexedDB as (IDBFactory & { databases?: () => Promise<{ name?: string }[]> }) | undefined;
  if (!idb) return false;
  if (typeof idb.databases !== 'function') return true;
  try {
    return (await idb.databases()).some((d) => d.name === DEVICE_DB_NAME);
  } catch {
    return true;
  }
}

// ---------------------------------------------------------------------------------------------------
// Hooks (safe before the store loads: nothing waiting yet)
// ---------------------------------------------------------------------------------------------------

const NOTHING_WAITING: OutboxState = { entries: [], sending: null, lastError: null };
const noSubscription = () => () => undefined;
const nothingWaiting = () => NOTHING_WAITING;

export function useOnline(): boolean {
  return useSyncExternalStore(connectivity.subscribe, connectivity.isOnline, connectivity.isOnline);
}

/** The outbox's state; empty while the store is not loaded. */
export function useOutboxState(): OutboxState {
  const box = loaded?.outbox;
  return useSyncExternalStore(box ? box.subscribe : noSubscription, box ? box.getState : nothingWaiting, box ? box.getState : nothingWaiting);
}
