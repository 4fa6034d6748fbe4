import { useMutation } from '@tanstack/react-query';
import { api } from '@/features/api/client';
import type { AthleteInput } from '../schemas';
import { useRosterChanged } from './invalidate';
import type { Athlete } from './types';

export const createAthlete = (input: AthleteInput) => api<{ athlete: Athlete }>('/athletes', { method: 'POST', json: input });

export function useCreateAthleteMutation() {
  const changed = useRosterChanged();
  return useMutation({ mutationFn: createAthlete, onSuccess: ({ athlete }) => changed(athlete) });
}
