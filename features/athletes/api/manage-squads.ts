import { useMutation } from '@tanstack/react-query';
import { api } from '@/features/api/client';
import type { SquadInput } from '../schemas';
import { useRosterChanged } from './invalidate';
import type { Squad } from './types';

export const createSquad = (input: SquadInput) => api<{ squad: Squad }>('/squads', { method: 'POST', json: input });
export const renameSquad = (id: string, input: SquadInput) => api<{ squad: Squad }>(`/squads/${encodeURIComponent(id)}`, { method: 'PATCH', json: input });
/** Refused (409) while the squad still has athletes. */
export const archiveSquad = (id: string) => api<{ squad: Squad }>(`/squads/${encodeURIComponent(id)}/archive`, { method: 'POST' });

export function useCreateSquadMutation() {
  const changed = useRosterChanged();
  return useMutation({ mutationFn: createSquad, onSuccess: () => changed() });
}

export function useRenameSquadMutation(id: string) {
  const changed = useRosterChanged();
  return useMutation({ mutationFn: (input: SquadInput) => renameSquad(id, input), onSuccess: () => changed() });
}

export function useArchiveSquadMutation(id: string) {
  const changed = useRosterChanged();
  return useMutation({ mutationFn: () => archiveSquad(id), onSuccess: () => changed() });
}
