// Sending who took part in a session: directly from the record form, or later from the device's queue
// (the sender registered by TrainingSync). Small on purpose: the signed-in shell loads it for everyone who
// screens, so it imports only the API client, the query keys and the offline types.
import type { QueryClient } from '@tanstack/react-query';
import { api, sentFromDevice } from '@/features/api/client';
import type { AttendanceEntry } from '@/features/offline/outbox';
import { progressKeys } from '@/features/progress/api/keys';
import type { RecordSessionInput, SessionView } from '../schemas';
import { trainingKeys } from './keys';

export const recordSession = (squadId: string, input: RecordSessionInput, device: { idempotencyKey?: string; clubId?: string } = {}) =>
  api<{ session: SessionView }>(`/squads/${encodeURIComponent(squadId)}/training-sessions`, {
    method: 'POST',
    headers: sentFromDevice(device),
    json: input,
  });

/** Sends a record kept on the device; the sheet's list and the athletes' progress are asked for again. */
export async function sendAttendance(entry: AttendanceEntry, client: QueryClient): Promise<void> {
  await recordSession(entry.squadId, entry.record, { idempotencyKey: entry.key, clubId: entry.clubId });
  await Promise.all([
    client.invalidateQueries({ queryKey: trainingKeys.sessions(entry.clubId, entry.squadId) }),
    client.invalidateQueries({ queryKey: progressKeys.club(entry.clubId) }),
  ]);
}
