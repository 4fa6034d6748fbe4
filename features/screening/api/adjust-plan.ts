import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/features/api/client';
import { useActiveClub } from '@/features/session/active-club';
import type { PlanAdjustmentInput, ResultView } from '@/features/screening/contract';
import { screeningKeys } from './keys';

export const adjustPlan = (assessmentId: string, input: PlanAdjustmentInput) =>
  api<ResultView>(`/assessments/${encodeURIComponent(assessmentId)}/plan`, { method: 'PUT', json: input });

export function useAdjustPlanMutation(assessmentId: string) {
  const qc = useQueryClient();
  const { membership } = useActiveClub();
  return useMutation({
    mutationFn: (input: PlanAdjustmentInput) => adjustPlan(assessmentId, input),
    // After a 409 `plan_conflict` too: the screen then shows the plan as it is now.
    onSettled: () => qc.invalidateQueries({ queryKey: screeningKeys.assessment(membership.clubId, assessmentId) }),
  });
}
