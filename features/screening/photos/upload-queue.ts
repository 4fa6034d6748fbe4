// Photo uploads of the open assessments. Kept outside React so an upload (and the scaled photo, for a
// retry) survives moving between steps. Pure TypeScript apart from the injected upload function.
import { ApiError } from '@/features/api/client';
import type { PhotoView } from '@/features/screening/contract';
import type { TaskId, View } from '@/features/screening/engine';
import type { PhotoFile } from '@/features/screening/api/upload-photo';

export type UploadSlot = `${TaskId}:${View}`;
export const slotOf = (taskId: TaskId, view: View): UploadSlot => `${taskId}:${view}`;

export type UploadItem = {
  assessmentId: string;
  taskId: TaskId;
  view: View;
  previewUri: string;
  width: number;
  height: number;
  file: PhotoFile;
  state: 'uploading' | 'failed';
  progress: number;
  error: ApiError | null;
};

type Uploader = (
  assessmentId: string,
  input: { taskId: TaskId; view: View; file: PhotoFile },
  onProgress: (fraction: number) => void,
) => Promise<PhotoView>;

export class UploadQueue {
  private items = new Map<string, UploadItem>();
  private listeners = new Set<() => void>();
  private version = 0;

  constructor(private readonly uploader: Uploader) {}

  subscribe = (l: () => void) => {
    this.listeners.add(l);
    return () => {
      this.listeners.delete(l);
    };
  };

  getVersion = () => this.version;

  /** How many photos of the assessment are still on their way, or failed and waiting for a retry. */
  unfinished(assessmentId: string): number {
    return [...this.items.values()].filter((i) => i.assessmentId === assessmentId).length;
  }

  get(assessmentId: string, slot: UploadSlot): UploadItem | undefined {
    return this.items.get(`${assessmentId}|${slot}`);
  }

  private put(item: UploadItem | null, key: string) {
    if (item) this.items.set(key, item);
    else this.items.delete(key);
    this.version += 1;
    this.listeners.forEach((l) => l());
  }

  /** Starts (or restarts) an upload; resolves with the stored photo, or null when it failed (kept for a retry). */
  async start(
    item: Omit<UploadItem, 'state' | 'progress' | 'error'>,
    onDone: (photo: PhotoView) => void,
  ): Promise<PhotoView | null> {
    const key = `${item.assessmentId}|${slotOf(item.taskId, item.view)}`;
    let current: UploadItem = { ...item, state: 'uploading', progress: 0, error: null };
    this.put(current, key);
    try {
      const photo = await this.uploader(item.assessmentId, { taskId: item.taskId, view: item.view, file: item.file }, (p) => {
        current = { ...current, progress: p };
        if (this.items.get(key)?.previewUri === item.previewUri) this.put(current, key);
      });
      onDone(photo);
      if (this.items.get(key)?.previewUri === item.previewUri) this.put(null, key);
      return photo;
    } catch (e) {
      const error = e instanceof ApiError ? e : new ApiError(0, 'failed', e instanceof Error ? e.message : String(e));
      if (this.items.get(key)?.previewUri === item.previewUri) this.put({ ...current, state: 'failed', error }, key);
      return null;
    }
  }

  retry(assessmentId: string, slot: UploadSlot, onDone: (photo: PhotoView) => void) {
    const item = this.get(assessmentId, slot);
    if (item && item.state === 'failed') void this.start(item, onDone);
  }

  discard(assessmentId: string, slot: UploadSlot) {
    this.put(null, `${assessmentId}|${slot}`);
  }
}
