import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/features/api/client';
import { useActiveClub } from '@/features/session/active-club';
import type { PlanAdjustmentInput } from '@/features/screening/contract';
import { screeningKeys } from './keys';

export const adjustPlan = (assessmentId: string, input: PlanAdjustmentInput) =>
  api<unknown>(`/assessments/${encodeURIComponent(assessmentId)}/plan`, { method: 'PUT', json: input });

export function useAdjustPlanMutation(assessmentId: string) {
  const qc = useQueryClient();
  const { membership } = useActiveClub();
  return useMutation({
    mutationFn: (input: PlanAdjustmentInput) => adjustPlan(assessmentId, input),
    onSuccess: () => qc.invalidateQueries({ queryKey: screeningKeys.assessment(membership.clubId, assessmentId) }),
  });
}
