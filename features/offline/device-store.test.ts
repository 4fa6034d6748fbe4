import 'fake-indexeddb/auto';
import { describe, expect, it } from 'vitest';
import { DEVICE_DB_NAME as HANDLE_DB_NAME, deviceDataMayExist } from './device-handle';
import { DEVICE_DB_NAME, deviceCache, deviceDrafts, devicePhotos, idbOutboxStorage, wipeDevice } from './device-store';

// IndexedDB in Node through fake-indexeddb: the same `idb` calls the browser runs.
describe('device store', () => {
  it('keeps the outbox in order with its sequence numbers, and wipes everything at sign-out', async () => {
    const base = { kind: 'draft' as const, assessmentId: 'a1', clubId: 'c1', userId: 'u1', createdAt: '', attempts: 0, state: 'waiting' as const };
    const first = await idbOutboxStorage.add({ ...base, key: 'k1' });
    const second = await idbOutboxStorage.add({ ...base, key: 'k2', kind: 'submit' });
    expect(second.seq).toBeGreaterThan(first.seq);
    await idbOutboxStorage.put({ ...first, attempts: 2 });
    expect((await idbOutboxStorage.all()).map((e) => [e.key, e.attempts])).toEqual([
      ['k1', 2],
      ['k2', 0],
    ]);
    await devicePhotos.put({ id: 'p1', assessmentId: 'a1', userId: 'u1', blob: new Blob(['x'.repeat(300)]), bytes: 300, createdAt: '' });
    await deviceDrafts.put('a1', { draft: 1 });
    await deviceCache.put({ key: 'round', scope: 'c1', roundId: 'r1', data: { name: 'R' }, savedAt: '' });
    expect(await devicePhotos.bytes()).toBe(300);

    await wipeDevice();
    expect(await idbOutboxStorage.all()).toEqual([]);
    expect(await devicePhotos.all()).toEqual([]);
    expect(await deviceDrafts.all()).toEqual([]);
    expect(await deviceCache.keys()).toEqual([]);
  });

  it('is found by the light handle under the same name, so a non-screener’s sign-in still removes another person’s data', async () => {
    expect(HANDLE_DB_NAME).toBe(DEVICE_DB_NAME);
    await deviceCache.put({ key: 'probe', scope: 'c1', roundId: null, data: 1, savedAt: '' });
    expect(await deviceDataMayExist()).toBe(true);
  });
});
