// The device's queue of changes waiting for the server: draft saves, photos, submits and records of who
// took part in a training session, kept on the device (IndexedDB through OutboxStorage) and sent one at a
// time, oldest first, when there is a connection. Pure TypeScript: no React, no browser API; the sender,
// the clock and the storage are injected so tests drive it with fake timers and a memory store.
//
// - Order: entries go out in the order they were added. A refused draft holds back the later entries of
//   the same assessment (a submit must never go out on an older draft); other assessments carry on.
// - Retry: a lost connection, a timeout or a server error keeps the entry at the head and retries with
//   back-off; coming back online retries at once. The entry keeps its idempotency key, so a request that
//   reached the server before the connection dropped is answered from the server's record, not redone.
// - Refused (400/403/404/413/...): kept on the device with the server's message (the words of the fields
//   it names) until the tester discards it or sends it again; never silently dropped.

export type OutboxKind = 'draft' | 'photo' | 'submit' | 'attendance';

export type PhotoRef = {
  /** Key of the scaled photo in the device's photo store. */
  blobId: string;
  taskId: string;
  view: 'front' | 'side';
  width: number;
  height: number;
  bytes: number;
};

export type OutboxError = { status: number; code: string; message: string };

type EntryBase = {
  /** Position in the queue, given by the storage (auto-increment). */
  seq: number;
  /** Sent as the Idempotency-Key header; a retry of the same change sends the same key. */
  key: string;
  /** The club the change was made in (sent as X-Club-Id). */
  clubId: string;
  /** Who made it: the queue of one person is never sent under another's session. */
  userId: string;
  createdAt: string;
  attempts: number;
  state: 'waiting' | 'refused';
  error?: OutboxError;
};

/** A screening change: the entry names the assessment; a draft's content is the device's copy when it goes out. */
export type ScreeningEntry = EntryBase & { kind: 'draft' | 'photo' | 'submit'; assessmentId: string; photo?: PhotoRef };

/** Who took part in a squad's session on one day: small, so the entry carries it whole. */
export type AttendanceRecord = { heldOn: string; athleteIds: string[]; note: string };
export type AttendanceEntry = EntryBase & { kind: 'attendance'; squadId: string; record: AttendanceRecord };

export type OutboxEntry = ScreeningEntry | AttendanceEntry;

type DistributiveOmit<T, K extends PropertyKey> = T extends unknown ? Omit<T, K> : never;
/** What a screen adds: the queue gives the key, the time, the position and the state. */
export type NewEntry = DistributiveOmit<OutboxEntry, 'seq' | 'key' | 'createdAt' | 'attempts' | 'state' | 'error'>;

/** The assessment a screening entry belongs to; null for other kinds (nothing holds them back). */
export const assessmentOf = (e: OutboxEntry): string | null => (e.kind === 'attendance' ? null : e.assessmentId);

const sameDay = (e: OutboxEntry, squadId: string, heldOn: string) => e.kind === 'attendance' && e.squadId === squadId && e.record.heldOn === heldOn;

export interface OutboxStorage {
  all(): Promise<OutboxEntry[]>;
  /** Stores a new entry and returns it with its sequence number. */
  add(entry: DistributiveOmit<OutboxEntry, 'seq'>): Promise<OutboxEntry>;
  put(entry: OutboxEntry): Promise<void>;
  remove(seq: number): Promise<void>;
}

/** What the sender throws: an HTTP status (0 when there was no answer), a code, a message and the fields refused. */
export type SendError = Error & { status: number; code?: string; fields?: Record<string, string> };

