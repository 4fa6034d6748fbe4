import { useMutation } from '@tanstack/react-query';
import { api } from '@/features/api/client';
import type { RequestResetInput } from '@/features/auth/schemas';

export const useRequestResetMutation = () =>
  useMutation({ mutationFn: (input: RequestResetInput) => api('/auth/password-reset', { method: 'POST', json: input }) });
