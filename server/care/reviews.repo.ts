import { and, asc, desc, eq, isNull, sql } from 'drizzle-orm';
import { assessmentResults, assessmentReviews, assessments, athletes, clubs, rounds, squads, summaryReleases, users } from '@/db/schema';
import type { ClubScope } from '@/server/access/scope';
import type { Executor } from '@/server/screening/screening.repo';

/** Submitted screens of the scope's club with their current result, review and release. */
export function reviewsRepo(db: Executor, scope: ClubScope) {
  const reviewedAt = sql<Date | null>`(select max(${assessmentReviews.createdAt}) from ${assessmentReviews} where ${assessmentReviews.resultId} = ${assessmentResults.id})`;
  const releasedAt = sql<Date | null>`(select max(${summaryReleases.createdAt}) from ${summaryReleases} where ${summaryReleases.resultId} = ${assessmentResults.id})`;
  return {
    /**
     * Each athlete's newest submitted screen whose current result is not yet released (reviewed or not),
     * or whose plan still waits for a clearance (released or not), of athletes still on the roster. An
     * older screen superseded by a newer one leaves the list.
     */
    async openScreens() {
      const rows = await db
        .select({
          assessmentId: assessments.id,
          athleteId: athletes.id,
          firstName: athletes.firstName,
          lastName: athletes.lastName,
          squadName: squads.name,
          roundName: rounds.name,
          screenedOn: rounds.screenedOn,
          submittedAt: assessments.submittedAt,
          resultId: assessmentResults.id,
          input: assessmentResults.input,
          result: assessmentResults.result,
          resultCreatedAt: assessmentResults.createdAt,
          reviewedAt,
          releasedAt,
        })
        .from(assessments)
        .innerJoin(athletes, eq(athletes.id, assessments.athleteId))
        .innerJoin(rounds, eq(rounds.id, assessments.roundId))
        .leftJoin(squads, eq(squads.id, athletes.squadId))
        .innerJoin(assessmentResults, and(eq(assessmentResults.assessmentId, assessments.id), eq(assessmentResults.isCurrent, true)))
        .where(and(eq(assessments.clubId, scope.clubId), eq(assessments.status, 'submitted'), isNull(athletes.archivedAt)))
        .orderBy(asc(assessments.submittedAt));
      const newest = new Map<string, (typeof rows)[number]>();
      for (const r of rows) {
        const seen = newest.get(r.athleteId);
        if (!seen || r.screenedOn >= seen.screenedOn) newest.set(r.athleteId, r);
      }
      return [...newest.values()].filter((r) => r.releasedAt === null || (r.result as { plan?: { status?: string } }).plan?.status === 'clearance-needed');
    },

    /** Review and release state of the current result of one assessment. */
    async state(assessmentId: string) {
      const [row] = await db
        .select({ resultId: assessmentResults.id, resultCreatedAt: assessmentResults.createdAt })
        .from(assessmentResults)
        .where(and(eq(assessmentResults.clubId, scope.clubId), eq(assessmentResults.assessmentId, assessmentId), eq(assessmentResults.isCurrent, true)));
      if (!row) return null;
      const [review] = await db
        .select({ at: assessmentReviews.createdAt, byName: users.displayName, byId: assessmentReviews.reviewedBy })
        .from(assessmentReviews)
        .leftJoin(users, eq(users.id, assessmentReviews.reviewedBy))
        .where(eq(assessmentReviews.resultId, row.resultId))
        .orderBy(desc(assessmentReviews.createdAt))
        .limit(1);
      const [release] = await db
        .select({ at: summaryReleases.createdAt, byName: users.displayName })
        .from(summaryReleases)
        .leftJoin(users, eq(users.id, summaryReleases.releasedBy))
        .where(eq(summaryReleases.resultId, row.resultId))
        .orderBy(desc(summaryReleases.createdAt))
        .limit(1);
      return { resultId: row.resultId, resultCreatedAt: row.resultCreatedAt, review: review ?? null, release: release ?? null };
    },

    /** The tasks screened in a result (those the tester recorded, skipped ones excluded by the draft conversion). */
    async screenedTaskIds(resultId: string): Promise<string[]> {
      const [row] = await db
        .select({ input: assessmentResults.input })
        .from(assessmentResults)
        .where(and(eq(assessmentResults.clubId, scope.clubId), eq(assessmentResults.id, resultId)));
      return row ? Object.keys(row.input.tasks) : [];
    },

    async markReviewed(assessmentId: string, resultId: string) {
      const [row] = await db
        .insert(assessmentReviews)
        .values({ clubId: scope.clubId, assessmentId, resultId, reviewedBy: scope.userId })
        .returning({ id: assessmentReviews.id });
      return row!.id;
    },

    async clubName() {
      const [row] = await db.select({ name: clubs.name }).from(clubs).where(eq(clubs.id, scope.clubId));
      return row?.name ?? '';
    },
  };
}
