import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/features/api/client';
import { useActiveClub } from '@/features/session/active-club';
import type { AthleteAssessmentItem } from '@/features/screening/contract';
import { ATHLETE_ASSESSMENTS_STALE_MS, screeningKeys } from './keys';

export const getAthleteAssessments = (athleteId: string) =>
  api<{ assessments: AthleteAssessmentItem[] }>(`/athletes/${encodeURIComponent(athleteId)}/assessments`);

export const athleteAssessmentsQueryOptions = (clubId: string, athleteId: string) =>
  queryOptions({
    queryKey: screeningKeys.athleteAssessments(clubId, athleteId),
    queryFn: () => getAthleteAssessments(athleteId),
    staleTime: ATHLETE_ASSESSMENTS_STALE_MS,
  });

export function useAthleteAssessmentsQuery(athleteId: string) {
  const { membership } = useActiveClub();
  return useQuery(athleteAssessmentsQueryOptions(membership.clubId, athleteId));
}
