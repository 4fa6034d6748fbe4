import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/features/api/client';
import { useActiveClub } from '@/features/session/active-club';
import { athleteKeys, ROSTER_STALE_MS } from './keys';
import type { ConsentRecord } from './types';

export const getConsents = (id: string) => api<{ consents: ConsentRecord[] }>(`/athletes/${encodeURIComponent(id)}/consents`);

export const consentsQueryOptions = (clubId: string, id: string) =>
  queryOptions({ queryKey: athleteKeys.consents(clubId, id), queryFn: () => getConsents(id), staleTime: ROSTER_STALE_MS });

export function useConsentsQuery(id: string) {
  const { membership } = useActiveClub();
  return useQuery(consentsQueryOptions(membership.clubId, id));
}
