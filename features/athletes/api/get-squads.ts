import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/features/api/client';
import { useActiveClub } from '@/features/session/active-club';
import { athleteKeys, ROSTER_STALE_MS } from './keys';
import type { SquadSummary } from './types';

export const getSquads = () => api<{ squads: SquadSummary[] }>('/squads');

export const squadsQueryOptions = (clubId: string) => queryOptions({ queryKey: athleteKeys.squads(clubId), queryFn: getSquads, staleTime: ROSTER_STALE_MS });

export function useSquadsQuery() {
  const { membership } = useActiveClub();
  return useQuery(squadsQueryOptions(membership.clubId));
}
