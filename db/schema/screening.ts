import { sql } from 'drizzle-orm';
import { boolean, date, index, integer, jsonb, pgEnum, pgTable, text, timestamp, uniqueIndex, uuid } from 'drizzle-orm/pg-core';
import type { AssessmentDraft, PlanOverrideView } from '@/features/screening/contract';
import type { AssessmentInput, AssessmentResult, PlannedExercise } from '@/features/screening/engine';
import { users } from './auth';
import { athletes, squads } from './athletes';
import { clubs } from './clubs';
import { timestamps } from './columns';

export const assessmentStatusEnum = pgEnum('assessment_status', ['not_started', 'in_progress', 'submitted']);
export const photoViewEnum = pgEnum('photo_view', ['front', 'side']);

/** One screening session of a squad on a date ("pre-season"). */
export const rounds = pgTable(
  'rounds',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    clubId: uuid('club_id')
      .notNull()
      .references(() => clubs.id, { onDelete: 'cascade' }),
    squadId: uuid('squad_id')
      .notNull()
      .references(() => squads.id, { onDelete: 'restrict' }),
    name: text('name').notNull(),
    screenedOn: date('screened_on', { mode: 'string' }).notNull(),
    createdBy: uuid('created_by').references(() => users.id, { onDelete: 'set null' }),
    /** Set when the round is closed: no more screening in it until a head coach reopens it. */
    closedAt: timestamp('closed_at', { withTimezone: true, mode: 'date' }),
    closedBy: uuid('closed_by').references(() => users.id, { onDelete: 'set null' }),
    ...timestamps,
  },
  (t) => [
    index('rounds_club_idx').on(t.clubId, t.screenedOn),
    // Progress: a squad's rounds in date order (squad trends).
    index('rounds_squad_idx').on(t.squadId, t.screenedOn),
  ],
);

/** One athlete in one round: the tester's draft, then the submitted state. */
export const assessments = pgTable(
  'assessments',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    clubId: uuid('club_id')
      .notNull()
      .references(() => clubs.id, { onDelete: 'cascade' }),
    roundId: uuid('round_id')
      .notNull()
      .references(() => rounds.id, { onDelete: 'cascade' }),
    // Results are never lost with an athlete: athletes are archived, not deleted.
    athleteId: uuid('athlete_id')
      .notNull()
      .references(() => athletes.id, { onDelete: 'restrict' }),
    status: assessmentStatusEnum('status').notNull().default('not_started'),
    draft: jsonb('draft').$type<AssessmentDraft>().notNull().default({ body: {}, tasks: {} }),
    /** Increases with every saved draft; a save naming an older version is refused (two phones, one athlete). */
    draftVersion: integer('draft_version').notNull().default(0),
    submittedAt: timestamp('submitted_at', { withTimezone: true, mode: 'date' }),
    submittedBy: uuid('submitted_by').references(() => users.id, { onDelete: 'set null' }),
    ...timestamps,
  },
  (t) => [
    uniqueIndex('assessments_round_athlete_uq').on(t.roundId, t.athleteId),
    index('assessments_athlete_idx').on(t.athleteId),
    // Progress: submitted screens by round and by athlete, holding every column trends join on, so a
    // squad's season is read by index-only scans instead of a pass over every assessment of the club.
    index('assessments_round_submitted_idx')
      .on(t.roundId, t.athleteId, t.id)
      .where(sql`status = 'submitted'`),
    index('assessments_athlete_submitted_idx')
      .on(t.athleteId, t.roundId, t.id)
      .where(sql`status = 'submitted'`),
  ],
);