export type OutboxDeps = {
  storage: OutboxStorage;
  /** Sends one entry; resolves when the server holds it. */
  send(entry: OutboxEntry): Promise<void>;
  isOnline(): boolean;
  newKey(): string;
  now?: () => Date;
  retryDelaysMs?: readonly number[];
  setTimer?: (fn: () => void, ms: number) => unknown;
  clearTimer?: (handle: unknown) => void;
  /**
   * Runs the sending one device-wide at a time (the browser's Web Locks across tabs). With it, each
   * turn first reads the queue back from storage, so an entry another tab sent is not sent again (a
   * photo sent by one tab read as "no longer on this phone" in the other).
   */
  exclusive?: (fn: () => Promise<void>) => Promise<void>;
};

export const RETRY_DELAYS_MS = [2_000, 4_000, 8_000, 15_000, 30_000, 60_000] as const;

/** A change "waited on the phone" when it took more than one try or this long to be sent (our choice). */
export const WAITED_MS = 10_000;

/**
 * Whether a change just sent had waited on the phone rather than going straight out: made before the
 * connection last came back (`backOnlineAt`, ms; null when it never went), more than one try, or more
 * than `WAITED_MS` on the phone. The screens then say it reached the server. Pure.
 */
export function waitedOnPhone(entry: Pick<OutboxEntry, 'attempts' | 'createdAt'>, sentAt: number, backOnlineAt: number | null = null): boolean {
  const created = Date.parse(entry.createdAt);
  return entry.attempts > 1 || (backOnlineAt !== null && created < backOnlineAt) || sentAt - created > WAITED_MS;
}

/**
 * A lost connection, a timeout, rate limiting or a server error: worth sending again later. So is 401:
 * the session ran out, and the change waits until the same person signs in again.
 */
export function isRetryable(status: number): boolean {
  return status === 0 || status === 401 || status === 408 || status === 429 || status >= 500;
}

export type OutboxState = {
  /** Entries still on the device (waiting or refused). */
  entries: readonly OutboxEntry[];
  /** The entry being sent right now. */
  sending: number | null;
  /** Set after a failed attempt until the next one starts. */
  lastError: OutboxError | null;
};

export type OutboxEvent = { type: 'sent' | 'refused' | 'discarded'; entry: OutboxEntry };

export class Outbox {
  private entries: OutboxEntry[] = [];
  private sending: number | null = null;
  private lastError: OutboxError | null = null;
  private running = false;
  private again = false;
  private timer: unknown = null;
  private attemptsInRow = 0;
  private loaded: Promise<void> | null = null;
  private listeners = new Set<() => void>();
  private eventListeners = new Set<(e: OutboxEvent) => void>();
  private waiters = new Map<number, { resolve(): void; reject(e: OutboxError): void }[]>();
  private state: OutboxState = { entries: [], sending: null, lastError: null };
  private user: string | null = null;

  constructor(private readonly deps: OutboxDeps) {}

  /** Reads the queue left on the device (after a reload) once. */
  load(): Promise<void> {
    this.loaded ??= this.deps.storage.all().then((all) => {
      this.entries = all.sort((a, b) => a.seq - b.seq);
      this.publish();
    });
    return this.loaded;
  }

  /** Only the signed-in person's changes are sent (a session never carries another's work). */
  setUser(userId: string | null): void {
    this.user = userId;
    if (userId) this.kick();
  }

  subscribe = (listener: () => void) => {
    this.listeners.add(listener);
    return () => {
      this.listeners.delete(listener);
    };
  };

  onEvent(listener: (e: OutboxEvent) => void): () => void {
    this.eventListeners.add(listener);
    return () => this.eventListeners.delete(listener);
  }

  getState = (): OutboxState => this.state;

  async add(entry: NewEntry): Promise<OutboxEntry> {
    await this.load();
    const stored = await this.deps.storage.add({
      ...entry,
      key: this.deps.newKey(),
      createdAt: (this.deps.now?.() ?? new Date()).toISOString(),
      attempts: 0,
      state: 'waiting',
    });
    this.entries.push(stored);
    this.publish();
    this.kick();
    return stored;
  }

