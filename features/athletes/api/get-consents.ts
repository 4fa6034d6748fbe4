import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/features/api/client';
import { useActiveClub } from '@/features/session/active-club';
import { athleteKeys, ROSTER_STALE_MS } from './keys';
import type { ConsentRecord } from './types';

/** How long the club keeps photos: after photo consent is withdrawn, and after the screen. */
export type PhotoTerms = { graceDays: number; retentionMonths: number };

export const getConsents = (id: string) => api<{ consents: ConsentRecord[]; photoTerms?: PhotoTerms }>(`/athletes/${encodeURIComponent(id)}/consents`);

export const consentsQueryOptions = (clubId: string, id: string) =>
  queryOptions({ queryKey: athleteKeys.consents(clubId, id), queryFn: () => getConsents(id), staleTime: ROSTER_STALE_MS });

export function useConsentsQuery(id: string) {
  const { membership } = useActiveClub();
  return useQuery(consentsQueryOptions(membership.clubId, id));
}
