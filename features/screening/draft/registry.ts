import { getAssessment } from '@/features/screening/api/get-assessment';
import { saveDraft, serverDraftFromConflict } from '@/features/screening/api/save-draft';
import { DraftStore } from './draft-store';
import { browserLocalCopy } from './local-copy';

// One store per assessment for the life of the page, so moving between steps and screens never drops an
// edit or a save in flight.
const stores = new Map<string, DraftStore>();

export function draftStoreFor(assessmentId: string): DraftStore {
  let store = stores.get(assessmentId);
  if (!store) {
    store = new DraftStore(assessmentId, {
      save: (version, draft, options) => saveDraft(assessmentId, version, draft, options),
      serverDraftAfterConflict: async (error) => {
        const fromBody = serverDraftFromConflict(error);
        if (fromBody) return fromBody;
        const fresh = await getAssessment(assessmentId);
        return { draft: fresh.draft, draftVersion: fresh.draftVersion };
      },
      storage: browserLocalCopy,
    });
    stores.set(assessmentId, store);
  }
  return store;
}
