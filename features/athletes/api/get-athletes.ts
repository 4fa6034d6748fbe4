import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/features/api/client';
import { useActiveClub } from '@/features/session/active-club';
import { athleteKeys, ROSTER_STALE_MS } from './keys';
import type { Athlete } from './types';

export const getAthletes = () => api<{ athletes: Athlete[] }>('/athletes');

export const athletesQueryOptions = (clubId: string) =>
  queryOptions({ queryKey: athleteKeys.list(clubId), queryFn: getAthletes, staleTime: ROSTER_STALE_MS });

export function useAthletesQuery() {
  const { membership } = useActiveClub();
  return useQuery(athletesQueryOptions(membership.clubId));
}
