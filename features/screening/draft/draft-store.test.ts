import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { ApiError } from '@/features/api/client';
import type { AssessmentDraft } from '@/features/screening/contract';
import { DraftStore, SAVE_DEBOUNCE_MS, type DraftStoreDeps } from './draft-store';
import type { LocalCopy, LocalCopyStorage } from './local-copy';

function memoryStorage(): LocalCopyStorage & { copies: Map<string, LocalCopy> } {
  const copies = new Map<string, LocalCopy>();
  return {
    copies,
    read: (id) => copies.get(id) ?? null,
    write: (id, copy) => void copies.set(id, structuredClone(copy)),
    remove: (id) => void copies.delete(id),
  };
}

const draft = (notes: string, stature: number | null = null): AssessmentDraft => ({
  body: { statureCm: stature },
  tasks: { 'two-leg-squat': { criteria: [], notes } },
});

function makeStore(overrides: Partial<DraftStoreDeps> = {}) {
  const storage = memoryStorage();
  const save = vi.fn(async (version: number) => ({ draftVersion: version + 1 }));
  const deps: DraftStoreDeps = {
    save,
    serverDraftAfterConflict: async () => ({ draft: draft('server', 150), draftVersion: 7 }),
    storage,
    ...overrides,
  };
  return { store: new DraftStore('a1', deps), storage, save: (overrides.save as typeof save) ?? save };
}

describe('DraftStore', () => {
  beforeEach(() => vi.useFakeTimers());
  afterEach(() => vi.useRealTimers());

  it('keeps a local copy at once and saves the whole draft after the debounce', async () => {
    const { store, storage, save } = makeStore();
    store.init({ draft: draft(''), draftVersion: 3 });
    store.update(() => draft('knees in'));
    expect(storage.read('a1')?.draft).toEqual(draft('knees in'));
    expect(store.getSnapshot().status.kind).toBe('pending');
    await vi.advanceTimersByTimeAsync(SAVE_DEBOUNCE_MS - 10);
    expect(save).not.toHaveBeenCalled();
    await vi.advanceTimersByTimeAsync(20);
    expect(save).toHaveBeenCalledWith(3, draft('knees in'), {});
    expect(store.getSnapshot().status.kind).toBe('saved');
    expect(storage.read('a1')).toBeNull();
  });

  it('retries a failed save with back-off and keeps the copy meanwhile', async () => {
    let fail = true;
    const save = vi.fn(async (v: number) => {
      if (fail) throw new ApiError(0, 'offline', 'No connection');
      return { draftVersion: v + 1 };
    });
    const { store, storage } = makeStore({ save });
    store.init({ draft: draft(''), draftVersion: 0 });
    store.update(() => draft('x'));
    await vi.advanceTimersByTimeAsync(SAVE_DEBOUNCE_MS);
    expect(store.getSnapshot().status).toMatchObject({ kind: 'retrying', attempt: 1 });
    expect(storage.read('a1')?.draft).toEqual(draft('x'));
    fail = false;
    await vi.advanceTimersByTimeAsync(2_000);
    expect(store.getSnapshot().status.kind).toBe('saved');
    expect(save).toHaveBeenCalledTimes(2);
  });

  it('on a 409 merges the server draft, keeping this phone\'s edits, and saves on its version', async () => {
    let calls = 0;
    const save = vi.fn(async (v: number) => {
      calls += 1;
      if (calls === 1) throw new ApiError(409, 'stale_draft', 'A newer draft exists.');
      return { draftVersion: v + 1 };
    });
    const { store } = makeStore({ save });
    store.init({ draft: draft(''), draftVersion: 2 });
    store.update((d) => ({ ...d, tasks: { 'two-leg-squat': { criteria: [], notes: 'mine' } } }));
    await vi.advanceTimersByTimeAsync(SAVE_DEBOUNCE_MS);
    await vi.advanceTimersByTimeAsync(1);
    expect(save).toHaveBeenLastCalledWith(7, draft('mine', 150), {});
    expect(store.getSnapshot().draft).toEqual(draft('mine', 150));
    expect(store.getSnapshot().mergedFromServer).toBe(true);
    expect(store.getSnapshot().status.kind).toBe('saved');
  });

  it('a closed round (409 round_closed) is a refusal, not a conflict: nothing is merged, the edits stay', async () => {
    const save = vi.fn(async () => {
      throw new ApiError(409, 'round_closed', 'This round is closed.');
    });
    const serverDraftAfterConflict = vi.fn(async () => ({ draft: draft('server'), draftVersion: 9 }));
    const { store, storage } = makeStore({ save, serverDraftAfterConflict });
    store.init({ draft: draft(''), draftVersion: 2 });
    store.update(() => draft('late edit'));
    await vi.advanceTimersByTimeAsync(SAVE_DEBOUNCE_MS);
    await vi.advanceTimersByTimeAsync(60_000);
    expect(save).toHaveBeenCalledTimes(1);
    expect(serverDraftAfterConflict).not.toHaveBeenCalled();
    expect(store.getSnapshot().status).toMatchObject({ kind: 'refused', message: 'This round is closed.' });
    expect(storage.read('a1')?.draft).toEqual(draft('late edit'));
  });

  it('resumes a copy left on the phone (the page was closed before the save)', async () => {
    const storage = memoryStorage();
    storage.write('a1', { base: draft(''), baseVersion: 4, draft: draft('typed offline'), savedAt: '' });
    const save = vi.fn(async (v: number) => ({ draftVersion: v + 1 }));
    const store = new DraftStore('a1', { save, storage, serverDraftAfterConflict: async () => ({ draft: draft(''), draftVersion: 4 }) });
    store.init({ draft: { ...draft(''), body: { statureCm: 151 } }, draftVersion: 5 });
    expect(store.getSnapshot().draft).toEqual(draft('typed offline', 151));
    await vi.advanceTimersByTimeAsync(1);
    expect(save).toHaveBeenCalledWith(5, draft('typed offline', 151), {});
  });

  it('a refused save keeps the edits and says why', async () => {
    const save = vi.fn(async () => {
      throw new ApiError(400, 'invalid', 'Standing height (cm) must be at most 220.', { 'draft.body.statureCm': 'too big' });
    });
    const { store, storage } = makeStore({ save });
    store.init({ draft: draft(''), draftVersion: 0 });
    store.update(() => draft('', 900));
    const flushed = store.flush();
    await expect(flushed).rejects.toThrow('at most 220');
    expect(store.getSnapshot().status).toMatchObject({ kind: 'refused' });
    expect(storage.read('a1')?.draft).toEqual(draft('', 900));
  });

  it('flush resolves once everything typed is on the server', async () => {
    const { store, save } = makeStore();
    store.init({ draft: draft(''), draftVersion: 0 });
    store.update(() => draft('a'));
    await store.flush();
    expect(save).toHaveBeenCalledTimes(1);
    expect(store.getSnapshot().status.kind).toBe('saved');
  });
});
