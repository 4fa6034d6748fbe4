import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/features/api/client';
import { useActiveClub } from '@/features/session/active-club';
import type { AssessmentDetail } from '@/features/screening/contract';
import { ASSESSMENT_STALE_MS, screeningKeys } from './keys';

export const getAssessment = (id: string) => api<AssessmentDetail>(`/assessments/${encodeURIComponent(id)}`);

export const assessmentQueryOptions = (clubId: string, id: string) =>
  queryOptions({
    queryKey: screeningKeys.assessment(clubId, id),
    queryFn: () => getAssessment(id),
    staleTime: ASSESSMENT_STALE_MS,
  });

export function useAssessmentQuery(id: string) {
  const { membership } = useActiveClub();
  return useQuery(assessmentQueryOptions(membership.clubId, id));
}
