import { useMutation } from '@tanstack/react-query';
import { api } from '@/features/api/client';
import type { ConsentInput } from '../schemas';
import { useRosterChanged } from './invalidate';
import type { Athlete, ConsentRecord } from './types';

/** A new decision is a new record; the history keeps the earlier ones. */
export const recordConsent = (id: string, input: ConsentInput) =>
  api<{ athlete: Athlete; consents: ConsentRecord[] }>(`/athletes/${encodeURIComponent(id)}/consents`, { method: 'POST', json: input });

export function useRecordConsentMutation(id: string) {
  const changed = useRosterChanged();
  return useMutation({ mutationFn: (input: ConsentInput) => recordConsent(id, input), onSuccess: ({ athlete }) => changed(athlete) });
}
