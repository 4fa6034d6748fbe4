import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { can } from '@/features/access/permissions';
import { api, ApiError } from '@/features/api/client';
import { deviceBacked } from '@/features/offline/device-cache';
import { connectivity, deviceSession, loadedDevice } from '@/features/offline/device-handle';
import { progressKeys } from '@/features/progress/api/keys';
import { useActiveClub } from '@/features/session/active-club';
import type { RecordSessionInput, SessionView } from '../schemas';
import { trainingKeptKeys, trainingKeys } from './keys';
import { recordSession } from './send-attendance';

export const getSessions = (squadId: string) => api<{ sessions: SessionView[] }>(`/squads/${encodeURIComponent(squadId)}/training-sessions`);

/**
 * The squad's latest recorded sessions. Those who screen keep the last list of each squad they open on
 * the device, with the sheet, so a record made in a gym with no signal starts from what was recorded.
 */
export function useSessionsQuery(squadId: string) {
  const { membership } = useActiveClub();
  const keep = can(membership.role, 'screening.write');
  return useQuery({
    queryKey: trainingKeys.sessions(membership.clubId, squadId),
    queryFn: () =>
      deviceBacked(
        trainingKeptKeys.sessions(squadId),
        membership.clubId,
        () => getSessions(squadId),
        () => (keep ? { roundId: null } : null),
      ),
  });
}

/** How long a record waits for an earlier one of the same day that is being sent (our choice). */
const IN_FLIGHT_WAIT_MS = 8_000;

/** How a record was saved: on the server, or kept on this phone until the connection is back. */
export type RecordOutcome = 'sent' | 'kept';

/**
 * Records a day's session; the list and every athlete's progress (sessions between screens) follow.
 * Those who screen (their phone keeps a queue) may record with no connection: the record waits on the
 * phone, replacing one of the same day still waiting, and goes out when the connection is back.
 */
export function useRecordSessionMutation(squadId: string) {
  const { membership } = useActiveClub();
  const client = useQueryClient();
  const queues = can(membership.role, 'screening.write');
  return useMutation({
    // Runs with no connection too: the offline path is the point (the default would pause it).
    networkMode: 'always',
    mutationFn: async (input: RecordSessionInput): Promise<RecordOutcome> => {
      const device = queues ? loadedDevice() : null;
      if (!device) {
        await recordSession(squadId, input);
        return 'sent';
      }
      const record = { heldOn: input.heldOn, athleteIds: input.athleteIds, note: input.note };
      const keepOnPhone = async () => {
        await device.outbox.addAttendance({ ...deviceSession(), squadId, record });
        return 'kept' as const;
      };
      if (!connectivity.isOnline()) return keepOnPhone();
      // A record of the same day already going out must land first, so that this newer one is the one
      // kept: wait for it a little, else queue this one behind it (the queue keeps the order).
      const going = device.outbox.getState();
      const inFlight = going.entries.find(
        (e) => e.seq === going.sending && e.kind === 'attendance' && e.squadId === squadId && e.record.heldOn === input.heldOn,
      );
      if (inFlight) {
        const landed = await Promise.race([
          device.outbox.whenDone(inFlight.seq).then(
            () => true,
            () => true,
          ),
          new Promise<false>((resolve) => setTimeout(() => resolve(false), IN_FLIGHT_WAIT_MS)),
        ]);
        if (!landed) return keepOnPhone();
      }
      try {
        await recordSession(squadId, input);
      } catch (e) {
        if (e instanceof ApiError && e.status === 0) return keepOnPhone();
        throw e;
      }
      // An older record of that day still waiting would otherwise overwrite this one later.
      await device.outbox.supersedeAttendance(squadId, input.heldOn);
      return 'sent';
    },
    onSuccess: (how) =>
      how === 'sent'
        ? Promise.all([
            client.invalidateQueries({ queryKey: trainingKeys.sessions(membership.clubId, squadId) }),
            client.invalidateQueries({ queryKey: progressKeys.club(membership.clubId) }),
          ])
        : undefined,
  });
}
