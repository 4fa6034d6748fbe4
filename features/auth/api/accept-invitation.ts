import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/features/api/client';
import type { AcceptInvitationInput } from '@/features/auth/schemas';
import { authKeys } from './keys';

export function useAcceptInvitationMutation() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: AcceptInvitationInput) => api('/auth/invitations/accept', { method: 'POST', json: input }),
    onSuccess: () => qc.invalidateQueries({ queryKey: authKeys.me() }),
  });
}
