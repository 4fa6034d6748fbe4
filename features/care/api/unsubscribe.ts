import { useMutation } from '@tanstack/react-query';
import { api } from '@/features/api/client';

export const unsubscribe = (token: string) =>
  api<{ athleteFirstName: string; already: boolean }>(`/unsubscribe/${encodeURIComponent(token)}`, { method: 'POST' });

export function useUnsubscribeMutation() {
  return useMutation({ mutationFn: unsubscribe });
}
