import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import type { AssessmentDraft } from '@/features/screening/contract';
import { DraftStore, SAVE_DEBOUNCE_MS } from './draft-store';
import type { LocalCopy, LocalCopyStorage } from './local-copy';

function memoryStorage(): LocalCopyStorage & { copies: Map<string, LocalCopy> } {
  const copies = new Map<string, LocalCopy>();
  return {
    copies,
    read: (id) => (copies.has(id) ? structuredClone(copies.get(id)!) : null),
    write: (id, copy) => void copies.set(id, structuredClone(copy)),
    remove: (id) => void copies.delete(id),
  };
}

const draft = (notes: string, stature: number | null = null): AssessmentDraft => ({
  body: { statureCm: stature },
  tasks: { 'two-leg-squat': { criteria: [], notes } },
});

function makeStore(storage = memoryStorage()) {
  const requestSave = vi.fn();
  return { store: new DraftStore('a1', { storage, requestSave }), storage, requestSave };
}

describe('DraftStore', () => {
  beforeEach(() => vi.useFakeTimers());
  afterEach(() => vi.useRealTimers());

  it('keeps a copy on the device at once and queues the save after the debounce', async () => {
    const { store, storage, requestSave } = makeStore();
    store.init({ draft: draft(''), draftVersion: 3 });
    store.update(() => draft('knees in'));
    expect(storage.read('a1')).toMatchObject({ base: draft(''), baseVersion: 3, draft: draft('knees in') });
    expect(store.getSnapshot().dirty).toBe(true);
    await vi.advanceTimersByTimeAsync(SAVE_DEBOUNCE_MS - 10);
    expect(requestSave).not.toHaveBeenCalled();
    await vi.advanceTimersByTimeAsync(20);
    expect(requestSave).toHaveBeenCalledTimes(1);
  });

  it('resumes a copy left on the device, merged into a newer server draft', async () => {
    const storage = memoryStorage();
    storage.write('a1', { base: draft(''), baseVersion: 4, draft: draft('typed offline'), savedAt: '' });
    const { store, requestSave } = makeStore(storage);
    store.init({ draft: { ...draft(''), body: { statureCm: 151 } }, draftVersion: 5 });
    expect(store.getSnapshot().draft).toEqual(draft('typed offline', 151));
    expect(storage.read('a1')?.baseVersion).toBe(5);
    await vi.advanceTimersByTimeAsync(1);
    expect(requestSave).toHaveBeenCalled();
  });

  it('keeps a device copy newer than the server answer kept offline (reload without a connection)', () => {
    const storage = memoryStorage();
    const inflight = { key: 'k-1', baseVersion: 6, draft: draft('sent') };
    storage.write('a1', { base: draft('saved'), baseVersion: 6, draft: draft('sent and more'), savedAt: '', inflight });
    const { store } = makeStore(storage);
    store.init({ draft: draft('old'), draftVersion: 5 });
    expect(store.getSnapshot().draft).toEqual(draft('sent and more'));
    // The save on its way keeps its key: a retry must send the same.
    store.update(() => draft('sent and even more'));
    expect(storage.read('a1')?.inflight).toEqual(inflight);
  });

  it('takes a merge made by the sender as the working draft and says so', () => {
    const { store } = makeStore();
    store.init({ draft: draft(''), draftVersion: 1 });
    store.update(() => draft('mine'));
    store.synced({ base: draft('theirs', 150), baseVersion: 2, draft: draft('mine', 150) }, true);
    expect(store.getSnapshot()).toMatchObject({ draft: draft('mine', 150), dirty: true, mergedFromServer: true });
    store.synced({ base: draft('mine', 150), baseVersion: 3, draft: draft('mine', 150) }, false);
    expect(store.getSnapshot()).toMatchObject({ dirty: false, mergedFromServer: true });
    expect(store.version).toBe(3);
  });
});
