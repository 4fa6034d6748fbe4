import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/features/api/client';
import { useActiveClub } from '@/features/session/active-club';
import type { ResultView, SubmitInput } from '@/features/screening/contract';
import { screeningKeys } from './keys';

/** Names the draft version the tester reviewed: a newer save from another phone answers 409 `draft_conflict`. */
export const submitAssessment = (id: string, draftVersion: number) =>
  api<ResultView>(`/assessments/${encodeURIComponent(id)}/submit`, { method: 'POST', json: { draftVersion } satisfies SubmitInput });

export function useSubmitAssessmentMutation(id: string) {
  const qc = useQueryClient();
  const { membership } = useActiveClub();
  return useMutation({
    mutationFn: (draftVersion: number) => submitAssessment(id, draftVersion),
    // The round's counts, the athlete's history and the assessment itself all change.
    onSuccess: () => qc.invalidateQueries({ queryKey: screeningKeys.club(membership.clubId) }),
  });
}
