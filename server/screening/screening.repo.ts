import { and, asc, desc, eq, isNull, ne, sql, type SQL } from 'drizzle-orm';
import type { NodePgQueryResultHKT } from 'drizzle-orm/node-postgres';
import type { PgDatabase } from 'drizzle-orm/pg-core';
import type * as schema from '@/db/schema';
import { assessmentResults, assessments, athletes, clearances, photos, planAdjustments, rounds, squads, users } from '@/db/schema';
import type { AssessmentDraft, AssessmentStatus, PlanOverrideView } from '@/features/screening/contract';
import type { AssessmentInput, AssessmentResult, PlannedExercise } from '@/features/screening/engine';
import type { ClubScope } from '@/server/access/scope';

/** The database or a transaction: the repository works inside either. */
export type Executor = PgDatabase<NodePgQueryResultHKT, typeof schema>;

/**
 * The newest consent decision of one kind for the athlete in the current row; false when none was
 * recorded. Written with qualified names: drizzle leaves columns unqualified in a single-table query,
 * where a bare "id" inside the subquery would mean consents.id.
 */
const consentInForceSql = (
  kind: 'photos' | 'screening',
  answer: 'c.granted' | 'not c.granted' = 'c.granted',
  athleteId: SQL = sql.raw('"athletes"."id"'),
) => sql<boolean>`coalesce((
  select ${sql.raw(answer)} from consents c
  where c.athlete_id = ${athleteId} and c.kind = ${sql.raw(`'${kind}'`)}
  order by c.created_at desc limit 1
), false)`;

/** Photos may be taken and shown. */
export const photoConsentSql = consentInForceSql('photos');

/**
 * The athlete takes part in screens and corrective exercises: the family said yes and has not withdrawn
 * it. No decision on record counts as no (our choice: a minor is not screened on an assumption).
 */
export const screeningConsentSql = consentInForceSql('screening');

/** The family's newest decision about screening is a no (false: a yes, or none recorded yet). */
export const screeningRefusedSql = consentInForceSql('screening', 'not c.granted');

/**
 * Every query filters by the scope's club. Screening is staff-only, so the scope never carries a
 * parent's athlete list here; the router refuses parents before a repository is built.
 */
