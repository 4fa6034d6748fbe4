import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/features/api/client';
import type { InvitationView } from '@/features/auth/contract';
import { authKeys } from './keys';

export type { InvitationView };

export const invitationQueryOptions = (token: string) =>
  queryOptions({
    queryKey: authKeys.invitation(token),
    // POST with the token in the body: a token in a URL ends up in logs and proxies.
    queryFn: () => api<InvitationView>('/auth/invitations/lookup', { method: 'POST', json: { token } }),
    retry: false,
    enabled: token.length > 0,
  });

export const useInvitationQuery = (token: string) => useQuery(invitationQueryOptions(token));
