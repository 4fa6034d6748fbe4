import { useQuery } from '@tanstack/react-query';
import { can } from '@/features/access/permissions';
import { api } from '@/features/api/client';
import { deviceBacked } from '@/features/offline/device-cache';
import { useActiveClub } from '@/features/session/active-club';
import type { TrainingSheet } from '../sheet';
import { trainingKeptKeys, trainingKeys } from './keys';

export const getTrainingSheet = (squadId: string) => api<TrainingSheet>(`/squads/${encodeURIComponent(squadId)}/training-sheet`);

/**
 * The squad's sheet. Plans change whenever someone adjusts one, submits a screen or records a clearance,
 * so it is asked for again each time the page opens (the last copy shows meanwhile). Those who screen keep
 * the last sheet of each squad they open on the device, as they keep the rounds they open, so it opens in
 * a gym with no signal; nothing is kept for anyone else (the offline feature's privacy rule).
 */
export function useTrainingSheetQuery(squadId: string | null) {
  const { membership } = useActiveClub();
  const keep = can(membership.role, 'screening.write');
  return useQuery({
    queryKey: trainingKeys.sheet(membership.clubId, squadId ?? ''),
    queryFn: () =>
      deviceBacked(
        trainingKeptKeys.sheet(squadId!),
        membership.clubId,
        () => getTrainingSheet(squadId!),
        () => (keep ? { roundId: null } : null),
      ),
    enabled: !!squadId,
    staleTime: 0,
  });
}
