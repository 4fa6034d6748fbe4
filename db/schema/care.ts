import { sql } from 'drizzle-orm';
import { boolean, index, integer, jsonb, pgEnum, pgTable, text, timestamp, uuid } from 'drizzle-orm/pg-core';
import { users } from './auth';
import { athletes } from './athletes';
import { clubs } from './clubs';
import { timestamps } from './columns';
import { assessmentResults, assessments } from './screening';

export const noteVisibilityEnum = pgEnum('note_visibility', ['team', 'family']);
export const clearanceStatusEnum = pgEnum('clearance_status', ['cleared', 'modified', 'referred']);

/** Care-team settings of a club: one row per club, created with the defaults on first read or save. */
export const careSettings = pgTable('care_settings', {
  clubId: uuid('club_id')
    .primaryKey()
    .references(() => clubs.id, { onDelete: 'cascade' }),
  /** Days after submission when a reviewed screen's family summary goes out by itself; null: never. */
  autoReleaseDays: integer('auto_release_days'),
  /** Days between a withdrawn photo consent and the deletion of that athlete's photos. */
  photoGraceDays: integer('photo_grace_days').notNull().default(30),
  /** Months a photo is kept after it was taken. */
  photoRetentionMonths: integer('photo_retention_months').notNull().default(24),
  /** Parents may see their own child's photos in the family view. */
  familyPhotos: boolean('family_photos').notNull().default(false),
  /** Testers may read team-only notes. */
  testersReadTeamNotes: boolean('testers_read_team_notes').notNull().default(false),
  ...timestamps,
});

/** A note on an athlete (and optionally one assessment). Editable by its author for a short time, then kept as written. */
export const careNotes = pgTable(
  'care_notes',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    clubId: uuid('club_id')
      .notNull()
      .references(() => clubs.id, { onDelete: 'cascade' }),
    athleteId: uuid('athlete_id')
      .notNull()
      .references(() => athletes.id, { onDelete: 'restrict' }),
    assessmentId: uuid('assessment_id').references(() => assessments.id, { onDelete: 'set null' }),
    authorId: uuid('author_id').references(() => users.id, { onDelete: 'set null' }),
    visibility: noteVisibilityEnum('visibility').notNull(),
    text: text('text').notNull(),
    ...timestamps,
  },
  (t) => [index('care_notes_athlete_idx').on(t.athleteId, t.createdAt)],
);

/** Every clearance decision is a new row; the newest per athlete is in force. */
export const clearances = pgTable(
  'clearances',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    clubId: uuid('club_id')
      .notNull()
      .references(() => clubs.id, { onDelete: 'cascade' }),
    athleteId: uuid('athlete_id')
      .notNull()
      .references(() => athletes.id, { onDelete: 'restrict' }),
    status: clearanceStatusEnum('status').notNull(),
    detail: text('detail').notNull().default(''),
    /** "Train with changes": the kinds of work held back ('loaded', 'landing'); empty otherwise. */
    holds: text('holds')
      .array()
      .notNull()
      .default(sql`'{}'::text[]`),
    setBy: uuid('set_by').references(() => users.id, { onDelete: 'set null' }),
    createdAt: timestamp('created_at', { withTimezone: true, mode: 'date' }).notNull().defaultNow(),
  },
  (t) => [index('clearances_athlete_idx').on(t.athleteId, t.createdAt)],
);

/** A physiotherapist's "reviewed" mark on one result version of an assessment. */
export const assessmentReviews = pgTable(
  'assessment_reviews',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    clubId: uuid('club_id')
      .notNull()
      .references(() => clubs.id, { onDelete: 'cascade' }),
    assessmentId: uuid('assessment_id')
      .notNull()
      .references(() => assessments.id, { onDelete: 'cascade' }),
    resultId: uuid('result_id')
      .notNull()
      .references(() => assessmentResults.id, { onDelete: 'cascade' }),
    reviewedBy: uuid('reviewed_by').references(() => users.id, { onDelete: 'set null' }),
    createdAt: timestamp('created_at', { withTimezone: true, mode: 'date' }).notNull().defaultNow(),
  },
  (t) => [index('assessment_reviews_assessment_idx').on(t.assessmentId, t.createdAt)],
);

/** A family summary released to parents: the words are frozen at release, so later edits do not rewrite what was sent. */
export const summaryReleases = pgTable(
  'summary_releases',
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
    resultId: uuid('result_id')
      .notNull()
      .references(() => assessmentResults.id, { onDelete: 'cascade' }),
    /** Null for an automatic release. */
    releasedBy: uuid('released_by').references(() => users.id, { onDelete: 'set null' }),
    summary: jsonb('summary').$type<unknown>().notNull(),
    createdAt: timestamp('created_at', { withTimezone: true, mode: 'date' }).notNull().defaultNow(),
  },
  (t) => [index('summary_releases_athlete_idx').on(t.athleteId, t.createdAt), index('summary_releases_assessment_idx').on(t.assessmentId)],
);

/** Who viewed or changed what, and which e-mail went to whom. Rows are only ever added. */
export const auditEvents = pgTable(
  'audit_events',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    clubId: uuid('club_id')
      .notNull()
      .references(() => clubs.id, { onDelete: 'cascade' }),
    /** Null for the system (scheduled jobs, automatic releases). */
    actorId: uuid('actor_id').references(() => users.id, { onDelete: 'set null' }),
    /** e.g. 'view', 'create', 'update', 'release', 'email.sent', 'photo.deleted'. */
    action: text('action').notNull(),
    /** 'athlete' | 'assessment' | 'note' | 'clearance' | 'consent' | 'email' | 'photo' | 'settings' */
    subjectKind: text('subject_kind').notNull(),
    subjectId: uuid('subject_id'),
    athleteId: uuid('athlete_id').references(() => athletes.id, { onDelete: 'set null' }),
    detail: jsonb('detail').$type<Record<string, unknown>>().notNull().default({}),
    createdAt: timestamp('created_at', { withTimezone: true, mode: 'date' }).notNull().defaultNow(),
  },
  (t) => [index('audit_events_club_idx').on(t.clubId, t.createdAt), index('audit_events_athlete_idx').on(t.athleteId)],
);

export type CareNote = typeof careNotes.$inferSelect;
export type Clearance = typeof clearances.$inferSelect;
export type CareSettings = typeof careSettings.$inferSelect;
export type AuditEvent = typeof auditEvents.$inferSelect;

/** One family-summary e-mail queued for one parent: who was sent what, and the unsubscribe link's token (its hash only). */
export const summaryEmails = pgTable(
  'summary_emails',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    clubId: uuid('club_id')
      .notNull()
      .references(() => clubs.id, { onDelete: 'cascade' }),
    releaseId: uuid('release_id')
      .notNull()
      .references(() => summaryReleases.id, { onDelete: 'cascade' }),
    athleteId: uuid('athlete_id')
      .notNull()
      .references(() => athletes.id, { onDelete: 'restrict' }),
    userId: uuid('user_id').references(() => users.id, { onDelete: 'set null' }),
    email: text('email').notNull(),
    unsubscribeTokenHash: text('unsubscribe_token_hash').notNull().unique(),
    unsubscribedAt: timestamp('unsubscribed_at', { withTimezone: true, mode: 'date' }),
    createdAt: timestamp('created_at', { withTimezone: true, mode: 'date' }).notNull().defaultNow(),
  },
  (t) => [index('summary_emails_release_idx').on(t.releaseId)],
);
