import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/features/api/client';
import { useActiveClub } from '@/features/session/active-club';
import type { FamilyView } from '../types';
import { CARE_STALE_MS, careKeys } from './keys';

export const getFamilyView = (athleteId: string) => api<FamilyView>(`/athletes/${encodeURIComponent(athleteId)}/summary`);

export const familyViewQueryOptions = (clubId: string, athleteId: string) =>
  queryOptions({ queryKey: careKeys.family(clubId, athleteId), queryFn: () => getFamilyView(athleteId), staleTime: CARE_STALE_MS });

export function useFamilyViewQuery(athleteId: string) {
  const { membership } = useActiveClub();
  return useQuery(familyViewQueryOptions(membership.clubId, athleteId));
}
