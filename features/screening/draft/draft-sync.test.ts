import { describe, expect, it, vi } from 'vitest';
import type { AssessmentDraft } from '@/features/screening/contract';
import { sendDraftCopy, type DraftSyncDeps } from './draft-sync';
import type { LocalCopy, LocalCopyStorage } from './local-copy';

function memoryStorage(): LocalCopyStorage {
  const copies = new Map<string, LocalCopy>();
  return {
    read: (id) => (copies.has(id) ? structuredClone(copies.get(id)!) : null),
    write: (id, copy) => void copies.set(id, structuredClone(copy)),
    remove: (id) => void copies.delete(id),
  };
}

const draft = (notes: string, stature: number | null = null): AssessmentDraft => ({
  body: { statureCm: stature },
  tasks: { 'two-leg-squat': { criteria: [], notes } },
});

const httpError = (status: number, code = 'x') => Object.assign(new Error(`HTTP ${status}`), { status, code });

function deps(overrides: Partial<DraftSyncDeps> = {}) {
  const storage = memoryStorage();
  let n = 0;
  const synced: { baseVersion: number; merged: boolean }[] = [];
  const d: DraftSyncDeps = {
    storage,
    put: vi.fn(async (v: number) => ({ draftVersion: v + 1 })),
    serverDraftAfterConflict: async () => ({ draft: draft('server', 150), draftVersion: 7 }),
    newKey: () => `key-${++n}`,
    onSynced: (s, merged) => synced.push({ baseVersion: s.baseVersion, merged }),
    ...overrides,
  };
  return { d, storage, synced };
}

describe('sendDraftCopy', () => {
  it('sends the device copy with a fresh key and drops the copy once the server has it', async () => {
    const { d, storage, synced } = deps();
    storage.write('a1', { base: draft(''), baseVersion: 3, draft: draft('x'), savedAt: '' });
    await sendDraftCopy('a1', d);
    expect(d.put).toHaveBeenCalledWith(3, draft('x'), 'key-1');
    expect(storage.read('a1')).toBeNull();
    expect(synced).toEqual([{ baseVersion: 4, merged: false }]);
  });

  it('a retry after a lost answer sends the very same draft, version and key', async () => {
    const put = vi.fn(async (v: number, _d: AssessmentDraft, _k: string) => {
      if (put.mock.calls.length === 1) throw httpError(0, 'offline');
      return { draftVersion: v + 1 };
    });
    const { d, storage } = deps({ put });
    storage.write('a1', { base: draft(''), baseVersion: 3, draft: draft('x'), savedAt: '' });
    await expect(sendDraftCopy('a1', d)).rejects.toMatchObject({ status: 0 });
    // Typed more while offline: the copy changes, the save on its way does not.
    storage.write('a1', { ...storage.read('a1')!, draft: draft('x and y') });
    await sendDraftCopy('a1', d);
    expect(put.mock.calls.map((c) => [c[0], c[1], c[2]])).toEqual([
      [3, draft('x'), 'key-1'],
      [3, draft('x'), 'key-1'],
      [4, draft('x and y'), 'key-2'],
    ]);
    expect(storage.read('a1')).toBeNull();
  });

  it("on a 409 merges on the device (this phone's edits win) and saves on the server's version", async () => {
    const put = vi.fn(async (v: number) => {
      if (put.mock.calls.length === 1) throw httpError(409, 'stale_draft');
      return { draftVersion: v + 1 };
    });
    const { d, storage, synced } = deps({ put });
    storage.write('a1', { base: draft(''), baseVersion: 2, draft: draft('mine'), savedAt: '' });
    await sendDraftCopy('a1', d);
    expect(put).toHaveBeenLastCalledWith(7, draft('mine', 150), 'key-2');
    expect(synced).toEqual([
      { baseVersion: 7, merged: true },
      { baseVersion: 8, merged: false },
    ]);
  });

  it('a refused save keeps the copy on the device for the tester', async () => {
    const { d, storage } = deps({ put: vi.fn(async () => Promise.reject(httpError(400, 'invalid_input'))) });
    storage.write('a1', { base: draft(''), baseVersion: 0, draft: draft('', 900), savedAt: '' });
    await expect(sendDraftCopy('a1', d)).rejects.toMatchObject({ status: 400 });
    expect(storage.read('a1')?.draft).toEqual(draft('', 900));
  });

  it('treats the same save still running on the server as a retry, not a conflict', async () => {
    const { d, storage } = deps({ put: vi.fn(async () => Promise.reject(httpError(409, 'request_in_progress'))) });
    storage.write('a1', { base: draft(''), baseVersion: 0, draft: draft('a'), savedAt: '' });
    await expect(sendDraftCopy('a1', d)).rejects.toMatchObject({ code: 'request_in_progress' });
    expect(storage.read('a1')?.inflight?.key).toBe('key-1');
  });

  it('a closed round (409 round_closed) is a refusal, not a conflict: nothing is merged, the edits stay', async () => {
    const serverDraftAfterConflict = vi.fn(async () => ({ draft: draft('server'), draftVersion: 9 }));
    const { d, storage } = deps({ put: vi.fn(async () => Promise.reject(httpError(409, 'round_closed'))), serverDraftAfterConflict });
    storage.write('a1', { base: draft(''), baseVersion: 2, draft: draft('late edit'), savedAt: '' });
    await expect(sendDraftCopy('a1', d)).rejects.toMatchObject({ code: 'round_closed' });
    expect(serverDraftAfterConflict).not.toHaveBeenCalled();
    expect(storage.read('a1')?.draft).toEqual(draft('late edit'));
  });
});
