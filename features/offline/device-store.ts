// What Squadline keeps on the device, in IndexedDB through `idb`: the outbox, photos waiting to be
// uploaded, the local copies of drafts, and the rounds the tester opened (with their athletes and open
// drafts) so a round opens and reloads with no connection. Everything is removed at sign-out (`wipe`).
import { openDB, type DBSchema, type IDBPDatabase } from 'idb';
import type { OutboxEntry, OutboxStorage } from './outbox';

export const DEVICE_DB_NAME = 'squadline-device';
const DB_VERSION = 1;

/** A scaled photo waiting for upload. */
export type StoredPhoto = { id: string; assessmentId: string; userId: string; blob: Blob; bytes: number; createdAt: string };

/** A server answer kept for offline use; `scope` is the club (or the person, for their own profile). */
export type CachedItem = { key: string; scope: string; roundId: string | null; data: unknown; savedAt: string };

export type DraftCopyRecord = { id: string; copy: unknown };

interface DeviceSchema extends DBSchema {
  outbox: { key: number; value: OutboxEntry };
  photos: { key: string; value: StoredPhoto; indexes: { byAssessment: string } };
  drafts: { key: string; value: DraftCopyRecord };
  cache: { key: string; value: CachedItem; indexes: { byRound: string } };
  meta: { key: string; value: { key: string; value: unknown } };
}

export type DeviceDb = IDBPDatabase<DeviceSchema>;

let opening: Promise<DeviceDb> | null = null;

/** Null where there is no IndexedDB (native without a module, some private modes): nothing is kept. */
export function hasIndexedDb(): boolean {
  return typeof globalThis.indexedDB !== 'undefined';
}

export function deviceDb(): Promise<DeviceDb> {
  opening ??= openDB<DeviceSchema>(DEVICE_DB_NAME, DB_VERSION, {
    upgrade(db) {
      db.createObjectStore('outbox', { keyPath: 'seq', autoIncrement: true });
      db.createObjectStore('photos', { keyPath: 'id' }).createIndex('byAssessment', 'assessmentId');
      db.createObjectStore('drafts', { keyPath: 'id' });
      db.createObjectStore('cache', { keyPath: 'key' }).createIndex('byRound', 'roundId');
      db.createObjectStore('meta', { keyPath: 'key' });
    },
    blocking() {
      // Another tab upgrades the schema: let it.
      void opening?.then((db) => db.close());
      opening = null;
    },
  });
  return opening;
}

export const idbOutboxStorage: OutboxStorage = {
  async all() {
    return (await deviceDb()).getAll('outbox');
  },
  async add(entry) {
    const db = await deviceDb();
    // The key path is auto-incremented: IndexedDB writes the new seq into the stored record.
    const seq = await db.add('outbox', entry as OutboxEntry);
    return { ...entry, seq: Number(seq) };
  },
  async put(entry) {
    await (await deviceDb()).put('outbox', entry);
  },
  async remove(seq) {
    await (await deviceDb()).delete('outbox', seq);
  },
};

export const devicePhotos = {
  async put(photo: StoredPhoto) {
    await (await deviceDb()).put('photos', photo);
  },
  async get(id: string) {
    return (await deviceDb()).get('photos', id);
  },
  async remove(id: string) {
    await (await deviceDb()).delete('photos', id);
  },
  async all() {
    return (await deviceDb()).getAll('photos');
  },
  /** Bytes of photos held on the device, for the storage budget. */
  async bytes() {
    return (await this.all()).reduce((sum, p) => sum + p.bytes, 0);
  },
};

export const deviceDrafts = {
  async all() {
    return (await deviceDb()).getAll('drafts');
  },
  async put(id: string, copy: unknown) {
    await (await deviceDb()).put('drafts', { id, copy });
  },
  async remove(id: string) {
    await (await deviceDb()).delete('drafts', id);
  },
};

export const deviceCache = {
  async get(key: string) {
    return (await deviceDb()).get('cache', key);
  },
  async put(item: CachedItem) {
    await (await deviceDb()).put('cache', item);
  },
  async keys() {
    return (await deviceDb()).getAllKeys('cache');
  },
};

export const deviceMeta = {
  async get<T>(key: string): Promise<T | undefined> {
    return (await (await deviceDb()).get('meta', key))?.value as T | undefined;
  },
  async set(key: string, value: unknown) {
    await (await deviceDb()).put('meta', { key, value });
  },
};

/** Removes everything Squadline keeps on the device (sign-out, or another person signs in). */
export async function wipeDevice(): Promise<void> {
  if (!hasIndexedDb()) return;
  const db = await deviceDb();
  const tx = db.transaction(['outbox', 'photos', 'drafts', 'cache', 'meta'], 'readwrite');
  await Promise.all([
    tx.objectStore('outbox').clear(),
    tx.objectStore('photos').clear(),
    tx.objectStore('drafts').clear(),
    tx.objectStore('cache').clear(),
    tx.objectStore('meta').clear(),
    tx.done,
  ]);
}
