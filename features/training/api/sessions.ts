import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api } from '@/features/api/client';
import { progressKeys } from '@/features/progress/api/keys';
import { useActiveClub } from '@/features/session/active-club';
import type { RecordSessionInput, SessionView } from '../schemas';
import { trainingKeys } from './keys';

export const getSessions = (squadId: string) => api<{ sessions: SessionView[] }>(`/squads/${encodeURIComponent(squadId)}/training-sessions`);
export const recordSession = (squadId: string, input: RecordSessionInput) =>
  api<{ session: SessionView }>(`/squads/${encodeURIComponent(squadId)}/training-sessions`, { method: 'POST', json: input });

/** The squad's latest recorded sessions. */
export function useSessionsQuery(squadId: string) {
  const { membership } = useActiveClub();
  return useQuery({ queryKey: trainingKeys.sessions(membership.clubId, squadId), queryFn: () => getSessions(squadId) });
}

/** Records a day's session; the list and every athlete's progress (sessions between screens) follow. */
export function useRecordSessionMutation(squadId: string) {
  const { membership } = useActiveClub();
  const client = useQueryClient();
  return useMutation({
    mutationFn: (input: RecordSessionInput) => recordSession(squadId, input),
    onSuccess: () =>
      Promise.all([
        client.invalidateQueries({ queryKey: trainingKeys.sessions(membership.clubId, squadId) }),
        client.invalidateQueries({ queryKey: progressKeys.club(membership.clubId) }),
      ]),
  });
}
