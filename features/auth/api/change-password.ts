import { useMutation } from '@tanstack/react-query';
import { api } from '@/features/api/client';
import type { ChangePasswordInput } from '@/features/auth/schemas';

/** POST /api/auth/password: ends the account's other sessions and renews this one (new cookie). */
export const useChangePasswordMutation = () =>
  useMutation({
    mutationFn: (input: ChangePasswordInput) => api('/auth/password', { method: 'POST', json: input }),
  });
