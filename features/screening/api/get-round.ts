import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiStartedEarly } from '@/features/api/client';
import { deviceBacked } from '@/features/offline/device-cache';
import { useActiveClub } from '@/features/session/active-club';
import type { RoundDetail } from '@/features/screening/contract';
import { can } from '@/features/access/permissions';
import { ROUNDS_STALE_MS, roundKeptKey, screeningKeys } from './keys';

/** The round page asks for its round from its HTML (app/+html.tsx): the first call takes that answer. */
export const getRound = (id: string) => apiStartedEarly<RoundDetail>(`/rounds/${encodeURIComponent(id)}`);

/**
 * A round a tester opens is kept on the device (with its athletes), so it opens again with no
 * connection; `keep` is false for those who do not screen: nothing of theirs is kept.
 */
export const roundQueryOptions = (clubId: string, id: string, keep = false) =>
  queryOptions({
    queryKey: screeningKeys.round(clubId, id),
    queryFn: () =>
      deviceBacked(
        roundKeptKey(id),
        clubId,
        () => getRound(id),
        () => (keep ? { roundId: id } : null),
      ),
    staleTime: ROUNDS_STALE_MS,
  });

export function useRoundQuery(id: string) {
  const { membership } = useActiveClub();
  return useQuery(roundQueryOptions(membership.clubId, id, can(membership.role, 'screening.write')));
}
