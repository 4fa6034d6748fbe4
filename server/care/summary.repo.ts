import { and, asc, count, desc, eq, isNull, sql } from 'drizzle-orm';
import {
  assessmentResults,
  assessments,
  athletes,
  careNotes,
  consents,
  guardianLinks,
  memberships,
  photos,
  rounds,
  summaryEmails,
  summaryReleases,
  users,
} from '@/db/schema';
import type { FamilySummary, SummaryRelease } from '@/features/care/types';
import type { ClubScope } from '@/server/access/scope';
import type { Executor } from '@/server/screening/screening.repo';

export type Recipient = { userId: string; displayName: string; email: string };

/** Whether the athlete's newest e-mail consent decision is a yes (none recorded: no). Read at release and again at send time. */
export async function emailConsentInForce(db: Executor, athleteId: string): Promise<boolean> {
  const [consent] = await db
    .select({ granted: consents.granted })
    .from(consents)
    .where(and(eq(consents.athleteId, athleteId), eq(consents.kind, 'email_summaries')))
    .orderBy(desc(consents.createdAt), desc(consents.id))
    .limit(1);
  return consent?.granted === true;
}

export function summaryRepo(db: Executor, scope: ClubScope) {
  return {
    /** Parents of the club linked to the athlete, with whether the family's e-mail consent is in force. */
    async guardians(athleteId: string): Promise<{ guardians: Recipient[]; emailConsent: boolean }> {
      const guardians = await db
        .select({ userId: users.id, displayName: users.displayName, email: users.email })
        .from(guardianLinks)
        .innerJoin(users, eq(users.id, guardianLinks.userId))
        .innerJoin(athletes, eq(athletes.id, guardianLinks.athleteId))
        .innerJoin(memberships, and(eq(memberships.userId, users.id), eq(memberships.clubId, athletes.clubId), eq(memberships.role, 'parent')))
        .where(and(eq(athletes.clubId, scope.clubId), eq(guardianLinks.athleteId, athleteId)))
        .orderBy(asc(users.displayName));
      return { guardians, emailConsent: await emailConsentInForce(db, athleteId) };
    },

    async addRelease(values: { assessmentId: string; athleteId: string; resultId: string; releasedBy: string | null; summary: FamilySummary; at?: Date }) {
      const [row] = await db
        .insert(summaryReleases)
        .values({
          clubId: scope.clubId,
          assessmentId: values.assessmentId,
          athleteId: values.athleteId,
          resultId: values.resultId,
          releasedBy: values.releasedBy,
          summary: values.summary,
          ...(values.at ? { createdAt: values.at } : {}),
        })
        .returning({ id: summaryReleases.id, createdAt: summaryReleases.createdAt });
      return row!;
    },

    async addEmail(values: { releaseId: string; athleteId: string; userId: string; email: string; tokenHash: string }) {
      const [row] = await db
        .insert(summaryEmails)
        .values({
          clubId: scope.clubId,
          releaseId: values.releaseId,
          athleteId: values.athleteId,
          userId: values.userId,
          email: values.email,
          unsubscribeTokenHash: values.tokenHash,
        })
        .returning({ id: summaryEmails.id });
      return row!.id;
    },

    async releases(athleteId: string): Promise<SummaryRelease[]> {
      const rows = await db
        .select({ id: summaryReleases.id, assessmentId: summaryReleases.assessmentId, createdAt: summaryReleases.createdAt, summary: summaryReleases.summary })
        .from(summaryReleases)
        .where(and(eq(summaryReleases.clubId, scope.clubId), eq(summaryReleases.athleteId, athleteId)))
        .orderBy(desc(summaryReleases.createdAt), desc(summaryReleases.id));
      return rows.map((r) => ({ id: r.id, assessmentId: r.assessmentId, releasedAt: r.createdAt.toISOString(), summary: r.summary as FamilySummary }));
    },

    /**
     * The two latest screens (by screening date) released to the family, with the result version that was
     * released and the tasks done: what the family comparison compares. Newest first.
     */
    lastTwoReleasedScreens(athleteId: string) {
      return db
        .selectDistinctOn([rounds.screenedOn, summaryReleases.assessmentId], {
          assessmentId: summaryReleases.assessmentId,
          screenedOn: rounds.screenedOn,
          taskIds: sql<string[]>`(select coalesce(array_agg(k), '{}') from jsonb_object_keys(coalesce(${assessmentResults.input} -> 'tasks', '{}')) k)`,
          result: assessmentResults.result,
        })
        .from(summaryReleases)
        .innerJoin(assessmentResults, eq(assessmentResults.id, summaryReleases.resultId))
        .innerJoin(assessments, eq(assessments.id, summaryReleases.assessmentId))
        .innerJoin(rounds, eq(rounds.id, assessments.roundId))
        .where(and(eq(summaryReleases.clubId, scope.clubId), eq(summaryReleases.athleteId, athleteId)))
        .orderBy(desc(rounds.screenedOn), desc(summaryReleases.assessmentId), desc(summaryReleases.createdAt))
        .limit(2);
    },

    async currentPhotos(assessmentId: string) {
      return db
        .select({ id: photos.id, taskId: photos.taskId })
        .from(photos)
        .where(and(eq(photos.clubId, scope.clubId), eq(photos.assessmentId, assessmentId), isNull(photos.replacedAt)))
        .orderBy(asc(photos.taskId), asc(photos.view));
    },
  };
}

/** How many notes the care team shares with the child's family (the e-mail says there are some). */
export async function familyNoteCount(db: Executor, athleteId: string): Promise<number> {
  const [row] = await db
    .select({ n: count() })
    .from(careNotes)
    .where(and(eq(careNotes.athleteId, athleteId), eq(careNotes.visibility, 'family')));
  return row?.n ?? 0;
}
