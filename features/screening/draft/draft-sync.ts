// Sends the device's copy of one draft to the server: the outbox's sender for draft entries. Pure apart
// from the injected request. The copy on the device is the truth: whatever is in it when the entry goes
// out is sent, so one entry carries every edit made before it, and a submit queued after it never goes
// out on an older draft.
//
// - Each save is sent once as an `inflight` snapshot with its own idempotency key; a retry after a lost
//   answer sends the very same snapshot and key (the server answers from its record).
// - A 409 (another phone saved first) merges on the device: this phone's edits since its last confirmed
//   save win field by field, the rest takes the server's newer draft (merge.ts); then it saves again.
import type { AssessmentDraft } from '@/features/screening/contract';
import type { LocalCopy, LocalCopyStorage } from './local-copy';
import { deepEqual, mergeDrafts } from './merge';

export type ServerDraft = { draft: AssessmentDraft; draftVersion: number };

type HttpError = Error & { status: number; code?: string };

export type DraftSyncDeps = {
  storage: LocalCopyStorage;
  put(baseVersion: number, draft: AssessmentDraft, key: string): Promise<{ draftVersion: number }>;
  /** The server's current draft after a 409 (from the answer's body, or a fresh read). */
  serverDraftAfterConflict(error: HttpError): Promise<ServerDraft>;
  newKey(): string;
  now?: () => Date;
  /** Told after every confirmed save or merge, with the device's state of the draft. */
  onSynced(state: Pick<LocalCopy, 'base' | 'baseVersion' | 'draft'>, merged: boolean): void;
};

/** Merges in a row before giving up (two phones saving in turn settle in one or two). */
const MAX_MERGES = 5;

export async function sendDraftCopy(id: string, deps: DraftSyncDeps): Promise<void> {
  const stamp = () => (deps.now?.() ?? new Date()).toISOString();
  for (let merges = 0; ; ) {
    const copy = deps.storage.read(id);
    if (!copy) return;
    if (!copy.inflight && deepEqual(copy.draft, copy.base)) {
      deps.storage.remove(id);
      deps.onSynced(copy, false);
      return;
    }
    const inflight = copy.inflight ?? { key: deps.newKey(), baseVersion: copy.baseVersion, draft: copy.draft };
    if (!copy.inflight) deps.storage.write(id, { ...copy, inflight });
    try {
      const res = await deps.put(inflight.baseVersion, inflight.draft, inflight.key);
      const now = deps.storage.read(id) ?? copy;
      const next: LocalCopy = { base: inflight.draft, baseVersion: res.draftVersion, draft: now.draft, savedAt: stamp() };
      if (deepEqual(next.draft, next.base)) {
        deps.storage.remove(id);
        deps.onSynced(next, false);
        return;
      }
      // Edited while the save was on its way: save the rest.
      deps.storage.write(id, next);
      deps.onSynced(next, false);
    } catch (e) {
      const error = e as HttpError;
      // A 409 `request_in_progress` is the same save still running on the server: the outbox retries it.
      // A closed round is a 409 too, but nothing newer to merge: it is refused like any other refusal.
      if (error?.status !== 409 || error.code === 'request_in_progress' || error.code === 'round_closed') throw e;
      if (merges >= MAX_MERGES) throw e;
      merges += 1;
      const server = await deps.serverDraftAfterConflict(error);
      const now = deps.storage.read(id) ?? copy;
      const next: LocalCopy = {
        base: server.draft,
        baseVersion: server.draftVersion,
        draft: mergeDrafts(now.base, now.draft, server.draft),
        savedAt: stamp(),
      };
      deps.storage.write(id, next);
      deps.onSynced(next, true);
    }
  }
}
