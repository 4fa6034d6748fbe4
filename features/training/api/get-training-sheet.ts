import { useQuery } from '@tanstack/react-query';
import { api } from '@/features/api/client';
import { useActiveClub } from '@/features/session/active-club';
import type { TrainingSheet } from '../sheet';

export const trainingKeys = {
  sheet: (clubId: string, squadId: string) => ['training', clubId, 'sheet', squadId] as const,
};

export const getTrainingSheet = (squadId: string) => api<TrainingSheet>(`/squads/${encodeURIComponent(squadId)}/training-sheet`);

/**
 * The squad's sheet. Plans change whenever someone adjusts one, submits a screen or records a clearance,
 * so it is asked for again each time the page opens (the last copy shows meanwhile).
 */
export function useTrainingSheetQuery(squadId: string | null) {
  const { membership } = useActiveClub();
  return useQuery({
    queryKey: trainingKeys.sheet(membership.clubId, squadId ?? ''),
    queryFn: () => getTrainingSheet(squadId!),
    enabled: !!squadId,
    staleTime: 0,
  });
}
