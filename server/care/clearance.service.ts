import { and, desc, eq, sql } from 'drizzle-orm';
import { assessmentResults, assessmentReviews, summaryReleases } from '@/db/schema';
import { CLEARANCE_LABELS, holdsWords, type ClearanceStatus } from '@/features/care/choices';
import type { ClearanceView } from '@/features/care/types';
import { EngineInputError } from '@/features/screening/engine';
import type { ClubScope } from '@/server/access/scope';
import { reevaluateAfterClearance } from '@/server/screening/screening.service';
import type { Executor } from '@/server/screening/screening.repo';
import { recordAudit, type AuditEntry } from './audit.repo';
import { clearanceRepo } from './clearance.repo';
import { currentSummary } from './summary.service';
import { summaryRepo } from './summary.repo';
import { formatDateInWords } from '@/features/ui/format-date';

/** The reason stored with a result version worked out again after a clearance: who, what and when. */
export function clearanceReason(clearance: NonNullable<ClearanceView>): string {
  const who = `${clearance.setByName ?? 'a physiotherapist'} set the clearance to “${CLEARANCE_LABELS[clearance.status]}” on ${formatDateInWords(clearance.setAt.slice(0, 10))}`;
  return clearance.status === 'referred'
    ? `Worked out again after ${who}: the pain reported at this screen holds back loaded strength and landing work again until a physiotherapist clears the athlete.`
    : clearance.status === 'modified' && (clearance.holds?.length ?? 0) > 0
      ? // The pain no longer holds the work by itself; what the decision holds still waits (said, not left to a
        // box further down to contradict).
        `Worked out again after ${who}: the physiotherapist's decision now sets what waits: ${holdsWords(clearance.holds!).toLowerCase()} on hold until a new clearance.`
      : `Worked out again after ${who}: the pain reported at this screen no longer holds back loaded strength and landing work.`;
}

/**
 * What a physiotherapist's clearance changes beyond its own row, inside the same transaction:
 * 1. "Train as normal" or "train with changes": every screen of the athlete whose current result still
 *    waits for a clearance (pain reported) is worked out again by the engine with the pain cleared, as a
 *    new result version with the reason; earlier versions stay. A review mark of the version it replaces
 *    is carried to the new one (the decision is the physiotherapist's own, the screen is the same).
 *    "Refer on" after such a clearance goes the other way: each screen worked out with the pain cleared
 *    is worked out again with it not cleared, so its plan waits for a clearance once more and says so
 *    (our choice: the decision in force is the latest one).
 * 2. The family's newest released summary is released again, without e-mail, when the decision changes
 *    what it says (exercises back or on hold, who decided and when), so the family view follows the
 *    clearance; the earlier summary stays among the earlier ones.
 */
export async function applyClearance(tx: Executor, scope: ClubScope, athleteId: string, clearanceId: string, status: ClearanceStatus) {
  const clearance = await clearanceRepo(tx, scope).current(athleteId);
  if (!clearance) return;
  const audit: AuditEntry[] = [];
  const replaced = new Map<string, string>();

  const painCleared = status !== 'referred';
  {
    const waiting = await tx
      .select({ assessmentId: assessmentResults.assessmentId })
      .from(assessmentResults)
      .where(
        and(
          eq(assessmentResults.clubId, scope.clubId),
          eq(assessmentResults.athleteId, athleteId),
          eq(assessmentResults.isCurrent, true),
          painCleared
            ? sql`${assessmentResults.result} #>> '{plan,status}' = 'clearance-needed'`
            : sql`${assessmentResults.input} #>> '{options,painCleared}' = 'true'`,
        ),
      );
    for (const { assessmentId } of waiting) {
      let made: Awaited<ReturnType<typeof reevaluateAfterClearance>>;
      try {
        made = await reevaluateAfterClearance(tx, scope, assessmentId, { reason: clearanceReason(clearance), painCleared });
      } catch (error) {
        // An input an older engine accepted and today's refuses: the clearance is still recorded, the
        // screen keeps its hold until it is submitted again, and the trail says why.
        if (!(error instanceof EngineInputError)) throw error;
        audit.push({
          clubId: scope.clubId,
          actorId: scope.userId,
          action: 'reevaluate.refused',
          subjectKind: 'assessment',
          subjectId: assessmentId,
          athleteId,
          detail: { clearanceId, field: error.field, reason: error.reason },
        });
        continue;
      }
      if (!made) continue;
      replaced.set(made.fromResultId, made.resultId);
      const [review] = await tx
        .select({ reviewedBy: assessmentReviews.reviewedBy })
        .from(assessmentReviews)
        .where(eq(assessmentReviews.resultId, made.fromResultId))
        .orderBy(desc(assessmentReviews.createdAt))
        .limit(1);
      if (review) await tx.insert(assessmentReviews).values({ clubId: scope.clubId, assessmentId, resultId: made.resultId, reviewedBy: review.reviewedBy });
      audit.push({
        clubId: scope.clubId,
        actorId: scope.userId,
        action: 'reevaluate',
        subjectKind: 'assessment',
        subjectId: assessmentId,
        athleteId,
        detail: { fromResultId: made.fromResultId, resultId: made.resultId, clearanceId, reviewCarried: !!review },
      });
    }
  }

  const [latest] = await tx
    .select({ id: summaryReleases.id, assessmentId: summaryReleases.assessmentId, resultId: summaryReleases.resultId, summary: summaryReleases.summary })
    .from(summaryReleases)
    .where(and(eq(summaryReleases.clubId, scope.clubId), eq(summaryReleases.athleteId, athleteId)))
    .orderBy(desc(summaryReleases.createdAt), desc(summaryReleases.id))
    .limit(1);
  if (latest) {
    const { current, summary } = await currentSummary(tx, scope, latest.assessmentId);
    // Only when the released result is still the one in force (or the version just made from it): a
    // newer submission waits for its own review and release.
    const sameScreen = current.id === latest.resultId || replaced.get(latest.resultId) === current.id;
    const before = latest.summary as typeof summary;
    const changed =
      JSON.stringify([before.exercises, before.pain ?? null, before.onHold, before.clearance ?? null]) !==
      JSON.stringify([summary.exercises, summary.pain, summary.onHold, summary.clearance]);
    if (sameScreen && changed) {
      const row = await summaryRepo(tx, scope).addRelease({
        assessmentId: latest.assessmentId,
        athleteId,
        resultId: current.id,
        releasedBy: scope.userId,
        summary,
      });
      audit.push({
        clubId: scope.clubId,
        actorId: scope.userId,
        action: 'release',
        subjectKind: 'assessment',
        subjectId: latest.assessmentId,
        athleteId,
        detail: { releaseId: row.id, update: 'clearance', clearanceId, replaces: latest.id, emailed: false },
      });
    }
  }
  await recordAudit(tx, ...audit);
}
