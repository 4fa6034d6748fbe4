import type { AssessmentDraft } from '@/features/screening/contract';

/** What this phone keeps of a draft until the server confirms it. */
export type LocalCopy = {
  /** The last draft the server confirmed, and its version: the base of a three-way merge. */
  base: AssessmentDraft;
  baseVersion: number;
  /** The tester's working draft, with edits the server has not confirmed yet. */
  draft: AssessmentDraft;
  savedAt: string;
  /**
   * The save on its way: exactly what was sent, on which version, under which idempotency key. A retry
   * sends the same again, so a save that reached the server before the connection dropped is not redone.
   */
  inflight?: { key: string; baseVersion: number; draft: AssessmentDraft };
};

export interface LocalCopyStorage {
  read(id: string): LocalCopy | null;
  write(id: string, copy: LocalCopy): void;
  remove(id: string): void;
}

/** Keeps only well-formed copies (a copy from an older version of the app is ignored). */
export function asLocalCopy(value: unknown): LocalCopy | null {
  const copy = value as LocalCopy | null;
  return copy && typeof copy.baseVersion === 'number' && copy.draft && copy.base ? copy : null;
}
