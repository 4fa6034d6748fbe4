import { queryOptions, useMutation, useQuery } from '@tanstack/react-query';
import { api } from '@/features/api/client';
import { useActiveClub } from '@/features/session/active-club';
import type { NoteEditInput, NoteInput } from '../schemas';
import type { NoteVisibility } from '../choices';
import type { NoteView } from '../types';
import { useCareChanged } from './invalidate';
import { CARE_STALE_MS, careKeys } from './keys';

export const getNotes = (athleteId: string) => api<{ notes: NoteView[] }>(`/athletes/${encodeURIComponent(athleteId)}/notes`);
export const addNote = (athleteId: string, input: NoteInput) =>
  api<{ note: NoteView }>(`/athletes/${encodeURIComponent(athleteId)}/notes`, { method: 'POST', json: input });
export const editNote = (id: string, input: NoteEditInput) => api<{ note: NoteView }>(`/notes/${encodeURIComponent(id)}`, { method: 'PATCH', json: input });

export const notesQueryOptions = (clubId: string, athleteId: string) =>
  queryOptions({ queryKey: careKeys.notes(clubId, athleteId), queryFn: () => getNotes(athleteId), staleTime: CARE_STALE_MS });

export function useNotesQuery(athleteId: string) {
  const { membership } = useActiveClub();
  return useQuery(notesQueryOptions(membership.clubId, athleteId));
}

export function useAddNoteMutation(athleteId: string) {
  const changed = useCareChanged();
  return useMutation({ mutationFn: (input: NoteInput) => addNote(athleteId, input), onSuccess: changed });
}

export function useEditNoteMutation() {
  const changed = useCareChanged();
  return useMutation({
    mutationFn: ({ id, text, visibility }: { id: string; text: string; visibility?: NoteVisibility }) => editNote(id, { text, visibility }),
    onSuccess: changed,
  });
}
