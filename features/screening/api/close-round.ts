import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/features/api/client';
import type { RoundDetail } from '@/features/screening/contract';
import { useActiveClub } from '@/features/session/active-club';
import { screeningKeys } from './keys';

/** Closes the round (the roles that screen) or reopens it (head coach only; the server checks). */
export const setRoundClosed = (id: string, closed: boolean) =>
  api<RoundDetail>(`/rounds/${encodeURIComponent(id)}/${closed ? 'close' : 'reopen'}`, { method: 'POST' });

export function useSetRoundClosedMutation(id: string) {
  const qc = useQueryClient();
  const { membership } = useActiveClub();
  return useMutation({
    mutationFn: (closed: boolean) => setRoundClosed(id, closed),
    // The round, the round lists and every assessment of the round (they become read-only) change.
    onSuccess: () => qc.invalidateQueries({ queryKey: screeningKeys.club(membership.clubId) }),
  });
}

/** Brings the athletes who joined the squad since the round began into it (an open round). */
export const addRoundNewcomers = (id: string) => api<RoundDetail>(`/rounds/${encodeURIComponent(id)}/newcomers`, { method: 'POST' });

export function useAddNewcomersMutation(id: string) {
  const qc = useQueryClient();
  const { membership } = useActiveClub();
  return useMutation({
    mutationFn: () => addRoundNewcomers(id),
    onSuccess: () => qc.invalidateQueries({ queryKey: screeningKeys.club(membership.clubId) }),
  });
}
