// Small JSON records (the local copies of drafts) read synchronously by the screens, mirrored in memory
// and written through to the device store in the order they were made.
export interface CopyPersistence {
  all(): Promise<{ id: string; copy: unknown }[]>;
  put(id: string, copy: unknown): Promise<void>;
  remove(id: string): Promise<void>;
}

export class JsonCopies<T> {
  private map = new Map<string, T>();
  private chain: Promise<void> = Promise.resolve();
  private hydrated: Promise<void> | null = null;

  constructor(private readonly persistence: CopyPersistence | null) {}

  /** Reads what the device kept (after a reload) once; copies written before it win. */
  hydrate(): Promise<void> {
    this.hydrated ??= (this.persistence?.all() ?? Promise.resolve([]))
      .then((records) => {
        for (const r of records) if (!this.map.has(r.id)) this.map.set(r.id, r.copy as T);
      })
      .catch(() => undefined);
    return this.hydrated;
  }

  read(id: string): T | null {
    return this.map.get(id) ?? null;
  }

  ids(): string[] {
    return [...this.map.keys()];
  }

  write(id: string, copy: T): void {
    const value = structuredClone(copy);
    this.map.set(id, value);
    this.enqueue(() => this.persistence?.put(id, value));
  }

  remove(id: string): void {
    this.map.delete(id);
    this.enqueue(() => this.persistence?.remove(id));
  }

  /** Forget everything in memory (sign-out; the device store is wiped separately). */
  clear(): void {
    this.map.clear();
  }

  /** Resolves once every write so far is on the device. */
  settled(): Promise<void> {
    return this.chain;
  }

  private enqueue(job: () => Promise<void> | undefined): void {
    this.chain = this.chain.then(job).catch(() => undefined);
  }
}
