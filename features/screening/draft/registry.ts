// One store per assessment for the life of the page, so moving between steps and screens never drops an
// edit. Integration point with features/offline: the device's copy lives in its store (IndexedDB) and a
// save is an outbox entry, sent by draft-sync.ts (registered in hooks/use-screening-sync.ts).
import { deviceSession, draftCopies, onDeviceWipe, outbox } from '@/features/offline/device-handle';
import { DraftStore } from './draft-store';
import { asLocalCopy, type LocalCopyStorage } from './local-copy';

/** The device's copies of drafts (IndexedDB, mirrored in memory for synchronous reads). */
export const deviceLocalCopy: LocalCopyStorage = {
  read: (id) => asLocalCopy(draftCopies.read(id)),
  write: (id, copy) => draftCopies.write(id, copy),
  remove: (id) => draftCopies.remove(id),
};

const stores = new Map<string, DraftStore>();

/** Queues "send the device's copy of this draft" behind whatever of the assessment is queued already. */
export function queueDraftSave(assessmentId: string) {
  const { userId, clubId } = deviceSession();
  return outbox.addDraft({ assessmentId, userId, clubId });
}

export function draftStoreFor(assessmentId: string): DraftStore {
  let store = stores.get(assessmentId);
  if (!store) {
    store = new DraftStore(assessmentId, {
      storage: deviceLocalCopy,
      requestSave: () => void queueDraftSave(assessmentId),
    });
    stores.set(assessmentId, store);
  }
  return store;
}

/** The live store of an assessment, if a screen opened it. */
export function openDraftStore(assessmentId: string): DraftStore | undefined {
  return stores.get(assessmentId);
}

// Sign-out: no draft of the previous person stays in memory.
onDeviceWipe(() => {
  stores.forEach((s) => s.dispose());
  stores.clear();
});
