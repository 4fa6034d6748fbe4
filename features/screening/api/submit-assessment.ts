import { api } from '@/features/api/client';
import { deviceSession, outbox } from '@/features/offline/device-handle';
import type { ResultView } from '@/features/screening/contract';
import { sentFromDevice } from './save-draft';

export const submitAssessment = (id: string, device: { idempotencyKey?: string; clubId?: string } = {}) =>
  api<ResultView>(`/assessments/${encodeURIComponent(id)}/submit`, { method: 'POST', headers: sentFromDevice(device) });

/**
 * Queues the submit on the device, behind the draft and photos of the assessment: it goes out in order
 * when there is a connection, with its idempotency key, so a retry never makes a second result.
 */
export async function queueSubmit(assessmentId: string) {
  const { userId, clubId } = deviceSession();
  return outbox.add({ kind: 'submit', assessmentId, userId, clubId });
}
