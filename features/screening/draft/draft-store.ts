// The working draft of one assessment as the capture screens see it. Pure TypeScript (no React): the
// screens read it through useAssessmentDraft, tests drive it with fake timers.
//
// - Every edit is applied at once to the working draft and written to the device's copy.
// - ~700 ms after the last edit the store asks for the copy to be sent (an outbox entry: see
//   draft-sync.ts, which does the sending, the retries and the merge on a 409).
// - The device's copy is dropped only when the server has confirmed everything typed.
// - How far the saving is (saved, waiting, on its way, refused) comes from the outbox: see
//   useAssessmentDraft.
import type { AssessmentDraft } from '@/features/screening/contract';
import type { LocalCopy, LocalCopyStorage } from './local-copy';
import { deepEqual, mergeDrafts } from './merge';

export const SAVE_DEBOUNCE_MS = 700;

export type SaveStatus =
  | { kind: 'saved' }
  | { kind: 'pending' }
  | { kind: 'saving' }
  /** No connection: everything typed is kept on this phone and queued. */
  | { kind: 'kept' }
  | { kind: 'retrying'; message: string; attempt: number }
  | { kind: 'refused'; message: string; fields?: Record<string, string> };

export type DraftSnapshot = {
  ready: boolean;
  draft: AssessmentDraft;
  /** The device holds edits the server has not confirmed. */
  dirty: boolean;
  /** Set when a newer save from another phone was merged in; cleared by the next edit. */
  mergedFromServer: boolean;
};

export type ServerDraft = { draft: AssessmentDraft; draftVersion: number };

export type DraftStoreDeps = {
  storage: LocalCopyStorage;
  /** Queue the device's copy for sending (an outbox entry). */
  requestSave(): void;
  debounceMs?: number;
  now?: () => Date;
};

const EMPTY: AssessmentDraft = { body: {}, tasks: {} };

export class DraftStore {
  private base: AssessmentDraft = EMPTY;
  private baseVersion = 0;
  private snapshot: DraftSnapshot = { ready: false, draft: EMPTY, dirty: false, mergedFromServer: false };
  private listeners = new Set<() => void>();
  private timer: ReturnType<typeof setTimeout> | null = null;

  constructor(
    readonly id: string,
    private readonly deps: DraftStoreDeps,
  ) {}

  subscribe = (listener: () => void) => {
    this.listeners.add(listener);
    return () => {
      this.listeners.delete(listener);
    };
  };

  getSnapshot = () => this.snapshot;

  get isReady() {
    return this.snapshot.ready;
  }

  /** The server's version of the draft this phone last saved or merged (what a submit names). */
  get version() {
    return this.baseVersion;
  }

  /**
   * Seeds the store once from the server's draft (or the device's kept answer, offline). A copy on this
   * device that is at least as new wins as it is; an older one is merged into the newer server draft.
   */
  init(server: ServerDraft): void {
    if (this.snapshot.ready) return;
    const local = this.deps.storage.read(this.id);
    if (local && local.baseVersion >= server.draftVersion) {
      this.base = local.base;
      this.baseVersion = local.baseVersion;
      const dirty = !deepEqual(local.draft, local.base) || !!local.inflight;
      this.set({ ready: true, draft: local.draft, dirty, mergedFromServer: false });
      if (dirty) this.schedule(0);
      return;
    }
    this.base = server.draft;
    this.baseVersion = server.draftVersion;
    if (local && !deepEqual(local.draft, local.base)) {
      const draft = mergeDrafts(local.base, local.draft, server.draft);
      this.set({ ready: true, draft, dirty: true, mergedFromServer: false });
      this.writeLocal();
      this.schedule(0);
    } else {
      if (local) this.deps.storage.remove(this.id);
      this.set({ ready: true, draft: server.draft, dirty: false, mergedFromServer: false });
    }
  }

  update(change: (draft: AssessmentDraft) => AssessmentDraft): void {
    const draft = change(this.snapshot.draft);
    if (deepEqual(draft, this.snapshot.draft)) return;
    this.set({ ...this.snapshot, draft, dirty: true, mergedFromServer: false });
    this.writeLocal();
    this.schedule(this.deps.debounceMs ?? SAVE_DEBOUNCE_MS);
  }

  /** Queue the save now (the page is hidden, the tester submits). */
  flushSoon(): void {
    if (!this.snapshot.dirty) return;
    this.clearTimer();
    this.deps.requestSave();
  }

  /** The sender confirmed a save or merged a newer one (the device's copy is `state`). */
  synced(state: Pick<LocalCopy, 'base' | 'baseVersion' | 'draft'>, merged: boolean): void {
    this.base = state.base;
    this.baseVersion = state.baseVersion;
    // The copy holds every edit made so far: it is the working draft.
    const draft = deepEqual(state.draft, this.snapshot.draft) ? this.snapshot.draft : state.draft;
    this.set({
      ready: true,
      draft,
      dirty: !deepEqual(draft, this.base),
      mergedFromServer: merged || this.snapshot.mergedFromServer,
    });
  }

  dispose(): void {
    this.clearTimer();
    this.listeners.clear();
  }

  private set(next: DraftSnapshot): void {
    this.snapshot = next;
    this.listeners.forEach((l) => l());
  }

  private writeLocal(): void {
    const current = this.deps.storage.read(this.id);
    this.deps.storage.write(this.id, {
      // Keep the save on its way (with its key) if there is one.
      ...(current?.inflight ? { inflight: current.inflight } : {}),
      base: this.base,
      baseVersion: this.baseVersion,
      draft: this.snapshot.draft,
      savedAt: (this.deps.now?.() ?? new Date()).toISOString(),
    });
  }

  private clearTimer(): void {
    if (this.timer) clearTimeout(this.timer);
    this.timer = null;
  }

  private schedule(ms: number): void {
    this.clearTimer();
    this.timer = setTimeout(() => {
      this.timer = null;
      this.deps.requestSave();
    }, ms);
  }
}
