import { queryOptions, useQuery } from '@tanstack/react-query';
import { api, ApiError } from '@/features/api/client';
import type { RoleValue } from '@/features/auth/schemas';
import { authKeys } from './keys';

export type Membership = { clubId: string; clubName: string; role: RoleValue };
export type Me = { user: { id: string; email: string; displayName: string }; memberships: Membership[] };

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

export const meQueryOptions = () =>
  queryOptions({ queryKey: authKeys.me(), queryFn: getMe, staleTime: ME_STALE_MS, retry: 1 });

export const useMeQuery = () => useQuery(meQueryOptions());
