import { and, asc, desc, eq, isNull, sql, type SQL } from 'drizzle-orm';
import { assessments, athletes, photos, rounds, squads } from '@/db/schema';
import type { AssessmentDraft } from '@/features/screening/contract';
import type { ClubScope } from '@/server/access/scope';
import { photoConsentSql, screeningConsentSql, type Executor } from '@/server/screening/screening.repo';

/** Every query filters by the scope's club; measuring is staff-only, so no parent athlete list here. */
export function measuringRepo(db: Executor, scope: ClubScope) {
  const clubId = scope.clubId;
  return {
    /**
     * The photos in use (not replaced) of athletes whose photo consent stands, with their assessment's
     * draft so the caller can count the points placed. Newest round first.
     */
    currentPhotos(filter: { roundId?: string; squadId?: string } = {}) {
      const where: (SQL | undefined)[] = [
        eq(photos.clubId, clubId),
        isNull(photos.replacedAt),
        sql`${photoConsentSql} = true`,
        // Nothing is measured for an athlete who does not take part (any more).
        sql`${screeningConsentSql} = true`,
        filter.roundId ? eq(rounds.id, filter.roundId) : undefined,
        filter.squadId ? eq(rounds.squadId, filter.squadId) : undefined,
      ];
      return db
        .select({
          photo: photos,
          assessmentId: assessments.id,
          status: assessments.status,
          draft: assessments.draft,
          athleteId: athletes.id,
          firstName: athletes.firstName,
          lastName: athletes.lastName,
          racketHand: athletes.racketHand,
          roundId: rounds.id,
          roundName: rounds.name,
          screenedOn: rounds.screenedOn,
          squadName: squads.name,
        })
        .from(photos)
        .innerJoin(assessments, eq(assessments.id, photos.assessmentId))
        .innerJoin(athletes, eq(athletes.id, assessments.athleteId))
        .innerJoin(rounds, eq(rounds.id, assessments.roundId))
        .innerJoin(squads, eq(squads.id, rounds.squadId))
        .where(and(...where))
        .orderBy(desc(rounds.screenedOn), desc(rounds.createdAt), asc(athletes.lastName), asc(athletes.firstName), asc(photos.createdAt));
    },

    /** The photo with its assessment, consent and draft; lock the assessment first when writing. */
    async photoWithAssessment(photoId: string) {
      const [row] = await db
        .select({
          photo: photos,
          assessmentId: assessments.id,
          status: assessments.status,
          draft: assessments.draft,
          photoConsent: photoConsentSql,
          screeningConsent: screeningConsentSql,
          athleteName: sql<string>`${athletes.firstName} || ' ' || ${athletes.lastName}`,
        })
        .from(photos)
        .innerJoin(assessments, eq(assessments.id, photos.assessmentId))
        .innerJoin(athletes, eq(athletes.id, assessments.athleteId))
        .where(and(eq(photos.clubId, clubId), eq(photos.id, photoId)));
      return row ?? null;
    },

    /**
     * Writes the draft and bumps its version without touching the status: a submitted assessment stays
     * submitted (its result is worked out again by the caller). A phone still holding the older version
     * gets a 409 on its next save and merges, as for any other save.
     */
    async writeDraft(assessmentId: string, draft: AssessmentDraft) {
      const [row] = await db
        .update(assessments)
        .set({ draft, draftVersion: sql`${assessments.draftVersion} + 1` })
        .where(and(eq(assessments.clubId, clubId), eq(assessments.id, assessmentId)))
        .returning({ draftVersion: assessments.draftVersion, status: assessments.status });
      return row!;
    },
  };
}