  /**
   * Adds a "save this draft" entry unless one is already waiting behind everything else of the
   * assessment (the draft is read from the device when it is sent, so one entry carries every edit).
   */
  async addDraft(entry: { assessmentId: string; clubId: string; userId: string }): Promise<OutboxEntry> {
    await this.load();
    const own = this.entries.filter((e) => assessmentOf(e) === entry.assessmentId && e.state === 'waiting');
    const last = own[own.length - 1];
    if (last && last.kind === 'draft' && last.seq !== this.sending) return last;
    return this.add({ ...entry, kind: 'draft' });
  }

  /**
   * Adds a record of who took part, in place of one still waiting for the same squad and day: the later
   * record is what the coach meant, and the server keeps one per squad and day anyway.
   */
  async addAttendance(entry: Omit<Extract<NewEntry, { kind: 'attendance' }>, 'kind'>): Promise<OutboxEntry> {
    await this.supersedeAttendance(entry.squadId, entry.record.heldOn);
    return this.add({ ...entry, kind: 'attendance' });
  }

  /**
   * Removes the records of a squad's day still waiting on the device (not the one being sent): a newer
   * record replaces them, or reached the server directly.
   */
  async supersedeAttendance(squadId: string, heldOn: string): Promise<void> {
    await this.load();
    const old = this.entries.filter((e) => sameDay(e, squadId, heldOn) && e.seq !== this.sending);
    for (const e of old) await this.discard(e.seq);
  }

  /** Resolves when the entry is on the server; rejects if it is refused or discarded. */
  whenDone(seq: number): Promise<void> {
    if (!this.entries.some((e) => e.seq === seq)) return Promise.resolve();
    return new Promise((resolve, reject) => {
      const list = this.waiters.get(seq) ?? [];
      list.push({ resolve, reject });
      this.waiters.set(seq, list);
    });
  }

  /** Removes a waiting or refused entry (the tester discards a photo); never the one being sent. */
  async discard(seq: number): Promise<boolean> {
    const entry = this.entries.find((e) => e.seq === seq);
    if (!entry || this.sending === seq) return false;
    await this.deps.storage.remove(seq);
    this.entries = this.entries.filter((e) => e.seq !== seq);
    this.settle(seq, { status: 0, code: 'discarded', message: 'Discarded on this device.' });
    this.emit({ type: 'discarded', entry });
    this.publish();
    this.kick();
    return true;
  }

  /** Puts a refused entry back in the queue (after the tester fixed what the server refused). */
  async sendAgain(seq: number): Promise<void> {
    const entry = this.entries.find((e) => e.seq === seq);
    if (!entry || entry.state !== 'refused') return;
    const next: OutboxEntry = { ...entry, state: 'waiting', error: undefined, key: this.deps.newKey() };
    await this.replace(next);
    this.kick();
  }

  /** Try now (the connection came back, or the tester asked). */
  kick(): void {
    if (this.timer !== null) {
      (this.deps.clearTimer ?? clearTimeout)(this.timer as ReturnType<typeof setTimeout>);
      this.timer = null;
    }
    this.attemptsInRow = 0;
    void this.run();
  }

  /** Forget everything (sign-out): the storage is wiped by the caller. */
  reset(): void {
    if (this.timer !== null) (this.deps.clearTimer ?? clearTimeout)(this.timer as ReturnType<typeof setTimeout>);
    this.timer = null;
    for (const e of this.entries) this.settle(e.seq, { status: 0, code: 'discarded', message: 'Removed at sign-out.' });
    this.entries = [];
    this.lastError = null;
    this.loaded = Promise.resolve();
    this.publish();
  }

  /** The next entry that may go out: the oldest waiting one not held behind a refused draft. */
  next(): OutboxEntry | undefined {
    const blocked = new Set<string>();
    for (const e of this.entries) {
      const assessment = assessmentOf(e);
      if (e.state === 'refused') {
        if (e.kind === 'draft') blocked.add(e.assessmentId);
        continue;
      }
      if (assessment !== null && blocked.has(assessment)) continue;
      if (this.user !== null && e.userId !== this.user) continue;
      return e;
    }
    return undefined;
  }

