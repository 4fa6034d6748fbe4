import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api } from '@/features/api/client';
import type { AcceptInvitationInput, RequestResetInput, ResetPasswordInput } from '@/features/auth/schemas';
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

export function useAcceptInvitationMutation() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: AcceptInvitationInput) => api('/auth/invitations/accept', { method: 'POST', json: input }),
    onSuccess: () => qc.invalidateQueries({ queryKey: authKeys.me() }),
  });
}

export const useRequestResetMutation = () =>
  useMutation({ mutationFn: (input: RequestResetInput) => api('/auth/password-reset', { method: 'POST', json: input }) });

export const useResetPasswordMutation = () =>
  useMutation({
    mutationFn: (input: ResetPasswordInput) => api('/auth/password-reset/complete', { method: 'POST', json: input }),
  });
