import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/features/api/client';
import { screeningKeys } from '@/features/screening/api/keys';
import { useActiveClub } from '@/features/session/active-club';
import type { ClearanceInput } from '../schemas';
import type { ClearanceView } from '../types';
import { useCareChanged } from './invalidate';

export const setClearance = (athleteId: string, input: ClearanceInput) =>
  api<{ clearance: ClearanceView }>(`/athletes/${encodeURIComponent(athleteId)}/clearance`, { method: 'PUT', json: input });

export function useSetClearanceMutation(athleteId: string) {
  const changed = useCareChanged();
  const client = useQueryClient();
  const { membership } = useActiveClub();
  return useMutation({
    mutationFn: (input: ClearanceInput) => setClearance(athleteId, input),
    onSuccess: () => {
      changed();
      // A clearance can make a new result version (held-back work back in the plan): results are read again.
      void client.invalidateQueries({ queryKey: screeningKeys.club(membership.clubId) });
    },
  });
}
