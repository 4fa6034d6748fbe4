import { useQueryClient } from '@tanstack/react-query';
import { useActiveClub } from '@/features/session/active-club';
import { screeningKeys } from '@/features/screening/api/keys';
import { careKeys } from './keys';

/** After any care change: reviews, clearances, notes and summaries of the club are read again. Athlete lists carry the clearance too. */
export function useCareChanged() {
  const client = useQueryClient();
  const { membership } = useActiveClub();
  return () => {
    void client.invalidateQueries({ queryKey: careKeys.club(membership.clubId) });
    // Athlete responses carry `clearance`: the roster's root key covers them.
    void client.invalidateQueries({ queryKey: ['athletes'] });
    // A clearance can make a new result version (held-back work back in the plan): results are read again.
    void client.invalidateQueries({ queryKey: screeningKeys.club(membership.clubId) });
  };
}
