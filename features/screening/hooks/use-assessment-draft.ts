import { useCallback, useEffect, useMemo, useSyncExternalStore } from 'react';
import { useOnline, useOutboxState } from '@/features/offline/device-handle';
import type { OutboxState } from '@/features/offline/outbox';
import type { AssessmentDetail, AssessmentDraft } from '@/features/screening/contract';
import type { SaveStatus } from '@/features/screening/draft/draft-store';
import { draftStoreFor } from '@/features/screening/draft/registry';

/** Where the saving of this draft is: from the device's copy and the outbox's entries. */
export function draftSaveStatus(assessmentId: string, dirty: boolean, online: boolean, state: OutboxState): SaveStatus {
  const own = state.entries.filter((e) => e.kind === 'draft' && e.assessmentId === assessmentId);
  const refused = own.find((e) => e.state === 'refused');
  if (refused?.error) return { kind: 'refused', message: refused.error.message };
  if (!dirty && own.length === 0) return { kind: 'saved' };
  if (!online) return { kind: 'kept' };
  if (own.some((e) => e.seq === state.sending)) return { kind: 'saving' };
  const head = own[0];
  if (head && state.lastError && state.sending === null) return { kind: 'retrying', message: state.lastError.message, attempt: head.attempts };
  return { kind: 'pending' };
}

/**
 * The working draft of an assessment, seeded once from the server (or from what the device kept) and
 * then saved through the device's outbox. Queues the save at once when the page is hidden.
 */
export function useAssessmentDraft(detail: AssessmentDetail | undefined, assessmentId: string) {
  const store = draftStoreFor(assessmentId);
  if (detail && !store.isReady) store.init({ draft: detail.draft, draftVersion: detail.draftVersion });
  const snapshot = useSyncExternalStore(store.subscribe, store.getSnapshot, store.getSnapshot);
  const queue = useOutboxState();
  const online = useOnline();

  useEffect(() => {
    const doc = globalThis.document;
    const win = globalThis.window as (Window & typeof globalThis) | undefined;
    if (!doc || !win?.addEventListener) return;
    const onHide = () => {
      if (doc.visibilityState === 'hidden') store.flushSoon();
    };
    const onPageHide = () => store.flushSoon();
    doc.addEventListener('visibilitychange', onHide);
    win.addEventListener('pagehide', onPageHide);
    return () => {
      doc.removeEventListener('visibilitychange', onHide);
      win.removeEventListener('pagehide', onPageHide);
    };
  }, [store]);

  const status = useMemo(() => draftSaveStatus(assessmentId, snapshot.dirty, online, queue), [assessmentId, snapshot.dirty, online, queue]);
  const update = useCallback((change: (draft: AssessmentDraft) => AssessmentDraft) => store.update(change), [store]);
  const flushSoon = useCallback(() => store.flushSoon(), [store]);
  return { ...snapshot, status, online, update, flushSoon };
}
