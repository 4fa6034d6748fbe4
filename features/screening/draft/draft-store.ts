// The autosave engine of one assessment's draft. Pure TypeScript (no React): the capture screens read it
// through useAssessmentDraft, tests drive it with fake timers.
//
// - Every edit is applied at once to the working draft and written to the phone (local copy).
// - ~700 ms after the last edit the whole draft is PUT with the version it was based on.
// - The local copy is dropped only when the server has confirmed everything typed.
// - A 409 (another phone saved first) merges: this phone's edits since its last confirmed save win
//   field by field, everything else takes the server's newer draft (see merge.ts); then it saves again.
// - Network and server errors retry with back-off; a refused draft (400/403/404) waits for the next edit.
import { ApiError } from '@/features/api/client';
import type { AssessmentDraft } from '@/features/screening/contract';
import type { LocalCopyStorage } from './local-copy';
import { deepEqual, mergeDrafts } from './merge';

export const SAVE_DEBOUNCE_MS = 700;
const RETRY_MS = [2_000, 4_000, 8_000, 15_000, 30_000] as const;

export type SaveStatus =
  | { kind: 'saved' }
  | { kind: 'pending' }
  | { kind: 'saving' }
  | { kind: 'retrying'; message: string; attempt: number }
  | { kind: 'refused'; message: string; fields?: Record<string, string> };

export type DraftSnapshot = {
  ready: boolean;
  draft: AssessmentDraft;
  status: SaveStatus;
  /** Set when a newer save from another phone was merged in; cleared by the next edit. */
  mergedFromServer: boolean;
};

export type ServerDraft = { draft: AssessmentDraft; draftVersion: number };

export type DraftStoreDeps = {
  save(version: number, draft: AssessmentDraft, options: { keepalive?: boolean }): Promise<{ draftVersion: number }>;
  /** The server's current draft after a 409, from the error's body or a fresh GET. */
  serverDraftAfterConflict(error: ApiError): Promise<ServerDraft>;
  storage: LocalCopyStorage;
  debounceMs?: number;
};

const EMPTY: AssessmentDraft = { body: {}, tasks: {} };

export class DraftStore {
  private base: AssessmentDraft = EMPTY;
  private baseVersion = 0;
  private snapshot: DraftSnapshot = { ready: false, draft: EMPTY, status: { kind: 'saved' }, mergedFromServer: false };
  private listeners = new Set<() => void>();
  private timer: ReturnType<typeof setTimeout> | null = null;
  private inFlight: Promise<void> | null = null;
  private attempt = 0;
  private conflicts = 0;
  private waiters: { resolve(): void; reject(e: Error): void }[] = [];

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

  /** Seeds the store from the server once; a copy left on this phone is merged in and saved. */
  init(server: ServerDraft): void {
    if (this.snapshot.ready) return;
    const local = this.deps.storage.read(this.id);
    this.base = server.draft;
    this.baseVersion = server.draftVersion;
    if (local && !deepEqual(local.draft, local.base)) {
      const draft = mergeDrafts(local.base, local.draft, server.draft);
      this.set({ ready: true, draft, status: { kind: 'pending' }, mergedFromServer: false });
      this.writeLocal();
      this.schedule(0);
    } else {
      this.deps.storage.remove(this.id);
      this.set({ ready: true, draft: server.draft, status: { kind: 'saved' }, mergedFromServer: false });
    }
  }

  update(change: (draft: AssessmentDraft) => AssessmentDraft): void {
    const draft = change(this.snapshot.draft);
    if (deepEqual(draft, this.snapshot.draft)) return;
    const waiting = this.inFlight !== null || this.snapshot.status.kind === 'retrying';
    this.set({ ...this.snapshot, draft, mergedFromServer: false, status: waiting ? this.snapshot.status : { kind: 'pending' } });
    this.writeLocal();
    if (this.snapshot.status.kind === 'refused') this.set({ ...this.snapshot, status: { kind: 'pending' } });
    this.attempt = 0;
    this.schedule(this.deps.debounceMs ?? SAVE_DEBOUNCE_MS);
  }

  /** Save now (the page is hidden, the network came back, the tester submits). */
  flushSoon(options: { keepalive?: boolean } = {}): void {
    if (!this.isDirty() || this.inFlight) return;
    this.clearTimer();
    void this.run(options);
  }

