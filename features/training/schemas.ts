import { array, object, string, type InferType } from 'yup';
import { isCalendarDate, isoDate } from '@/features/athletes/schemas';

// The one input of the training feature, used by the record form and by `validateBody` on the server.

/** How far back a session may still be recorded: about a season (our choice). */
export const RECORD_BACK_DAYS = 366;

const dayFromToday = (days: number) => new Date(Date.now() + days * 24 * 3600 * 1000).toISOString().slice(0, 10);

/** POST /api/squads/:id/training-sessions: who took part in the squad's corrective session on one day. */
export const recordSessionSchema = object({
  heldOn: isoDate('day of the session')
    // One day of slack: the phone's day may already be tomorrow in UTC terms, or not yet.
    .test('not-future', 'The session cannot be dated in the future.', (v) => !v || !isCalendarDate(v) || v <= dayFromToday(1))
    .test(
      'this-season',
      `Sessions older than ${RECORD_BACK_DAYS} days cannot be recorded.`,
      (v) => !v || !isCalendarDate(v) || v >= dayFromToday(-RECORD_BACK_DAYS),
    ),
  athleteIds: array(string().required().uuid('Choose athletes of this squad.'))
    .required('Tick who took part.')
    .min(1, 'Tick at least one athlete.')
    .max(80, 'A session lists at most 80 athletes.'),
  note: string().trim().max(500, 'Keep the note under 500 characters.').default(''),
});
export type RecordSessionInput = InferType<typeof recordSessionSchema>;

/** One recorded session as the API lists it. */
export type SessionView = { id: string; heldOn: string; note: string; recordedByName: string | null; athleteIds: string[] };
