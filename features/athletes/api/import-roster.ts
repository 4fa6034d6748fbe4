import { useMutation } from '@tanstack/react-query';
import { api } from '@/features/api/client';
import { useRosterChanged } from './invalidate';
import type { ImportReport } from './types';

export type RosterFile = { name: string; size: number; blob: Blob };

/** `commit: false` checks every line and writes nothing; `commit: true` imports all lines or none. */
export function importRoster(file: RosterFile, commit: boolean) {
  const form = new FormData();
  form.append('file', file.blob, file.name);
  return api<ImportReport>(`/athletes/import?commit=${commit}`, { method: 'POST', body: form });
}

export const useCheckRosterMutation = () => useMutation({ mutationFn: (file: RosterFile) => importRoster(file, false) });

export function useImportRosterMutation() {
  const changed = useRosterChanged();
  return useMutation({ mutationFn: (file: RosterFile) => importRoster(file, true), onSuccess: () => changed() });
}
