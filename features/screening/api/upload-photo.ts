import { sentFromDevice, upload } from '@/features/api/client';
import type { PhotoView } from '@/features/screening/contract';
import type { TaskId, View } from '@/features/screening/engine';

export type PhotoFile = { blob: Blob; name: string } | { uri: string; name: string; type: string };

/** POST /api/assessments/:id/photos (multipart: photo, task, view), with upload progress. */
export async function uploadPhoto(
  assessmentId: string,
  input: { taskId: TaskId; view: View; file: PhotoFile },
  onProgress?: (fraction: number) => void,
  device: { idempotencyKey?: string; clubId?: string } = {},
): Promise<PhotoView> {
  const form = new FormData();
  form.append('task', input.taskId);
  form.append('view', input.view);
  if ('blob' in input.file) form.append('photo', input.file.blob, input.file.name);
  // React Native's FormData takes a file description instead of a Blob.
  else form.append('photo', input.file as unknown as Blob);
  const res = await upload<PhotoView | { photo: PhotoView }>(`/assessments/${encodeURIComponent(assessmentId)}/photos`, form, {
    onProgress,
    headers: sentFromDevice(device),
  });
  return 'photo' in res ? res.photo : res;
}
