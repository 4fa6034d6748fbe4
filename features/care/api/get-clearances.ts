import { queryOptions, useQuery } from '@tanstack/react-query';
import { can, type Role } from '@/features/access/permissions';
import { api } from '@/features/api/client';
import { deviceBacked } from '@/features/offline/device-cache';
import { useActiveClub } from '@/features/session/active-club';
import type { ClearanceView } from '../types';
import { CARE_STALE_MS, careKeys } from './keys';

/** Pain reported at the athlete's newest screen, no physiotherapist's decision since: that screen's day and the tasks that hurt. */
export type PainWaiting = { screenedOn: string; taskIds: string[] };

export const getClearances = () => api<{ clearances: Record<string, NonNullable<ClearanceView>>; painWaiting?: Record<string, PainWaiting> }>('/clearances');

/** Where the club's clearances are kept on the device (features/offline's cache; removed at sign-out). */
export const CLEARANCES_KEPT_KEY = 'care.clearances';

/**
 * The club's clearances in force. Those who screen keep the last answer on the device, as they keep the
 * rounds they open: a round opened courtside with no signal still shows who was referred on or trains
 * with changes (without it the badges vanished offline). Nothing is kept for anyone else.
 */
export const clearancesQueryOptions = (clubId: string, role: Role) =>
  queryOptions({
    queryKey: careKeys.clearances(clubId),
    queryFn: () => deviceBacked(CLEARANCES_KEPT_KEY, clubId, getClearances, () => (can(role, 'screening.write') ? { roundId: null } : null)),
    staleTime: CARE_STALE_MS,
  });

/** The club's clearances answer (one request for a whole list); nothing for parents. */
function useClubClearances(enabled: boolean) {
  const { membership } = useActiveClub();
  return useQuery({ ...clearancesQueryOptions(membership.clubId, membership.role), enabled: enabled && membership.role !== 'parent' }).data;
}

/** The clearance in force for one athlete, from the club's map. */
export function useClearanceOf(athleteId: string, enabled = true): ClearanceView {
  return useClubClearances(enabled)?.clearances[athleteId] ?? null;
}

/** Pain waiting for a physiotherapist at the athlete's newest screen, from the same answer; null when none. */
export function usePainWaitingOf(athleteId: string, enabled = true): PainWaiting | null {
  return useClubClearances(enabled)?.painWaiting?.[athleteId] ?? null;
}
