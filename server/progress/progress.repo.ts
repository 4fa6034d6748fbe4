import { and, asc, desc, eq, isNull, sql } from 'drizzle-orm';
import type { PgColumn } from 'drizzle-orm/pg-core';
import { assessmentResults, assessments, athletes, rounds, squads } from '@/db/schema';
import type { ClubScope } from '@/server/access/scope';
import type { Executor } from '@/server/screening/screening.repo';

/**
 * The care team's clearance, when the athletes table has one (it is being added alongside this feature).
 * Read from the schema at start-up so the trends table shows it as soon as the column exists.
 */
const clearanceColumn = (athletes as unknown as Record<string, PgColumn | undefined>).clearance;

/**
 * Reads for progress and trends. Every query filters by the scope's club. Trends read the small generated
 * columns of `assessment_results` (flag ids and sides, knee angles, maturity band, re-screen date) and
 * never the full result; one athlete's history reads the full results (a handful of rows).
 */
export function progressRepo(db: Executor, scope: ClubScope) {
  const clubId = scope.clubId;
  const current = and(eq(assessmentResults.assessmentId, assessments.id), eq(assessmentResults.isCurrent, true));

  return {
    async athlete(id: string) {
      const [row] = await db
        .select({ id: athletes.id, sex: athletes.sex, dateOfBirth: athletes.dateOfBirth, firstName: athletes.firstName })
        .from(athletes)
        .where(and(eq(athletes.id, id), eq(athletes.clubId, clubId)));
      return row ?? null;
    },

    /** Every submitted screen of one athlete with its current result, oldest first. */
    history(athleteId: string) {
      return db
        .select({
          assessmentId: assessments.id,
          roundId: rounds.id,
          roundName: rounds.name,
          screenedOn: rounds.screenedOn,
          input: assessmentResults.input,
          result: assessmentResults.result,
        })
        .from(assessments)
        .innerJoin(rounds, eq(rounds.id, assessments.roundId))
        .innerJoin(assessmentResults, current)
        .where(and(eq(assessments.athleteId, athleteId), eq(assessments.clubId, clubId), eq(assessments.status, 'submitted')))
        .orderBy(asc(rounds.screenedOn), asc(assessmentResults.createdAt));
    },

    async squad(id: string) {
      const [row] = await db
        .select({ id: squads.id, name: squads.name })
        .from(squads)
        .where(and(eq(squads.id, id), eq(squads.clubId, clubId)));
      return row ?? null;
    },

    squadRounds(squadId: string) {
      return db
        .select({ id: rounds.id, name: rounds.name, screenedOn: rounds.screenedOn })
        .from(rounds)
        .where(and(eq(rounds.squadId, squadId), eq(rounds.clubId, clubId)))
        .orderBy(asc(rounds.screenedOn), asc(rounds.createdAt));
    },

    /** The current result summary of every submitted screen in the squad's rounds. */
    squadResults(squadId: string) {
      // rounds -> assessments as a join (not `round_id in (...)`): the planner then walks the partial
      // index of submitted screens per round instead of scanning every assessment of the club.
      return db
        .select({
          roundId: assessments.roundId,
          athleteId: assessments.athleteId,
          flagIds: assessmentResults.flagIds,
          fppaIds: assessmentResults.fppaIds,
          fppaValues: assessmentResults.fppaValues,
        })
        .from(rounds)
        .innerJoin(assessments, and(eq(assessments.roundId, rounds.id), eq(assessments.status, 'submitted')))
        .innerJoin(assessmentResults, current)
        .where(and(eq(rounds.squadId, squadId), eq(rounds.clubId, clubId)));
    },

    squadAthletes(squadId: string) {
      return db
        .select({
          id: athletes.id,
          firstName: athletes.firstName,
          lastName: athletes.lastName,
          sex: athletes.sex,
          dateOfBirth: athletes.dateOfBirth,
          clearance: clearanceColumn ? sql<unknown>`${clearanceColumn}` : sql<unknown>`null`,
        })
        .from(athletes)
        .where(and(eq(athletes.squadId, squadId), eq(athletes.clubId, clubId), isNull(athletes.archivedAt)))
        .orderBy(asc(athletes.lastName), asc(athletes.firstName));
    },

    /** Each current squad member's newest submitted screen, wherever it was (an athlete may have changed squad). */
    latestOfSquadAthletes(squadId: string) {
      return db
        .selectDistinctOn([assessments.athleteId], {
          athleteId: assessments.athleteId,
          assessmentId: assessments.id,
          screenedOn: rounds.screenedOn,
          flagIds: assessmentResults.flagIds,
          flagSides: assessmentResults.flagSides,
          maturityBand: assessmentResults.maturityBand,
          rescreenDate: assessmentResults.rescreenDate,
        })
        .from(athletes)
        .innerJoin(assessments, and(eq(assessments.athleteId, athletes.id), eq(assessments.status, 'submitted')))
        .innerJoin(rounds, eq(rounds.id, assessments.roundId))
        .innerJoin(assessmentResults, current)
        .where(and(eq(athletes.squadId, squadId), eq(athletes.clubId, clubId), isNull(athletes.archivedAt)))
        .orderBy(assessments.athleteId, desc(rounds.screenedOn), desc(assessmentResults.createdAt));
    },
  };
}

export type ProgressRepo = ReturnType<typeof progressRepo>;
