import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api } from '@/features/api/client';
import type { AcceptInvitationInput, RequestResetInput, ResetPasswordInput } from '@/features/auth/schemas';
import { authKeys } from './keys';

/** `children`: whom a parent's invitation links when accepted (names). */
export type InvitationView = { email: string; role: string; clubName: string; hasAccount: boolean; children: string[] };

export const invitationQueryOptions = (token: string) =>
  queryOptions({
    queryKey: authKeys.invitation(token),
    queryFn: () => api<InvitationView>(`/auth/invitations/${encodeURIComponent(token)}`),
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