  private async run(): Promise<void> {
    // Asked again while running (an entry added as the last turn ended): one more turn after this one.
    if (this.running) {
      this.again = true;
      return;
    }
    this.running = true;
    try {
      await this.load();
      do {
        this.again = false;
        await (this.deps.exclusive ? this.deps.exclusive(() => this.drain()) : this.drain());
      } while (this.again && this.timer === null);
    } finally {
      this.running = false;
    }
  }

  /** Reads the queue back from storage: another tab may have sent (removed) or added entries. */
  private async refresh(): Promise<void> {
    const stored = (await this.deps.storage.all()).sort((a, b) => a.seq - b.seq);
    const kept = new Set(stored.map((e) => e.seq));
    // Gone from storage while waiting here: sent by another tab.
    for (const e of this.entries) if (!kept.has(e.seq)) this.settle(e.seq);
    this.entries = stored;
    this.publish();
  }

  private async drain(): Promise<void> {
    while (this.user !== null && this.deps.isOnline()) {
      if (this.deps.exclusive) await this.refresh();
      const entry = this.next();
      if (!entry) break;
      this.sending = entry.seq;
      this.lastError = null;
      this.publish();
      const current: OutboxEntry = { ...entry, attempts: entry.attempts + 1 };
      await this.replace(current);
      try {
        await this.deps.send(current);
        this.attemptsInRow = 0;
        await this.deps.storage.remove(current.seq);
        this.entries = this.entries.filter((e) => e.seq !== current.seq);
        this.sending = null;
        this.settle(current.seq);
        this.emit({ type: 'sent', entry: current });
        this.publish();
      } catch (e) {
        this.sending = null;
        const error = toOutboxError(e);
        // A 409 `request_in_progress`: the server is still running the first try of the same key.
        if (isRetryable(error.status) || error.code === 'request_in_progress') {
          this.lastError = error;
          this.publish();
          this.scheduleRetry();
          return;
        }
        const refused: OutboxEntry = { ...current, state: 'refused', error };
        await this.replace(refused);
        this.settle(current.seq, error);
        this.emit({ type: 'refused', entry: refused });
        this.publish();
      }
    }
  }

  private scheduleRetry(): void {
    const delays = this.deps.retryDelaysMs ?? RETRY_DELAYS_MS;
    const wait = delays[Math.min(this.attemptsInRow, delays.length - 1)]!;
    this.attemptsInRow += 1;
    this.timer = (this.deps.setTimer ?? setTimeout)(() => {
      this.timer = null;
      void this.run();
    }, wait);
  }

  private async replace(entry: OutboxEntry): Promise<void> {
    await this.deps.storage.put(entry);
    this.entries = this.entries.map((e) => (e.seq === entry.seq ? entry : e));
  }

  private settle(seq: number, error?: OutboxError): void {
    const list = this.waiters.get(seq);
    if (!list) return;
    this.waiters.delete(seq);
    list.forEach((w) => (error ? w.reject(error) : w.resolve()));
  }

  private emit(event: OutboxEvent): void {
    this.eventListeners.forEach((l) => l(event));
  }

  private publish(): void {
    this.state = { entries: [...this.entries], sending: this.sending, lastError: this.lastError };
    this.listeners.forEach((l) => l());
  }
}

function toOutboxError(e: unknown): OutboxError {
  if (typeof e === 'object' && e !== null && typeof (e as SendError).status === 'number') {
    const err = e as SendError;
    // A refusal naming fields keeps their words (what to fix), not the general "Some fields need attention."
    const fields = err.fields ? Object.values(err.fields) : [];
    return { status: err.status, code: err.code ?? 'http_error', message: fields.length ? fields.join(' ') : err.message };
  }
  return { status: 0, code: 'offline', message: e instanceof Error ? e.message : String(e) };
}
