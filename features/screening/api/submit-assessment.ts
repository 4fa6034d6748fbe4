import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/features/api/client';
import { useActiveClub } from '@/features/session/active-club';
import type { ResultView } from '@/features/screening/contract';
import { screeningKeys } from './keys';

export const submitAssessment = (id: string) =>
  api<ResultView>(`/assessments/${encodeURIComponent(id)}/submit`, { method: 'POST' });

export function useSubmitAssessmentMutation(id: string) {
  const qc = useQueryClient();
  const { membership } = useActiveClub();
  return useMutation({
    mutationFn: () => submitAssessment(id),
    // The round's counts, the athlete's history and the assessment itself all change.
    onSuccess: () => qc.invalidateQueries({ queryKey: screeningKeys.club(membership.clubId) }),
  });
}
