import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/features/api/client';
import { useActiveClub } from '@/features/session/active-club';
import { athleteKeys, ROSTER_STALE_MS } from './keys';
import type { Athlete } from './types';

export const getAthletes = (includeArchived = false) => api<{ athletes: Athlete[] }>(includeArchived ? '/athletes?archived=include' : '/athletes');

export const athletesQueryOptions = (clubId: string, options: { includeArchived?: boolean } = {}) =>
  queryOptions({
    queryKey: athleteKeys.list(clubId, options),
    queryFn: () => getAthletes(options.includeArchived),
    staleTime: ROSTER_STALE_MS,
  });

export function useAthletesQuery(options: { includeArchived?: boolean } = {}) {
  const { membership } = useActiveClub();
  return useQuery(athletesQueryOptions(membership.clubId, options));
}
