import type { AssessmentDraft } from '@/features/screening/contract';

/** What this phone keeps of a draft until the server confirms it. */
export type LocalCopy = {
  /** The last draft the server confirmed, and its version: the base of a three-way merge. */
  base: AssessmentDraft;
  baseVersion: number;
  /** The tester's working draft, with edits the server has not confirmed yet. */
  draft: AssessmentDraft;
  savedAt: string;
};

export interface LocalCopyStorage {
  read(id: string): LocalCopy | null;
  write(id: string, copy: LocalCopy): void;
  remove(id: string): void;
}

const PREFIX = 'squadline.screening.draft.';

/**
 * localStorage on the web target. Where there is none (native without a storage module, private mode
 * with storage blocked) it does nothing: drafts are then only as safe as the server saves.
 */
export const browserLocalCopy: LocalCopyStorage = {
  read(id) {
    try {
      const raw = globalThis.localStorage?.getItem(PREFIX + id);
      if (!raw) return null;
      const copy = JSON.parse(raw) as LocalCopy;
      return typeof copy.baseVersion === 'number' && copy.draft && copy.base ? copy : null;
    } catch {
      return null;
    }
  },
  write(id, copy) {
    try {
      globalThis.localStorage?.setItem(PREFIX + id, JSON.stringify(copy));
    } catch {
      // storage full or blocked: the server save still runs
    }
  },
  remove(id) {
    try {
      globalThis.localStorage?.removeItem(PREFIX + id);
    } catch {
      // nothing to do
    }
  },
};
