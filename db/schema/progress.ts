import { date, integer, json, pgTable, text, timestamp, uuid } from 'drizzle-orm/pg-core';
import { athletes } from './athletes';
import { clubs } from './clubs';
import { rounds } from './screening';

export type RoundKneeAngles = { athletes: string[]; angles: Record<string, (number | null)[]> };

/**
 * Summaries for squad trends, kept by PostgreSQL itself: triggers on `assessments`,
 * `assessment_results` and `rounds` (migration `0011_progress_summary_triggers.sql`) work them out again
 * whenever what they sum is written or removed, in the same transaction, so no code path can forget
 * them. Trends then read one small row per round and per member instead of every result of the season.
 * The large values are `json` (kept as text): they are only ever sent on, never searched.
 */
export const roundSummaries = pgTable('round_summaries', {
  roundId: uuid('round_id')
    .primaryKey()
    .references(() => rounds.id, { onDelete: 'cascade' }),
  clubId: uuid('club_id')
    .notNull()
    .references(() => clubs.id, { onDelete: 'cascade' }),
  /** Athletes with a submitted screen (and its current result) in the round. */
  screened: integer('screened').notNull().default(0),
  /** Per pattern: how many of them had at least one flag of it (any task, any side). */
  flagged: json('flagged').$type<Record<string, number>>().notNull().default({}),
  /**
   * Knee angles from the front (FPPA, degrees, rounded to 0.1): the screened athletes' ids, and per
   * measurement id one value per athlete in that order (null where not measured).
   */
  kneeAngles: json('knee_angles').$type<RoundKneeAngles>().notNull().default({ athletes: [], angles: {} }),
  refreshedAt: timestamp('refreshed_at', { withTimezone: true, mode: 'date' }).notNull().defaultNow(),
});

/**
 * Each athlete's newest submitted screen (by its round's date), wherever it was, with the small parts of
 * its current result that the squad table shows; all nulls when they have none.
 */
export const athleteLatestScreens = pgTable('athlete_latest_screens', {
  athleteId: uuid('athlete_id')
    .primaryKey()
    .references(() => athletes.id, { onDelete: 'cascade' }),
  clubId: uuid('club_id')
    .notNull()
    .references(() => clubs.id, { onDelete: 'cascade' }),
  assessmentId: uuid('assessment_id'),
  screenedOn: date('screened_on', { mode: 'string' }),
  flagIds: json('flag_ids').$type<string[]>(),
  flagSides: json('flag_sides').$type<(string | null)[]>(),
  maturityBand: text('maturity_band'),
  rescreenDate: text('rescreen_date'),
  refreshedAt: timestamp('refreshed_at', { withTimezone: true, mode: 'date' }).notNull().defaultNow(),
});
