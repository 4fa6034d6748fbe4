import { boolean, date, index, pgEnum, pgTable, primaryKey, text, timestamp, uuid } from 'drizzle-orm/pg-core';
import { users } from './auth';
import { clubs } from './clubs';
import { timestamps } from './columns';

export const sexEnum = pgEnum('sex', ['female', 'male']);
export const sideEnum = pgEnum('side', ['left', 'right']);
export const consentKindEnum = pgEnum('consent_kind', ['photos', 'email_summaries', 'screening']);

export const squads = pgTable(
  'squads',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    clubId: uuid('club_id')
      .notNull()
      .references(() => clubs.id, { onDelete: 'cascade' }),
    name: text('name').notNull(),
    archivedAt: timestamp('archived_at', { withTimezone: true, mode: 'date' }),
    ...timestamps,
  },
  (t) => [index('squads_club_idx').on(t.clubId)],
);

export const athletes = pgTable(
  'athletes',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    clubId: uuid('club_id')
      .notNull()
      .references(() => clubs.id, { onDelete: 'cascade' }),
    // An athlete with results is archived, never deleted: the squad link is kept or nulled, not cascaded.
    squadId: uuid('squad_id').references(() => squads.id, { onDelete: 'set null' }),
    firstName: text('first_name').notNull(),
    lastName: text('last_name').notNull(),
    dateOfBirth: date('date_of_birth', { mode: 'string' }).notNull(),
    sex: sexEnum('sex').notNull(),
    racketHand: sideEnum('racket_hand').notNull(),
    takeOffLeg: sideEnum('take_off_leg').notNull(),
    archivedAt: timestamp('archived_at', { withTimezone: true, mode: 'date' }),
    ...timestamps,
  },
  (t) => [index('athletes_club_idx').on(t.clubId), index('athletes_squad_idx').on(t.squadId)],
);

export const guardianLinks = pgTable(
  'guardian_links',
  {
    athleteId: uuid('athlete_id')
      .notNull()
      .references(() => athletes.id, { onDelete: 'cascade' }),
    userId: uuid('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    createdAt: timestamp('created_at', { withTimezone: true, mode: 'date' }).notNull().defaultNow(),
  },
  (t) => [primaryKey({ columns: [t.athleteId, t.userId] }), index('guardian_links_user_idx').on(t.userId)],
);

/** Every consent decision is a new row; the newest per athlete and kind is in force. */
export const consents = pgTable(
  'consents',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    athleteId: uuid('athlete_id')
      .notNull()
      .references(() => athletes.id, { onDelete: 'cascade' }),
    kind: consentKindEnum('kind').notNull(),
    granted: boolean('granted').notNull(),
    decidedOn: date('decided_on', { mode: 'string' }).notNull(),
    recordedBy: uuid('recorded_by').references(() => users.id, { onDelete: 'set null' }),
    createdAt: timestamp('created_at', { withTimezone: true, mode: 'date' }).notNull().defaultNow(),
  },
  (t) => [index('consents_athlete_idx').on(t.athleteId, t.kind)],
);

export type Squad = typeof squads.$inferSelect;
export type Athlete = typeof athletes.$inferSelect;
