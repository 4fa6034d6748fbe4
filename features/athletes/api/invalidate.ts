import { useQueryClient } from '@tanstack/react-query';
import { useActiveClub } from '@/features/session/active-club';
import { athleteKeys } from './keys';
import type { Athlete } from './types';

/**
 * What every roster mutation does on success: put the returned athlete in its page's cache at once,
 * then mark everything of the club stale (lists, squads' counts, consent histories).
 */
export function useRosterChanged() {
  const qc = useQueryClient();
  const { membership } = useActiveClub();
  return async (athlete?: Athlete) => {
    if (athlete) qc.setQueryData(athleteKeys.detail(membership.clubId, athlete.id), { athlete });
    await qc.invalidateQueries({ queryKey: athleteKeys.club(membership.clubId) });
  };
}
