import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/features/api/client';
import { useActiveClub } from '@/features/session/active-club';
import { athleteKeys, ROSTER_STALE_MS } from './keys';
import type { Athlete } from './types';

export const getAthlete = (id: string) => api<{ athlete: Athlete }>(`/athletes/${encodeURIComponent(id)}`);

export const athleteQueryOptions = (clubId: string, id: string) =>
  queryOptions({ queryKey: athleteKeys.detail(clubId, id), queryFn: () => getAthlete(id), staleTime: ROSTER_STALE_MS });

export function useAthleteQuery(id: string) {
  const { membership } = useActiveClub();
  return useQuery(athleteQueryOptions(membership.clubId, id));
}
