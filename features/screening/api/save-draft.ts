import { api, sentFromDevice, type ApiError } from '@/features/api/client';
import { conflictCurrent } from '@/features/api/contract';
import type { AssessmentDraft, DraftConflictCurrent, SaveDraftResponse } from '@/features/screening/contract';

export type ServerDraft = { draft: AssessmentDraft; draftVersion: number };

/** PUT the whole draft, naming the version it was based on. Resolves with the new version. */
export async function saveDraft(
  id: string,
  draftVersion: number,
  draft: AssessmentDraft,
  options: { keepalive?: boolean; idempotencyKey?: string; clubId?: string } = {},
): Promise<{ draftVersion: number }> {
  const json = { draftVersion, draft };
  // keepalive lets a save finish while the page is hidden, but browsers cap its body at 64 KB.
  const keepalive = options.keepalive === true && JSON.stringify(json).length < 60_000;
  const res = await api<(Partial<SaveDraftResponse> & { assessment?: { draftVersion?: number } }) | undefined>(`/assessments/${encodeURIComponent(id)}`, {
    method: 'PUT',
    json,
    keepalive,
    headers: sentFromDevice(options),
  });
  const next = res?.draftVersion ?? res?.assessment?.draftVersion;
  // A server that answers without the version still accepted the save: the next version is ours + 1.
  return { draftVersion: typeof next === 'number' ? next : draftVersion + 1 };
}

/** The server's current draft from a 409 `draft_conflict` body (`ConflictBody<DraftConflictCurrent>`). */
export function serverDraftFromConflict(error: ApiError): ServerDraft | null {
  const current = conflictCurrent<DraftConflictCurrent>(error.body);
  return current ? { draft: current.draft, draftVersion: current.draftVersion } : null;
}
