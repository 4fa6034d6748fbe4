import { useMutation } from '@tanstack/react-query';
import { api } from '@/features/api/client';
import { useRosterChanged } from './invalidate';
import type { Athlete } from './types';

export const unlinkGuardian = (id: string, userId: string) =>
  api<{ athlete: Athlete }>(`/athletes/${encodeURIComponent(id)}/guardians/${encodeURIComponent(userId)}`, { method: 'DELETE' });

export function useUnlinkGuardianMutation(id: string) {
  const changed = useRosterChanged();
  return useMutation({ mutationFn: (userId: string) => unlinkGuardian(id, userId), onSuccess: ({ athlete }) => changed(athlete) });
}
