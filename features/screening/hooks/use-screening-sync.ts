// How screening's changes queued on the device are sent (draft saves, photos, submits), and what the
// screens learn when they are. Integration point with features/offline: mounted once in the signed-in
// shell, so the queue is sent whatever screen is open.
import { useQueryClient, type QueryClient } from '@tanstack/react-query';
import { useEffect } from 'react';
import { ApiError } from '@/features/api/client';
import { updateKept } from '@/features/offline/device-cache';
import { forgetPhoto, outbox, photoBlob, registerSender } from '@/features/offline/device-handle';
import type { ScreeningEntry } from '@/features/offline/outbox';
import { getAssessment } from '@/features/screening/api/get-assessment';
import { assessmentKeptKey, roundKeptKey, screeningKeys } from '@/features/screening/api/keys';
import { careKeys } from '@/features/care/api/keys';
import { saveDraft, serverDraftFromConflict } from '@/features/screening/api/save-draft';
import { submitAssessment } from '@/features/screening/api/submit-assessment';
import { uploadPhoto } from '@/features/screening/api/upload-photo';
import type { AssessmentDetail, PhotoView, RoundDetail } from '@/features/screening/contract';
import { sendDraftCopy } from '@/features/screening/draft/draft-sync';
import { deviceLocalCopy, openDraftStore } from '@/features/screening/draft/registry';
import type { TaskId } from '@/features/screening/engine';
import { uploadQueue } from '@/features/screening/photos/upload-registry';

function sendDraft(entry: ScreeningEntry, qc: QueryClient) {
  const id = entry.assessmentId;
  return sendDraftCopy(id, {
    storage: deviceLocalCopy,
    newKey: () => globalThis.crypto.randomUUID(),
    put: (baseVersion, draft, key) => saveDraft(id, baseVersion, draft, { idempotencyKey: key, clubId: entry.clubId }),
    serverDraftAfterConflict: async (error) => {
      const fromBody = error instanceof ApiError ? serverDraftFromConflict(error) : null;
      if (fromBody) return fromBody;
      const fresh = await getAssessment(id);
      return { draft: fresh.draft, draftVersion: fresh.draftVersion };
    },
    onSynced: (state, merged) => {
      openDraftStore(id)?.synced(state, merged);
      const change = (d: AssessmentDetail): AssessmentDetail => ({
        ...d,
        draft: state.base,
        draftVersion: state.baseVersion,
        status: d.status === 'not_started' ? 'in_progress' : d.status,
      });
      qc.setQueryData<AssessmentDetail>(screeningKeys.assessment(entry.clubId, id), (old) => (old ? change(old) : old));
      void updateKept<AssessmentDetail>(assessmentKeptKey(id), change);
    },
  });
}

async function sendPhoto(entry: ScreeningEntry, qc: QueryClient) {
  const ref = entry.photo;
  const blob = ref ? await photoBlob(ref.blobId) : null;
  if (!ref || !blob) throw new ApiError(410, 'photo_missing', 'This photo is no longer on this phone. Take it again.');
  const photo = await uploadPhoto(
    entry.assessmentId,
    { taskId: ref.taskId as TaskId, view: ref.view, file: { blob, name: 'photo.jpg' } },
    (p) => uploadQueue.setProgress(entry.seq, p),
    { idempotencyKey: entry.key, clubId: entry.clubId },
  );
  const add = (d: AssessmentDetail): AssessmentDetail => ({
    ...d,
    photos: [...d.photos.filter((p: PhotoView) => p.id !== photo.id), photo],
  });
  qc.setQueryData<AssessmentDetail>(screeningKeys.assessment(entry.clubId, entry.assessmentId), (old) => (old ? add(old) : old));
  await updateKept<AssessmentDetail>(assessmentKeptKey(entry.assessmentId), add);
  // The server has it: it leaves the device.
  await forgetPhoto(ref.blobId);
}

async function sendSubmit(entry: ScreeningEntry, qc: QueryClient) {
  // The drafts queued before this submit have gone out: the device's copy now holds the version it saw.
  const draftVersion = deviceLocalCopy.read(entry.assessmentId)?.baseVersion;
  const result = await submitAssessment(entry.assessmentId, { idempotencyKey: entry.key, clubId: entry.clubId, draftVersion });
  const detail = await updateKeptSubmitted(entry.assessmentId, result);
  if (detail) {
    await updateKept<RoundDetail>(roundKeptKey(detail.roundId), (r) => ({
      ...r,
      athletes: r.athletes.map((a) => (a.assessmentId === entry.assessmentId ? { ...a, status: 'submitted', flagCount: result.result.flags.length } : a)),
    }));
  }
  void qc.invalidateQueries({ queryKey: screeningKeys.club(entry.clubId) });
  // Pain reported (or not) at this screen changes who waits for a physiotherapist (the stop tags).
  void qc.invalidateQueries({ queryKey: careKeys.clearances(entry.clubId) });
}

async function updateKeptSubmitted(assessmentId: string, result: AssessmentDetail['result']): Promise<AssessmentDetail | null> {
  let detail: AssessmentDetail | null = null;
  await updateKept<AssessmentDetail>(assessmentKeptKey(assessmentId), (d) => {
    detail = { ...d, status: 'submitted', result };
    return detail;
  });
  return detail;
}

/** Registers screening's senders with the device's outbox (once per signed-in shell). */
export function useScreeningSync() {
  const qc = useQueryClient();
  useEffect(() => {
    registerSender('draft', (e) => sendDraft(e, qc));
    registerSender('photo', (e) => sendPhoto(e, qc));
    registerSender('submit', (e) => sendSubmit(e, qc));
    outbox.kick();
  }, [qc]);
}
