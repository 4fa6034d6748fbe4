import { useSyncExternalStore } from 'react';
import { uploadQueue } from '@/features/screening/photos/upload-registry';
import type { UploadItem, UploadSlot } from '@/features/screening/photos/upload-queue';

export function useUploadItem(assessmentId: string, slot: UploadSlot): UploadItem | undefined {
  return useSyncExternalStore(
    uploadQueue.subscribe,
    () => uploadQueue.get(assessmentId, slot),
    () => uploadQueue.get(assessmentId, slot),
  );
}

/** Photos of the assessment not on the server yet (uploading, or failed and kept for a retry). */
export function useUnfinishedUploads(assessmentId: string): number {
  return useSyncExternalStore(
    uploadQueue.subscribe,
    () => uploadQueue.unfinished(assessmentId),
    () => uploadQueue.unfinished(assessmentId),
  );
}
