import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/features/api/client';
import { useActiveClub } from '@/features/session/active-club';
import type { ClearanceView } from '../types';
import { CARE_STALE_MS, careKeys } from './keys';

export const getClearances = () => api<{ clearances: Record<string, NonNullable<ClearanceView>> }>('/clearances');

export const clearancesQueryOptions = (clubId: string) =>
  queryOptions({ queryKey: careKeys.clearances(clubId), queryFn: getClearances, staleTime: CARE_STALE_MS });

/** The clearance in force for one athlete, from the club's map (one request for a whole list). */
export function useClearanceOf(athleteId: string, enabled = true): ClearanceView {
  const { membership } = useActiveClub();
  const query = useQuery({ ...clearancesQueryOptions(membership.clubId), enabled: enabled && membership.role !== 'parent' });
  return query.data?.clearances[athleteId] ?? null;
}
