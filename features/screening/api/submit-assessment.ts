import { api, sentFromDevice } from '@/features/api/client';
import { deviceSession, outbox } from '@/features/offline/device-handle';
import type { ResultView } from '@/features/screening/contract';

/**
 * POST the submit. `draftVersion` names the draft version this device last saw: if another phone saved
 * since, the server answers 409 with its current draft instead of evaluating a draft nobody reviewed here.
 */
export const submitAssessment = (id: string, device: { idempotencyKey?: string; clubId?: string; draftVersion?: number } = {}) =>
  api<ResultView>(`/assessments/${encodeURIComponent(id)}/submit`, {
    method: 'POST',
    headers: sentFromDevice(device),
    json: device.draftVersion !== undefined ? { draftVersion: device.draftVersion } : {},
  });

/**
 * Queues the submit on the device, behind the draft and photos of the assessment: it goes out in order
 * when there is a connection, with its idempotency key, so a retry never makes a second result.
 */
export async function queueSubmit(assessmentId: string) {
  const { userId, clubId } = deviceSession();
  return outbox.add({ kind: 'submit', assessmentId, userId, clubId });
}
