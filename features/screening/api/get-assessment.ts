import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiStartedEarly } from '@/features/api/client';
import { deviceBacked } from '@/features/offline/device-cache';
import { useActiveClub } from '@/features/session/active-club';
import type { AssessmentDetail } from '@/features/screening/contract';
import { can } from '@/features/access/permissions';
import { ASSESSMENT_STALE_MS, assessmentKeptKey, screeningKeys } from './keys';

/** The capture screen's page asks for its assessment from its HTML (app/+html.tsx): the first call takes that answer. */
export const getAssessment = (id: string) => apiStartedEarly<AssessmentDetail>(`/assessments/${encodeURIComponent(id)}`);

/** An open draft a tester works on is kept on the device under its round (see get-round.ts). */
export const assessmentQueryOptions = (clubId: string, id: string, keep = false) =>
  queryOptions({
    queryKey: screeningKeys.assessment(clubId, id),
    queryFn: () =>
      deviceBacked(
        assessmentKeptKey(id),
        clubId,
        () => getAssessment(id),
        (d) => (keep ? { roundId: d.roundId } : null),
      ),
    staleTime: ASSESSMENT_STALE_MS,
  });

export function useAssessmentQuery(id: string) {
  const { membership } = useActiveClub();
  return useQuery(assessmentQueryOptions(membership.clubId, id, can(membership.role, 'screening.write')));
}
