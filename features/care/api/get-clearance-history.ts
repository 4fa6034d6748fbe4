import { useQuery } from '@tanstack/react-query';
import { api } from '@/features/api/client';
import { useActiveClub } from '@/features/session/active-club';
import type { ClearanceView } from '../types';
import { CARE_STALE_MS, careKeys } from './keys';

type ClearanceRecord = NonNullable<ClearanceView> & { id: string };

/** One athlete's decisions, newest first (the one in force first), for the physiotherapist's panel. */
export function useClearanceHistory(athleteId: string, enabled: boolean) {
  const { membership } = useActiveClub();
  return useQuery({
    queryKey: careKeys.clearanceHistory(membership.clubId, athleteId),
    queryFn: () => api<{ history: ClearanceRecord[] }>(`/athletes/${encodeURIComponent(athleteId)}/clearance`),
    staleTime: CARE_STALE_MS,
    enabled,
  });
}
