import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/features/api/client';
import { rememberSignOut } from '../return-to';
import { authKeys } from './keys';
import { forgetKeptForms } from '@/features/care/kept-form-keys';

export const signOut = () => api<void>('/auth/sign-out', { method: 'POST' });

export function useSignOutMutation() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: signOut,
    onSuccess: () => {
      rememberSignOut(true);
      // Nothing of the previous person may stay in memory on a shared phone.
      qc.clear();
      forgetKeptForms();
      qc.setQueryData(authKeys.me(), null);
    },
  });
}
