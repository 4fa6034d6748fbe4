import { useCallback, useEffect, useSyncExternalStore } from 'react';
import type { AssessmentDetail, AssessmentDraft } from '@/features/screening/contract';
import { draftStoreFor } from '@/features/screening/draft/registry';

/**
 * The working draft of an assessment, seeded once from the server and then autosaved. Saves at once
 * when the page is hidden (the phone locks, the tab changes) and when the network comes back.
 */
export function useAssessmentDraft(detail: AssessmentDetail | undefined, assessmentId: string) {
  const store = draftStoreFor(assessmentId);
  if (detail && !store.isReady) store.init({ draft: detail.draft, draftVersion: detail.draftVersion });
  const snapshot = useSyncExternalStore(store.subscribe, store.getSnapshot, store.getSnapshot);

  useEffect(() => {
    const doc = globalThis.document;
    const win = globalThis.window as (Window & typeof globalThis) | undefined;
    if (!doc || !win?.addEventListener) return;
    const onHide = () => {
      if (doc.visibilityState === 'hidden') store.flushSoon({ keepalive: true });
    };
    const onPageHide = () => store.flushSoon({ keepalive: true });
    const onOnline = () => store.flushSoon();
    doc.addEventListener('visibilitychange', onHide);
    win.addEventListener('pagehide', onPageHide);
    win.addEventListener('online', onOnline);
    return () => {
      doc.removeEventListener('visibilitychange', onHide);
      win.removeEventListener('pagehide', onPageHide);
      win.removeEventListener('online', onOnline);
    };
  }, [store]);

  const update = useCallback((change: (draft: AssessmentDraft) => AssessmentDraft) => store.update(change), [store]);
  const flush = useCallback(() => store.flush(), [store]);
  /** The draft version saved last, read after `flush()` to name it in a submit. */
  const savedVersion = useCallback(() => store.version, [store]);
  return { ...snapshot, update, flush, savedVersion };
}
