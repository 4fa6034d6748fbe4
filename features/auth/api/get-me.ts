import { queryOptions, useQuery } from '@tanstack/react-query';
import { can } from '@/features/access/permissions';
import { apiStartedEarly, ApiError, forgetEarlyRequests } from '@/features/api/client';
import { deviceBacked } from '@/features/offline/device-cache';
import type { Me } from '@/features/auth/contract';
import { authKeys } from './keys';

export type { Me, Membership } from '@/features/auth/contract';

export const ME_STALE_MS = 5 * 60 * 1000;

/** null when signed out (the server said 401). The first call takes the answer the page asked for from its HTML. */
export async function getMe(): Promise<Me | null> {
  try {
    return await apiStartedEarly<Me>('/me');
  } catch (error) {
    if (error instanceof ApiError && error.status === 401) {
      // The page may have asked for a screen's data too (the capture screen's assessment): refused now.
      forgetEarlyRequests();
      return null;
    }
    throw error;
  }
}

/** Whether someone screens in one of their clubs: only they keep anything on the device. */
const screensSomewhere = (me: Me) => me.memberships.some((m) => can(m.role, 'screening.write'));

/**
 * Kept on the device (until sign-out) for people who screen, so the app opens with no connection for
 * work kept there. Signed out (the sign-in page) nothing is written, so the device store is not loaded.
 */
export const meQueryOptions = () =>
  queryOptions({
    queryKey: authKeys.me(),
    queryFn: () => deviceBacked('auth.me', 'me', getMe, (me) => (me && screensSomewhere(me) ? { roundId: null } : null)),
    staleTime: ME_STALE_MS,
    retry: 1,
  });

export const useMeQuery = () => useQuery(meQueryOptions());