  /** Resolves once the server holds everything typed so far; rejects if the save is refused. */
  flush(): Promise<void> {
    if (!this.isDirty() && !this.inFlight) return Promise.resolve();
    const done = new Promise<void>((resolve, reject) => this.waiters.push({ resolve, reject }));
    if (!this.inFlight) {
      this.clearTimer();
      this.attempt = 0;
      void this.run({});
    }
    return done;
  }

  dispose(): void {
    this.clearTimer();
    this.listeners.clear();
  }

  private isDirty(): boolean {
    return !deepEqual(this.snapshot.draft, this.base);
  }

  private set(next: DraftSnapshot): void {
    this.snapshot = next;
    this.listeners.forEach((l) => l());
  }

  private writeLocal(): void {
    this.deps.storage.write(this.id, {
      base: this.base,
      baseVersion: this.baseVersion,
      draft: this.snapshot.draft,
      savedAt: new Date().toISOString(),
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
      void this.run({});
    }, ms);
  }

  private settleWaiters(error?: Error): void {
    const waiters = this.waiters;
    this.waiters = [];
    waiters.forEach((w) => (error ? w.reject(error) : w.resolve()));
  }

  private async run(options: { keepalive?: boolean }): Promise<void> {
    if (this.inFlight) return;
    if (!this.isDirty()) {
      this.deps.storage.remove(this.id);
      this.set({ ...this.snapshot, status: { kind: 'saved' } });
      this.settleWaiters();
      return;
    }
    const sent = this.snapshot.draft;
    this.set({ ...this.snapshot, status: { kind: 'saving' } });
    this.inFlight = this.saveOnce(sent, options);
    try {
      await this.inFlight;
    } finally {
      this.inFlight = null;
    }
  }

  private async saveOnce(sent: AssessmentDraft, options: { keepalive?: boolean }): Promise<void> {
    try {
      const res = await this.deps.save(this.baseVersion, sent, options);
      this.base = sent;
      this.baseVersion = res.draftVersion;
      this.attempt = 0;
      this.conflicts = 0;
      if (this.isDirty()) {
        // Typed while the save was on its way: keep the copy and save the rest.
        this.writeLocal();
        this.set({ ...this.snapshot, status: { kind: 'pending' } });
        this.schedule(0);
      } else {
        this.deps.storage.remove(this.id);
        this.set({ ...this.snapshot, status: { kind: 'saved' } });
        this.settleWaiters();
      }
    } catch (e) {
      const error = e instanceof ApiError ? e : new ApiError(0, 'offline', e instanceof Error ? e.message : String(e));
      if (error.status === 409) {
        await this.mergeConflict(error);
        return;
      }
      if (error.status === 0 || error.status === 408 || error.status === 429 || error.status >= 500) {
        const wait = RETRY_MS[Math.min(this.attempt, RETRY_MS.length - 1)]!;
        this.attempt += 1;
        this.set({ ...this.snapshot, status: { kind: 'retrying', message: error.message, attempt: this.attempt } });
        this.schedule(wait);
        return;
      }
      // Refused (signed out, no access, an invalid value): keep everything on the phone, wait for an edit.
      this.set({ ...this.snapshot, status: { kind: 'refused', message: error.message, fields: error.fields } });
      this.settleWaiters(error);
    }
  }

  private async mergeConflict(error: ApiError): Promise<void> {
    let server: ServerDraft;
    try {
      server = await this.deps.serverDraftAfterConflict(error);
    } catch (e) {
      const message = e instanceof Error ? e.message : 'Could not load the newer draft.';
      this.attempt += 1;
      this.set({ ...this.snapshot, status: { kind: 'retrying', message, attempt: this.attempt } });
      this.schedule(RETRY_MS[Math.min(this.attempt, RETRY_MS.length - 1)]!);
      return;
    }
    const draft = mergeDrafts(this.base, this.snapshot.draft, server.draft);
    this.base = server.draft;
    this.baseVersion = server.draftVersion;
    this.conflicts += 1;
    this.set({ ...this.snapshot, draft, mergedFromServer: true, status: { kind: 'pending' } });
    this.writeLocal();
    // Two phones saving in turn settle at once; a server that keeps refusing gets the back-off instead.
    this.schedule(this.conflicts <= 2 ? 0 : RETRY_MS[Math.min(this.conflicts - 3, RETRY_MS.length - 1)]!);
  }
}
