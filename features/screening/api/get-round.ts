import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/features/api/client';
import { useActiveClub } from '@/features/session/active-club';
import type { RoundDetail } from '@/features/screening/contract';
import { ROUNDS_STALE_MS, screeningKeys } from './keys';

export const getRound = (id: string) => api<RoundDetail>(`/rounds/${encodeURIComponent(id)}`);

export const roundQueryOptions = (clubId: string, id: string) =>
  queryOptions({ queryKey: screeningKeys.round(clubId, id), queryFn: () => getRound(id), staleTime: ROUNDS_STALE_MS });

export function useRoundQuery(id: string) {
  const { membership } = useActiveClub();
  return useQuery(roundQueryOptions(membership.clubId, id));
}
