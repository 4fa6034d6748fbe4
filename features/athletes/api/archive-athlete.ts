import { useMutation } from '@tanstack/react-query';
import { api } from '@/features/api/client';
import { useRosterChanged } from './invalidate';
import type { Athlete } from './types';

export const setAthleteArchived = (id: string, archived: boolean) =>
  api<{ athlete: Athlete }>(`/athletes/${encodeURIComponent(id)}/${archived ? 'archive' : 'restore'}`, { method: 'POST' });

export function useArchiveAthleteMutation(id: string) {
  const changed = useRosterChanged();
  return useMutation({ mutationFn: (archived: boolean) => setAthleteArchived(id, archived), onSuccess: ({ athlete }) => changed(athlete) });
}