export function screeningRepo(db: Executor, scope: ClubScope) {
  const clubId = scope.clubId;

  const roundColumns = {
    id: rounds.id,
    squadId: rounds.squadId,
    squadName: squads.name,
    name: rounds.name,
    screenedOn: rounds.screenedOn,
    closedAt: rounds.closedAt,
    closedByName: sql<string | null>`(select u.display_name from users u where u.id = ${rounds.closedBy})`,
    // Not started and allowed to start: an athlete whose family has not agreed to screening is not counted
    // as work left in the round (our choice: "0 of 13" for a squad of which 12 may be screened never
    // reached its end).
    notStarted: sql<number>`count(${assessments.id}) filter (where ${assessments.status} = 'not_started' and ${consentInForceSql('screening', 'c.granted', sql`${assessments.athleteId}`)})::int`,
    inProgress: sql<number>`count(${assessments.id}) filter (where ${assessments.status} = 'in_progress')::int`,
    submitted: sql<number>`count(${assessments.id}) filter (where ${assessments.status} = 'submitted')::int`,
  };

  /**
   * Athletes of the round's squad now (not archived) who have no assessment in the round: they joined
   * the squad after it began. Name order.
   */
  function roundNewcomers(roundId: string, squadId: string) {
    return db
      .select({ athleteId: athletes.id, firstName: athletes.firstName, lastName: athletes.lastName })
      .from(athletes)
      .where(
        and(
          eq(athletes.clubId, clubId),
          eq(athletes.squadId, squadId),
          isNull(athletes.archivedAt),
          sql`not exists (select 1 from ${assessments} where ${assessments.roundId} = ${roundId} and ${assessments.athleteId} = ${athletes.id})`,
        ),
      )
      .orderBy(asc(athletes.lastName), asc(athletes.firstName), asc(athletes.id));
  }

  /** A not-started assessment in the round for each athlete given (one already there is left as it is). */
  async function addToRound(roundId: string, athleteIds: readonly string[]) {
    if (athleteIds.length === 0) return;
    await db
      .insert(assessments)
      .values(athleteIds.map((athleteId) => ({ clubId, roundId, athleteId })))
      .onConflictDoNothing({ target: [assessments.roundId, assessments.athleteId] });
  }

  function roundSummaries(where: SQL | undefined) {
    return db
      .select(roundColumns)
      .from(rounds)
      .innerJoin(squads, eq(squads.id, rounds.squadId))
      .leftJoin(assessments, eq(assessments.roundId, rounds.id))
      .where(and(eq(rounds.clubId, clubId), where))
      .groupBy(rounds.id, squads.name)
      .orderBy(desc(rounds.screenedOn), desc(rounds.createdAt));
  }

  const assessmentColumns = {
    id: assessments.id,
    roundId: assessments.roundId,
    athleteId: assessments.athleteId,
    status: assessments.status,
    draft: assessments.draft,
    draftVersion: assessments.draftVersion,
    submittedAt: assessments.submittedAt,
    roundName: rounds.name,
    screenedOn: rounds.screenedOn,
    roundClosedAt: rounds.closedAt,
    firstName: athletes.firstName,
    lastName: athletes.lastName,
    sex: athletes.sex,
    dateOfBirth: athletes.dateOfBirth,
    racketHand: athletes.racketHand,
    takeOffLeg: athletes.takeOffLeg,
    photoConsent: photoConsentSql,
    screeningConsent: screeningConsentSql,
    screeningRefused: screeningRefusedSql,
  };

  const resultColumns = {
    id: assessmentResults.id,
    version: assessmentResults.version,
    isCurrent: assessmentResults.isCurrent,
    engineVersion: assessmentResults.engineVersion,
    result: assessmentResults.result,
    createdAt: assessmentResults.createdAt,
    createdByName: users.displayName,
    reason: assessmentResults.reason,
  };

  return {
    roundNewcomers,
    addToRound,

    async squad(id: string) {
      const [row] = await db
        .select({ id: squads.id, name: squads.name, archivedAt: squads.archivedAt })
        .from(squads)
        .where(and(eq(squads.clubId, clubId), eq(squads.id, id)));
      return row ?? null;
    },

    listRounds(options: { squadId?: string } = {}) {
      return roundSummaries(options.squadId ? eq(rounds.squadId, options.squadId) : undefined);
    },

    async round(id: string) {
      const [row] = await roundSummaries(eq(rounds.id, id));
      return row ?? null;
    },

    roundAthletes(roundId: string) {
      return db
        .select({
          assessmentId: assessments.id,
          athleteId: athletes.id,
          firstName: athletes.firstName,
          lastName: athletes.lastName,
          status: assessments.status,
          photoConsent: photoConsentSql,
          screeningConsent: screeningConsentSql,
          screeningRefused: screeningRefusedSql,
          flagCount: sql<number | null>`jsonb_array_length(${assessmentResults.result} -> 'flags')`,
          flags: sql<{ severity: 'watch' | 'concern'; title: string; side: string }[] | null>`(
            select jsonb_agg(jsonb_build_object('severity', f ->> 'severity', 'title', f ->> 'title', 'side', f ->> 'side'))
            from jsonb_array_elements(${assessmentResults.result} -> 'flags') f
          )`,
        })
        .from(assessments)
        .innerJoin(athletes, eq(athletes.id, assessments.athleteId))
        .leftJoin(assessmentResults, and(eq(assessmentResults.assessmentId, assessments.id), eq(assessmentResults.isCurrent, true)))
        .where(and(eq(assessments.clubId, clubId), eq(assessments.roundId, roundId)))
        .orderBy(asc(athletes.lastName), asc(athletes.firstName), asc(athletes.id));
    },

    /** Creates the round with one not-started assessment per athlete of the squad still on the roster. */
    async createRound(values: { squadId: string; name: string; screenedOn: string }) {
      const [round] = await db
        .insert(rounds)
        .values({ clubId, squadId: values.squadId, name: values.name, screenedOn: values.screenedOn, createdBy: scope.userId })
        .returning({ id: rounds.id });
      // A new round's athletes: everyone of the squad still on the roster, all "new" to it.
      await addToRound(
        round!.id,
        (await roundNewcomers(round!.id, values.squadId)).map((a) => a.athleteId),
      );
      return round!.id;
    },

    async assessment(id: string) {
      const [row] = await db
        .select(assessmentColumns)
        .from(assessments)
        .innerJoin(rounds, eq(rounds.id, assessments.roundId))
        .innerJoin(athletes, eq(athletes.id, assessments.athleteId))
        .where(and(eq(assessments.clubId, clubId), eq(assessments.id, id)));
      return row ?? null;
    },

    /** Locks the assessment row until the transaction ends: one submission or photo swap at a time. */
    async lockAssessment(id: string) {
      const [row] = await db
        .select({ id: assessments.id, athleteId: assessments.athleteId, status: assessments.status })
        .from(assessments)
        .where(and(eq(assessments.clubId, clubId), eq(assessments.id, id)))
        .for('update');
      return row ?? null;
    },

    /**
     * Saves the draft only if nobody saved since `expectedVersion` (optimistic locking in one
     * statement). A submitted assessment goes back to in progress until it is submitted again.
     */
    async saveDraft(id: string, expectedVersion: number, draft: AssessmentDraft) {
      const [row] = await db
        .update(assessments)
        .set({ draft, draftVersion: sql`${assessments.draftVersion} + 1`, status: 'in_progress' })
        .where(and(eq(assessments.clubId, clubId), eq(assessments.id, id), eq(assessments.draftVersion, expectedVersion)))
        .returning({ draftVersion: assessments.draftVersion, status: assessments.status });
      return row ?? null;
    },

    async currentDraft(id: string) {
      const [row] = await db
        .select({ draft: assessments.draft, draftVersion: assessments.draftVersion, status: assessments.status })
        .from(assessments)
        .where(and(eq(assessments.clubId, clubId), eq(assessments.id, id)));
      return row ?? null;
    },

    /** Closes (a date) or reopens (null) the round; returns false for an unknown round. */
    async setRoundClosed(id: string, closedAt: Date | null) {
      const rows = await db
        .update(rounds)
        .set({ closedAt, closedBy: closedAt ? scope.userId : null })
        .where(and(eq(rounds.clubId, clubId), eq(rounds.id, id)))
        .returning({ id: rounds.id });
      return rows.length > 0;
    },

    /** When the assessment's round was closed, or null while it is open (or unknown). */
    /** The assessment's round: whether it is closed, and its day (a screen keeps its round's date). */
    /** The assessment's round, and whether its athlete takes part in screening (consent in force). */
    async roundOf(assessmentId: string): Promise<{ closedAt: Date | null; screenedOn: string; screeningConsent: boolean; athleteName: string } | null> {
      const [row] = await db
        .select({
          closedAt: rounds.closedAt,
          screenedOn: rounds.screenedOn,
          screeningConsent: screeningConsentSql,
          athleteName: sql<string>`${athletes.firstName} || ' ' || ${athletes.lastName}`,
        })
        .from(assessments)
        .innerJoin(rounds, eq(rounds.id, assessments.roundId))
        .innerJoin(athletes, eq(athletes.id, assessments.athleteId))
        .where(and(eq(assessments.clubId, clubId), eq(assessments.id, assessmentId)));
      return row ?? null;
    },

    /**
     * Whether a physiotherapist has cleared the athlete since this screen was first submitted: the
     * decision in force is "train as normal" or "train with changes" and was set after the first result
     * version. Pain reported at this screen then no longer holds back loaded work when it is submitted again.
     */
    async painClearedSinceFirstResult(assessmentId: string, athleteId: string): Promise<boolean> {
      const [first] = await db
        .select({ at: sql<Date>`min(${assessmentResults.createdAt})` })
        .from(assessmentResults)
        .where(and(eq(assessmentResults.clubId, clubId), eq(assessmentResults.assessmentId, assessmentId)));
      if (!first?.at) return false;
      const [latest] = await db
        .select({ status: clearances.status, createdAt: clearances.createdAt })
        .from(clearances)
        .where(and(eq(clearances.clubId, clubId), eq(clearances.athleteId, athleteId)))
        .orderBy(desc(clearances.createdAt), desc(clearances.id))
        .limit(1);
      return !!latest && latest.status !== 'referred' && latest.createdAt.getTime() >= new Date(first.at).getTime();
    },

    async markSubmitted(id: string, at: Date) {
      await db
        .update(assessments)
        .set({ status: 'submitted', submittedAt: at, submittedBy: scope.userId })
        .where(and(eq(assessments.clubId, clubId), eq(assessments.id, id)));
    },

    async photoConsent(athleteId: string) {
      const [row] = await db
        .select({ granted: photoConsentSql })
        .from(athletes)
        .where(and(eq(athletes.clubId, clubId), eq(athletes.id, athleteId)));
      return row?.granted ?? false;
    },

    /** The photos in use: the newest of each task and view. */
    currentPhotos(assessmentId: string) {
      return db
        .select()
        .from(photos)
        .where(and(eq(photos.clubId, clubId), eq(photos.assessmentId, assessmentId), isNull(photos.replacedAt)))
        .orderBy(asc(photos.createdAt));
    },

    async photo(id: string) {
      const [row] = await db
        .select()
        .from(photos)
        .where(and(eq(photos.clubId, clubId), eq(photos.id, id)));
      return row ?? null;
    },

    /** Adds the photo and retires the one it replaces (same task and view). */
    async addPhoto(values: Omit<typeof photos.$inferInsert, 'clubId' | 'uploadedBy'> & { id: string }, at: Date) {
      await db
        .update(photos)
        .set({ replacedAt: at })
        .where(
          and(
            eq(photos.clubId, clubId),
            eq(photos.assessmentId, values.assessmentId),
            eq(photos.taskId, values.taskId),
            eq(photos.view, values.view),
            isNull(photos.replacedAt),
          ),
        );
      const [row] = await db
        .insert(photos)
        .values({ ...values, clubId, uploadedBy: scope.userId, createdAt: at })
        .returning();
      return row!;
    },

    async currentResult(assessmentId: string) {
      const [row] = await db
        .select({ ...resultColumns, input: assessmentResults.input })
        .from(assessmentResults)
        .leftJoin(users, eq(users.id, assessmentResults.createdBy))
        .where(and(eq(assessmentResults.clubId, clubId), eq(assessmentResults.assessmentId, assessmentId), eq(assessmentResults.isCurrent, true)));
      return row ?? null;
    },

    /** Versions other than `exceptId`, newest first. */
    earlierResults(assessmentId: string, exceptId: string) {
      return db
        .select({
          id: assessmentResults.id,
          version: assessmentResults.version,
          engineVersion: assessmentResults.engineVersion,
          createdAt: assessmentResults.createdAt,
          reason: assessmentResults.reason,
        })
        .from(assessmentResults)
        .where(and(eq(assessmentResults.clubId, clubId), eq(assessmentResults.assessmentId, assessmentId), ne(assessmentResults.id, exceptId)))
        .orderBy(desc(assessmentResults.version));
    },

    /** Every adjustment of a result, newest first: the plan's history. */
    adjustments(resultId: string) {
      return db
        .select({
          exercises: planAdjustments.exercises,
          note: planAdjustments.note,
          overrides: planAdjustments.overrides,
          createdAt: planAdjustments.createdAt,
          createdByName: users.displayName,
        })
        .from(planAdjustments)
        .innerJoin(assessmentResults, eq(assessmentResults.id, planAdjustments.resultId))
        .leftJoin(users, eq(users.id, planAdjustments.createdBy))
        .where(and(eq(assessmentResults.clubId, clubId), eq(planAdjustments.resultId, resultId)))
        .orderBy(desc(planAdjustments.createdAt), desc(planAdjustments.id));
    },

    /** The newest adjustment made on another version of this assessment's result (or none). */
    async earlierAdjustment(assessmentId: string, exceptResultId: string) {
      const [row] = await db
        .select({ version: assessmentResults.version, createdAt: planAdjustments.createdAt, createdByName: users.displayName })
        .from(planAdjustments)
        .innerJoin(assessmentResults, eq(assessmentResults.id, planAdjustments.resultId))
        .leftJoin(users, eq(users.id, planAdjustments.createdBy))
        .where(and(eq(assessmentResults.clubId, clubId), eq(assessmentResults.assessmentId, assessmentId), ne(planAdjustments.resultId, exceptResultId)))
        .orderBy(desc(planAdjustments.createdAt), desc(planAdjustments.id))
        .limit(1);
      return row ?? null;
    },

    /** Adds a result version and makes it the only current one. Call inside a transaction holding the assessment lock. */
    async addResult(
      values: { assessmentId: string; athleteId: string; engineVersion: string; input: AssessmentInput; result: AssessmentResult; reason?: string | null },
      at: Date,
    ) {
      await db
        .update(assessmentResults)
        .set({ isCurrent: false })
        .where(and(eq(assessmentResults.clubId, clubId), eq(assessmentResults.assessmentId, values.assessmentId), eq(assessmentResults.isCurrent, true)));
      const [max] = await db
        .select({ version: sql<number>`coalesce(max(${assessmentResults.version}), 0)::int` })
        .from(assessmentResults)
        .where(and(eq(assessmentResults.clubId, clubId), eq(assessmentResults.assessmentId, values.assessmentId)));
      const [row] = await db
        .insert(assessmentResults)
        .values({ ...values, clubId, version: (max?.version ?? 0) + 1, isCurrent: true, createdBy: scope.userId, createdAt: at })
        .returning({ id: assessmentResults.id });
      return row!.id;
    },

    async addPlanAdjustment(resultId: string, exercises: PlannedExercise[], note: string, overrides: PlanOverrideView[]) {
      await db.insert(planAdjustments).values({ resultId, exercises, note, overrides, createdBy: scope.userId });
    },

    athleteAssessments(athleteId: string) {
      return db
        .select({
          assessmentId: assessments.id,
          roundId: rounds.id,
          roundName: rounds.name,
          screenedOn: rounds.screenedOn,
          status: assessments.status,
          submittedAt: assessments.submittedAt,
          resultId: assessmentResults.id,
          resultVersion: assessmentResults.version,
          engineVersion: assessmentResults.engineVersion,
          result: assessmentResults.result,
        })
        .from(assessments)
        .innerJoin(rounds, eq(rounds.id, assessments.roundId))
        .leftJoin(assessmentResults, and(eq(assessmentResults.assessmentId, assessments.id), eq(assessmentResults.isCurrent, true)))
        .where(and(eq(assessments.clubId, clubId), eq(assessments.athleteId, athleteId)))
        .orderBy(desc(rounds.screenedOn), desc(rounds.createdAt), desc(assessments.createdAt));
    },
  };
}

export type ScreeningRepo = ReturnType<typeof screeningRepo>;
export type AssessmentRow = NonNullable<Awaited<ReturnType<ScreeningRepo['assessment']>>>;
export type RoundRow = NonNullable<Awaited<ReturnType<ScreeningRepo['round']>>>;
export type StatusCounts = Record<AssessmentStatus, number>;
