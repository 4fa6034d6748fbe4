// Photos of the open assessments on their way to the server. Integration point with features/offline:
// a picked photo is kept on the device (within the storage budget) and queued in the outbox, so it
// survives a reload and waits for a connection; this class is the screens' view of those entries.
import { ApiError } from '@/features/api/client';
import type { Outbox, OutboxEntry, OutboxState } from '@/features/offline/outbox';
import type { TaskId, View } from '@/features/screening/engine';
import type { PhotoFile } from '@/features/screening/api/upload-photo';

export type UploadSlot = `${TaskId}:${View}`;
export const slotOf = (taskId: TaskId, view: View): UploadSlot => `${taskId}:${view}`;

export type UploadItem = {
  seq: number;
  assessmentId: string;
  taskId: TaskId;
  view: View;
  /** Empty until the kept photo is read back from the device (after a reload). */
  previewUri: string;
  width: number;
  height: number;
  /** uploading: being sent now; waiting: kept on the device until it can be sent; failed: refused. */
  state: 'uploading' | 'waiting' | 'failed';
  progress: number;
  error: ApiError | null;
};

export type UploadQueueDeps = {
  outbox: Outbox;
  keepPhoto(input: { assessmentId: string; userId: string; blob: Blob }): Promise<{ id: string; bytes: number }>;
  forgetPhoto(id: string): Promise<void>;
  photoUrl(id: string): Promise<string | null>;
  session(): { userId: string; clubId: string };
};

export class UploadQueue {
  private listeners = new Set<() => void>();
  private version = 0;
  private items = new Map<string, UploadItem>();
  private counts = new Map<string, number>();
  private progress = new Map<number, number>();
  private urls = new Map<string, string>();

  constructor(private readonly deps: UploadQueueDeps) {
    deps.outbox.subscribe(() => this.rebuild());
    this.rebuild();
  }

  subscribe = (l: () => void) => {
    this.listeners.add(l);
    return () => {
      this.listeners.delete(l);
    };
  };

  getVersion = () => this.version;

  /** How many photos of the assessment are not on the server yet (waiting, on their way or refused). */
  unfinished(assessmentId: string): number {
    return this.counts.get(assessmentId) ?? 0;
  }

  get(assessmentId: string, slot: UploadSlot): UploadItem | undefined {
    return this.items.get(`${assessmentId}|${slot}`);
  }

  /**
   * Keeps the scaled photo on the device and queues it. Throws (with a message for the tester) when the
   * device's photo budget is full. A newer photo for the same slot replaces one still waiting.
   */
  async start(item: {
    assessmentId: string;
    taskId: TaskId;
    view: View;
    previewUri: string;
    width: number;
    height: number;
    file: PhotoFile;
  }): Promise<OutboxEntry> {
    if (!('blob' in item.file)) throw new ApiError(400, 'unsupported', 'This device cannot keep photos for upload.');
    const { userId, clubId } = this.deps.session();
    const kept = await this.deps.keepPhoto({ assessmentId: item.assessmentId, userId, blob: item.file.blob });
    this.urls.set(kept.id, item.previewUri);
    const older = this.get(item.assessmentId, slotOf(item.taskId, item.view));
    const entry = await this.deps.outbox.add({
      kind: 'photo',
      assessmentId: item.assessmentId,
      userId,
      clubId,
      photo: { blobId: kept.id, taskId: item.taskId, view: item.view, width: item.width, height: item.height, bytes: kept.bytes },
    });
    if (older && older.state !== 'uploading') await this.discardEntry(older.seq);
    return entry;
  }

  /** Upload progress of the entry being sent (0..1). */
  setProgress(seq: number, fraction: number): void {
    this.progress.set(seq, fraction);
    this.rebuild();
  }

  retry(assessmentId: string, slot: UploadSlot): void {
    const item = this.get(assessmentId, slot);
    if (!item) return;
    if (item.state === 'failed') void this.deps.outbox.sendAgain(item.seq);
    else this.deps.outbox.kick();
  }

  discard(assessmentId: string, slot: UploadSlot): void {
    const item = this.get(assessmentId, slot);
    if (item) void this.discardEntry(item.seq);
  }

  private async discardEntry(seq: number): Promise<void> {
    const entry = this.deps.outbox.getState().entries.find((e) => e.seq === seq);
    if (await this.deps.outbox.discard(seq)) {
      if (entry?.kind === 'photo' && entry.photo) await this.deps.forgetPhoto(entry.photo.blobId);
    }
  }

  private rebuild(): void {
    const state: OutboxState = this.deps.outbox.getState();
    const items = new Map<string, UploadItem>();
    const counts = new Map<string, number>();
    for (const e of state.entries) {
      if (e.kind !== 'photo' || !e.photo) continue;
      counts.set(e.assessmentId, (counts.get(e.assessmentId) ?? 0) + 1);
      const taskId = e.photo.taskId as TaskId;
      const key = `${e.assessmentId}|${slotOf(taskId, e.photo.view)}`;
      const url = this.urls.get(e.photo.blobId);
      if (url === undefined) this.loadUrl(e.photo.blobId);
      const next: UploadItem = {
        seq: e.seq,
        assessmentId: e.assessmentId,
        taskId,
        view: e.photo.view,
        previewUri: url ?? '',
        width: e.photo.width,
        height: e.photo.height,
        state: e.state === 'refused' ? 'failed' : state.sending === e.seq ? 'uploading' : 'waiting',
        progress: state.sending === e.seq ? (this.progress.get(e.seq) ?? 0) : 0,
        error: e.error ? new ApiError(e.error.status, e.error.code, e.error.message) : null,
      };
      const known = this.items.get(key);
      // Same values: keep the same object, so screens reading it do not re-render for nothing.
      items.set(key, known && sameItem(known, next) ? known : next);
    }
    this.items = items;
    this.counts = counts;
    this.version += 1;
    this.listeners.forEach((l) => l());
  }

  private loadUrl(blobId: string): void {
    this.urls.set(blobId, '');
    void this.deps.photoUrl(blobId).then((url) => {
      if (url) {
        this.urls.set(blobId, url);
        this.rebuild();
      }
    });
  }
}

function sameItem(a: UploadItem, b: UploadItem): boolean {
  return a.seq === b.seq && a.previewUri === b.previewUri && a.state === b.state && a.progress === b.progress && a.error?.message === b.error?.message;
}
