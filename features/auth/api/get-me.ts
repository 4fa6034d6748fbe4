import { queryOptions, useQuery } from '@tanstack/react-query';
import { api, ApiError } from '@/features/api/client';
import { deviceBacked } from '@/features/offline/device-cache';
import type { Me } from '@/features/auth/contract';
import { authKeys } from './keys';

export type { Me, Membership } from '@/features/auth/contract';

export const ME_STALE_MS = 5 * 60 * 1000;

/** null when signed out (the server said 401). */
export async function getMe(): Promise<Me | null> {
  try {
    return await api<Me>('/me');
  } catch (error) {
    if (error instanceof ApiError && error.status === 401) return null;
    throw error;
  }
}

/** Kept on the device (until sign-out) so the app opens with no connection for work kept there. */
export const meQueryOptions = () =>
  queryOptions({
    queryKey: authKeys.me(),
    queryFn: () => deviceBacked('auth.me', 'me', getMe, (me) => (me ? { roundId: null } : null)),
    staleTime: ME_STALE_MS,
    retry: 1,
  });

export const useMeQuery = () => useQuery(meQueryOptions());