/** The engine's output for a submission. Re-submitting adds a version; the newest is current. */
export const assessmentResults = pgTable(
  'assessment_results',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    clubId: uuid('club_id')
      .notNull()
      .references(() => clubs.id, { onDelete: 'cascade' }),
    assessmentId: uuid('assessment_id')
      .notNull()
      .references(() => assessments.id, { onDelete: 'cascade' }),
    athleteId: uuid('athlete_id')
      .notNull()
      .references(() => athletes.id, { onDelete: 'restrict' }),
    version: integer('version').notNull(),
    isCurrent: boolean('is_current').notNull().default(true),
    engineVersion: text('engine_version').notNull(),
    input: jsonb('input').$type<AssessmentInput>().notNull(),
    result: jsonb('result').$type<AssessmentResult>().notNull(),
    createdBy: uuid('created_by').references(() => users.id, { onDelete: 'set null' }),
    createdAt: timestamp('created_at', { withTimezone: true, mode: 'date' }).notNull().defaultNow(),
    /**
     * Why this version was made when it is not a tester's submission, in words (e.g. worked out again
     * after a physiotherapist's clearance); null for a submission.
     */
    reason: text('reason'),
    // Progress: small copies of what squad trends read, kept by PostgreSQL from `result` on every write,
    // so a squad's season is read without unpacking each full result (measurements, flags and plan).
    /** The flags' ids ('pattern/scope/side'), in the result's order. */
    flagIds: jsonb('flag_ids')
      .$type<string[]>()
      .generatedAlwaysAs(sql`jsonb_path_query_array(result, '$.flags[*].id')`),
    /** The flags' sides, parallel to flagIds (null for unsided flags). */
    flagSides: jsonb('flag_sides')
      .$type<(string | null)[]>()
      .generatedAlwaysAs(sql`jsonb_path_query_array(result, '$.flags[*].side')`),
    /** Knee angles from the front (FPPA): measurement ids and values, parallel arrays. */
    fppaIds: jsonb('fppa_ids')
      .$type<string[]>()
      .generatedAlwaysAs(sql`jsonb_path_query_array(result, '$.measurements[*] ? (@.metric == "fppa").id')`),
    fppaValues: jsonb('fppa_values')
      .$type<number[]>()
      .generatedAlwaysAs(sql`jsonb_path_query_array(result, '$.measurements[*] ? (@.metric == "fppa").value')`),
    maturityBand: text('maturity_band').generatedAlwaysAs(sql`result #>> '{maturity,band}'`),
    rescreenDate: text('rescreen_date').generatedAlwaysAs(sql`result #>> '{plan,rescreenDate}'`),
    /** 'clearance-needed' when pain was reported (the plan waits for a clearance), else 'ready'. */
    planStatus: text('plan_status').generatedAlwaysAs(sql`result #>> '{plan,status}'`),
  },
  (t) => [
    uniqueIndex('assessment_results_version_uq').on(t.assessmentId, t.version),
    index('assessment_results_athlete_idx').on(t.athleteId, t.createdAt),
    // The current result of an assessment, without scanning its older versions, with the scalar columns
    // squad trends and the athletes' latest screens read. The JSON columns (flags, knee angles) stay out
    // of the index: an index row is limited to about 2.7 KB, and a long flag list must never make a
    // submit fail. They are read from the rows this index points to (one per athlete).
    index('assessment_results_current_summary_idx')
      .on(t.assessmentId, t.createdAt, t.maturityBand, t.rescreenDate)
      .where(sql`is_current`),
  ],
);

/** A tester's change to the engine's plan, kept beside the engine's proposal. Newest wins. */
export const planAdjustments = pgTable(
  'plan_adjustments',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    resultId: uuid('result_id')
      .notNull()
      .references(() => assessmentResults.id, { onDelete: 'cascade' }),
    exercises: jsonb('exercises').$type<PlannedExercise[]>().notNull(),
    note: text('note').notNull().default(''),
    /** Limits passed on purpose by a head coach or physiotherapist, each with its reason. */
    overrides: jsonb('overrides').$type<PlanOverrideView[]>().notNull().default([]),
    createdBy: uuid('created_by').references(() => users.id, { onDelete: 'set null' }),
    createdAt: timestamp('created_at', { withTimezone: true, mode: 'date' }).notNull().defaultNow(),
  },
  (t) => [index('plan_adjustments_result_idx').on(t.resultId, t.createdAt)],
);

export const photos = pgTable(
  'photos',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    clubId: uuid('club_id')
      .notNull()
      .references(() => clubs.id, { onDelete: 'cascade' }),
    assessmentId: uuid('assessment_id')
      .notNull()
      .references(() => assessments.id, { onDelete: 'cascade' }),
    taskId: text('task_id').notNull(),
    view: photoViewEnum('view').notNull(),
    storageKey: text('storage_key').notNull(),
    thumbKey: text('thumb_key').notNull(),
    width: integer('width').notNull(),
    height: integer('height').notNull(),
    /** Set when a newer photo of the same task and view replaces this one. */
    replacedAt: timestamp('replaced_at', { withTimezone: true, mode: 'date' }),
    uploadedBy: uuid('uploaded_by').references(() => users.id, { onDelete: 'set null' }),
    createdAt: timestamp('created_at', { withTimezone: true, mode: 'date' }).notNull().defaultNow(),
  },
  (t) => [index('photos_assessment_idx').on(t.assessmentId, t.taskId, t.view)],
);

export type Round = typeof rounds.$inferSelect;
export type Assessment = typeof assessments.$inferSelect;
export type AssessmentResultRow = typeof assessmentResults.$inferSelect;
export type Photo = typeof photos.$inferSelect;
