import { useMutation } from '@tanstack/react-query';
import { api } from '@/features/api/client';
import type { GuardianInput } from '../schemas';
import { useRosterChanged } from './invalidate';
import type { Athlete } from './types';

export const linkGuardian = (id: string, input: GuardianInput) =>
  api<{ athlete: Athlete }>(`/athletes/${encodeURIComponent(id)}/guardians`, { method: 'POST', json: input });

export function useLinkGuardianMutation(id: string) {
  const changed = useRosterChanged();
  return useMutation({ mutationFn: (input: GuardianInput) => linkGuardian(id, input), onSuccess: ({ athlete }) => changed(athlete) });
}
