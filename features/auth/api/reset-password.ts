import { useMutation } from '@tanstack/react-query';
import { api } from '@/features/api/client';
import type { ResetPasswordInput } from '@/features/auth/schemas';

export const useResetPasswordMutation = () =>
  useMutation({
    mutationFn: (input: ResetPasswordInput) => api('/auth/password-reset/complete', { method: 'POST', json: input }),
  });
