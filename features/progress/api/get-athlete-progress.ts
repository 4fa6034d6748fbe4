import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/features/api/client';
import { useActiveClub } from '@/features/session/active-club';
import type { ProgressResponse } from '../progress-types';
import { PROGRESS_STALE_MS, progressKeys } from './keys';

export const getAthleteProgress = (athleteId: string) => api<ProgressResponse>(`/athletes/${encodeURIComponent(athleteId)}/progress`);

export const athleteProgressQueryOptions = (clubId: string, athleteId: string) =>
  queryOptions({
    queryKey: progressKeys.athlete(clubId, athleteId),
    queryFn: () => getAthleteProgress(athleteId),
    staleTime: PROGRESS_STALE_MS,
  });

export function useAthleteProgressQuery(athleteId: string, enabled = true) {
  const { membership } = useActiveClub();
  return useQuery({ ...athleteProgressQueryOptions(membership.clubId, athleteId), enabled });
}
