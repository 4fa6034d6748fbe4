import { useMutation } from '@tanstack/react-query';
import { api } from '@/features/api/client';
import type { ClearanceInput } from '../schemas';
import type { ClearanceView } from '../types';
import { useCareChanged } from './invalidate';

export const setClearance = (athleteId: string, input: ClearanceInput) =>
  api<{ clearance: ClearanceView }>(`/athletes/${encodeURIComponent(athleteId)}/clearance`, { method: 'PUT', json: input });

export function useSetClearanceMutation(athleteId: string) {
  const changed = useCareChanged();
  return useMutation({ mutationFn: (input: ClearanceInput) => setClearance(athleteId, input), onSuccess: changed });
}
