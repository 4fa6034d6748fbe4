import { useMutation } from '@tanstack/react-query';
import { api } from '@/features/api/client';
import type { AthletePatchInput } from '../schemas';
import { useRosterChanged } from './invalidate';
import type { Athlete } from './types';

/** Edits any of the athlete's fields; moving to another squad sends only `squadId`. */
export const updateAthlete = (id: string, input: AthletePatchInput) =>
  api<{ athlete: Athlete }>(`/athletes/${encodeURIComponent(id)}`, { method: 'PATCH', json: input });

export function useUpdateAthleteMutation(id: string) {
  const changed = useRosterChanged();
  return useMutation({ mutationFn: (input: AthletePatchInput) => updateAthlete(id, input), onSuccess: ({ athlete }) => changed(athlete) });
}
