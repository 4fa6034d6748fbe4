import { groupFlags } from '@/features/screening/flag-groups';
import type { Db } from '@/db/client';
import type { AssessmentInput, AssessmentResult } from '@/features/screening/engine';
import { strengthBlock, type StrengthBlock } from '@/features/care/strength-block';
import type { ClearanceView, ReviewItem, ReviewState } from '@/features/care/types';
import type { ClubScope } from '@/server/access/scope';
import { conflict, notFound } from '@/server/http/errors';
import { screeningRepo } from '@/server/screening/screening.repo';
import { recordAudit } from './audit.repo';
import { clearanceRepo, latestClearances } from './clearance.repo';
import { reviewsRepo } from './reviews.repo';

export const painReported = (input: AssessmentInput) => Object.values(input.tasks).some((t) => t?.painReported === true);

/** Pain or "clearance needed" first, then more flags first, then the longest waiting. */
export function reviewOrder(a: ReviewItem, b: ReviewItem): number {
  const urgent = (i: ReviewItem) => (i.painReported || i.clearanceNeeded ? 1 : 0);
  return urgent(b) - urgent(a) || b.concernCount - a.concernCount || b.flagCount - a.flagCount || a.submittedAt.localeCompare(b.submittedAt);
}

export type AssessmentCare = ReviewState & { clearance: ClearanceView; block: StrengthBlock; athleteId: string };

export function reviewsService(db: Db, scope: ClubScope) {
  const repo = reviewsRepo(db, scope);
  return {
    async list(): Promise<{ reviews: ReviewItem[]; awaitingRelease: ReviewItem[] }> {
      const rows = await repo.openScreens();
      const clearance = await latestClearances(db, [...new Set(rows.map((r) => r.athleteId))]);
      const items: ReviewItem[] = rows.map((r) => {
        const result = r.result as AssessmentResult;
        // Counted as the result page shows them: one per pattern and side, whatever the tasks that showed it.
        const groups = groupFlags(result.flags);
        return {
          assessmentId: r.assessmentId,
          athleteId: r.athleteId,
          firstName: r.firstName,
          lastName: r.lastName,
          squadName: r.squadName,
          roundName: r.roundName,
          screenedOn: r.screenedOn,
          submittedAt: (r.submittedAt ?? r.resultCreatedAt).toISOString(),
          painReported: painReported(r.input as AssessmentInput),
          clearanceNeeded: result.plan.status === 'clearance-needed',
          flagCount: groups.length,
          concernCount: groups.filter((g) => g.severity === 'concern').length,
          clearance: clearance.get(r.athleteId) ?? null,
          reviewedAt: r.reviewedAt ? new Date(r.reviewedAt).toISOString() : null,
          releasedAt: r.releasedAt ? new Date(r.releasedAt).toISOString() : null,
        };
      });
      // A screen waiting for a physiotherapist's decision stays among those to review, and urgent, after it
      // is marked reviewed or released, until a clearance (or a referral) is recorded (our choice: marking
      // it reviewed had moved a child who reported pain under every screen with no flag, and releasing it
      // had taken it off the list).
      const waits = (i: ReviewItem) => i.clearanceNeeded && i.clearance?.status !== 'referred';
      return {
        reviews: items.filter((i) => waits(i) || (!i.reviewedAt && !i.releasedAt)).sort(reviewOrder),
        awaitingRelease: items.filter((i) => i.reviewedAt && !i.releasedAt && !waits(i)).sort(reviewOrder),
      };
    },

    async care(assessmentId: string): Promise<AssessmentCare> {
      const a = await screeningRepo(db, scope).assessment(assessmentId);
      if (!a) throw notFound('The assessment');
      const state = await repo.state(assessmentId);
      const clearance = await clearanceRepo(db, scope).current(a.athleteId);
      const current = state ? await screeningRepo(db, scope).currentResult(assessmentId) : null;
      const block: StrengthBlock = current ? strengthBlock(current.result.plan, clearance, current.createdAt.toISOString()) : { blocked: false };
      return {
        athleteId: a.athleteId,
        reviewedAt: state?.review?.at.toISOString() ?? null,
        reviewedByName: state?.review?.byName ?? null,
        releasedAt: state?.release?.at.toISOString() ?? null,
        releasedByName: state?.release?.byName ?? null,
        clearance,
        block,
      };
    },

    /** Marks the current result reviewed; a second mark of the same version changes nothing. */
    async markReviewed(assessmentId: string): Promise<AssessmentCare> {
      await db.transaction(async (tx) => {
        const s = screeningRepo(tx, scope);
        const locked = await s.lockAssessment(assessmentId);
        if (!locked) throw notFound('The assessment');
        const state = await reviewsRepo(tx, scope).state(assessmentId);
        if (!state) throw conflict('This screen has not been submitted yet: there is nothing to review.');
        if (state.review) return;
        const id = await reviewsRepo(tx, scope).markReviewed(assessmentId, state.resultId);
        await recordAudit(tx, {
          clubId: scope.clubId,
          actorId: scope.userId,
          action: 'review',
          subjectKind: 'assessment',
          subjectId: assessmentId,
          athleteId: locked.athleteId,
          detail: { reviewId: id, resultId: state.resultId },
        });
      });
      return this.care(assessmentId);
    },
  };
}
