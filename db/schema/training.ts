import { date, index, pgTable, primaryKey, text, uniqueIndex, uuid } from 'drizzle-orm/pg-core';
import { users } from './auth';
import { athletes, squads } from './athletes';
import { clubs } from './clubs';
import { timestamps } from './columns';

/**
 * A corrective session a squad held on one day, recorded from its training sheet. One per squad and day:
 * recording the day again replaces who took part (a coach correcting a tick, or a retried request).
 */
export const trainingSessions = pgTable(
  'training_sessions',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    clubId: uuid('club_id')
      .notNull()
      .references(() => clubs.id, { onDelete: 'cascade' }),
    squadId: uuid('squad_id')
      .notNull()
      .references(() => squads.id, { onDelete: 'cascade' }),
    heldOn: date('held_on', { mode: 'string' }).notNull(),
    note: text('note').notNull().default(''),
    recordedBy: uuid('recorded_by').references(() => users.id, { onDelete: 'set null' }),
    ...timestamps,
  },
  (t) => [uniqueIndex('training_sessions_squad_day_idx').on(t.squadId, t.heldOn)],
);

/** Who took part in a session. */
export const trainingAttendance = pgTable(
  'training_attendance',
  {
    sessionId: uuid('session_id')
      .notNull()
      .references(() => trainingSessions.id, { onDelete: 'cascade' }),
    athleteId: uuid('athlete_id')
      .notNull()
      .references(() => athletes.id, { onDelete: 'cascade' }),
    clubId: uuid('club_id')
      .notNull()
      .references(() => clubs.id, { onDelete: 'cascade' }),
  },
  (t) => [primaryKey({ columns: [t.sessionId, t.athleteId] }), index('training_attendance_athlete_idx').on(t.athleteId)],
);
