import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/features/api/client';
import type { SignInResponse } from '@/features/auth/contract';
import type { SignInInput } from '@/features/auth/schemas';
import { authKeys } from './keys';

export const signIn = (input: SignInInput) => api<SignInResponse>('/auth/sign-in', { method: 'POST', json: input });

export function useSignInMutation() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: signIn,
    onSuccess: () => qc.invalidateQueries({ queryKey: authKeys.me() }),
  });
}
