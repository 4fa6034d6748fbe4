import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/features/api/client';
import { useActiveClub } from '@/features/session/active-club';
import type { CreateRoundInput, RoundSummary } from '@/features/screening/contract';
import { screeningKeys } from './keys';

/** The server answers with the new round (alone or with its athletes); only the round is read here. */
export const createRound = (input: CreateRoundInput) => api<{ round: RoundSummary }>('/rounds', { method: 'POST', json: input });

export function useCreateRoundMutation() {
  const qc = useQueryClient();
  const { membership } = useActiveClub();
  return useMutation({
    mutationFn: createRound,
    onSuccess: () => qc.invalidateQueries({ queryKey: screeningKeys.rounds(membership.clubId) }),
  });
}
