import { createHash, randomBytes } from 'node:crypto';
import { and, eq, isNull } from 'drizzle-orm';
import type { Db } from '@/db/client';
import { athletes, consents, summaryEmails } from '@/db/schema';
import { buildFamilySummary } from '@/features/care/family-summary';
import { strengthBlock } from '@/features/care/strength-block';
import type { FamilyComparison, FamilySummary, FamilyView, ReleasePreview } from '@/features/care/types';
import { todayIso } from '@/features/athletes/age';
import { compareScreens } from '@/features/progress/compare';
import { addDays } from '@/features/progress/trends';
import { familySummary } from '@/features/progress/wording';
import { progressRepo } from '@/server/progress/progress.repo';
import { getTask, type AssessmentResult, type TaskId } from '@/features/screening/engine';
import type { ClubScope } from '@/server/access/scope';
import { AppError, conflict, notFound } from '@/server/http/errors';
import type { MailRef, Outbox } from '@/server/mail/outbox';
import { screeningRepo, type Executor } from '@/server/screening/screening.repo';
import { athletesRepo } from '@/server/athletes/athletes.repo';
import { recordAudit } from './audit.repo';
import { clearanceRepo } from './clearance.repo';
import { notesService } from './notes.service';
import { reviewsRepo } from './reviews.repo';
import { careSettingsOf } from './settings.repo';
import { renderSummaryEmail } from './summary-email';
import { familyNoteCount, summaryRepo, type Recipient } from './summary.repo';

export type SummaryDeps = { db: Db; outbox: Outbox; publicUrl: string };

export const hashToken = (token: string) => createHash('sha256').update(token).digest('hex');

/** Where a parent reads a child's summary in the app, and where the unsubscribe link and header point. */
export const familyUrl = (publicUrl: string, athleteId: string) => `${publicUrl}/family/${athleteId}`;
export const unsubscribePageUrl = (publicUrl: string, token: string) => `${publicUrl}/unsubscribe?token=${token}`;
export const oneClickUrl = (publicUrl: string, token: string) => `${publicUrl}/api/unsubscribe/${token}`;

/** The summary as it would be released now: the current result, the plan as changed by staff, the clearance in force. */
export async function currentSummary(db: Executor, scope: ClubScope, assessmentId: string) {
  const s = screeningRepo(db, scope);
  const a = await s.assessment(assessmentId);
  if (!a) throw notFound('The assessment');
  const reviews = reviewsRepo(db, scope);
  const state = await reviews.state(assessmentId);
  const current = await s.currentResult(assessmentId);
  if (!state || !current) throw conflict('This screen has not been submitted yet: there is no summary to release.');
  // One after another: `db` may be a transaction, whose one connection runs one query at a time.
  const [adjustment] = await s.adjustments(current.id).limit(1);
  const clearance = await clearanceRepo(db, scope).current(a.athleteId);
  const clubName = await reviews.clubName();
  const taskIds = await reviews.screenedTaskIds(current.id);
  const summary: FamilySummary = buildFamilySummary({
    firstName: a.firstName,
    clubName,
    screenedOn: a.screenedOn,
    result: current.result,
    exercises: adjustment?.exercises ?? current.result.plan.exercises,
    taskIds,
    block: strengthBlock(current.result.plan, clearance, current.createdAt.toISOString()),
    clearance,
    contactName: state.review?.byName ?? null,
    painTaskIds: Object.entries(current.input.tasks)
      .filter(([, t]) => t?.painReported === true)
      .map(([id]) => id),
  });
  return { a, state, current, summary };
}

/** Parents who get the e-mail, and those who do not with the reason. */
async function recipientsOf(db: Executor, scope: ClubScope, athleteId: string) {
  const { guardians, emailConsent } = await summaryRepo(db, scope).guardians(athleteId);
  return emailConsent
    ? { recipients: guardians, skipped: [] as { displayName: string; reason: string }[] }
    : {
        recipients: [] as Recipient[],
        skipped: guardians.map((g) => ({ displayName: g.displayName, reason: 'No e-mail consent recorded for this athlete.' })),
      };
}

/**
 * Releases the reviewed screen's family summary and queues one e-mail per parent with e-mail consent.
 * The release, the e-mail records and the audit rows are written in one transaction; the e-mails are
 * handed to the queue after it commits (the queue retries sends until they go through).
 */
export async function releaseSummary(
  deps: SummaryDeps,
  scope: ClubScope,
  assessmentId: string,
  /** `notify: false` releases without e-mails (the demo seed's history). */
  options: { releasedBy: string | null; at?: Date; notify?: boolean },
) {
  const { db, outbox, publicUrl } = deps;
  const mails: MailRef[] = [];
  const release = await db.transaction(async (tx) => {
    const locked = await screeningRepo(tx, scope).lockAssessment(assessmentId);
    if (!locked) throw notFound('The assessment');
    const { a, state, current, summary } = await currentSummary(tx, scope, assessmentId);
    if (!state.review) throw new AppError(409, 'not_reviewed', 'A physiotherapist has to mark this screen reviewed before its summary goes to the family.');
    if (state.release) throw new AppError(409, 'already_released', "This screen's summary was already released to the family.");
    const repo = summaryRepo(tx, scope);
    const row = await repo.addRelease({ assessmentId, athleteId: a.athleteId, resultId: current.id, releasedBy: options.releasedBy, summary, at: options.at });
    const audit = [
      {
        clubId: scope.clubId,
        actorId: options.releasedBy,
        action: 'release',
        subjectKind: 'assessment' as const,
        subjectId: assessmentId,
        athleteId: a.athleteId,
        detail: { releaseId: row.id, automatic: options.releasedBy === null },
      },
    ];
    const { recipients } = options.notify === false ? { recipients: [] as Recipient[] } : await recipientsOf(tx, scope, a.athleteId);
    for (const r of recipients) {
      // A placeholder hash until the e-mail is rendered at send time (server/care/summary-mail.ts): the
      // unsubscribe token is drawn then, so neither the queue nor the database ever holds it.
      const emailId = await repo.addEmail({
        releaseId: row.id,
        athleteId: a.athleteId,
        userId: r.userId,
        email: r.email,
        tokenHash: hashToken(randomBytes(24).toString('base64url')),
      });
      const rendered = await renderSummaryEmail({
        summary,
        viewUrl: familyUrl(publicUrl, a.athleteId),
        unsubscribeUrl: `${publicUrl}/unsubscribe`,
        recipientName: r.displayName,
      });
      mails.push({ template: 'family-summary', id: emailId });
      audit.push({
        clubId: scope.clubId,
        actorId: options.releasedBy,
        action: 'email.queued',
        subjectKind: 'email' as never,
        subjectId: emailId,
        athleteId: a.athleteId,
        detail: { to: r.email, subject: rendered.subject, releaseId: row.id } as never,
      });
    }
    await recordAudit(tx, ...audit);
    return { id: row.id, releasedAt: row.createdAt.toISOString(), recipients: recipients.length };
  });
  for (const mail of mails) await outbox.enqueue(mail);
  return release;
}

export function summaryService(deps: SummaryDeps, scope: ClubScope) {
  const { db, publicUrl } = deps;
  return {
    async preview(assessmentId: string): Promise<ReleasePreview> {
      const { a, summary } = await currentSummary(db, scope, assessmentId);
      const { recipients, skipped } = await recipientsOf(db, scope, a.athleteId);
      // The preview shows the first recipient's greeting; the links are placeholders that do nothing.
      const rendered = await renderSummaryEmail({
        summary,
        viewUrl: familyUrl(publicUrl, a.athleteId),
        unsubscribeUrl: `${publicUrl}/unsubscribe?token=preview`,
        recipientName: recipients[0]?.displayName ?? 'parent or guardian',
        familyNotes: await familyNoteCount(db, a.athleteId),
      });
      return { ...rendered, recipients: recipients.map((r) => ({ displayName: r.displayName, email: r.email })), skipped };
    },

    release(assessmentId: string) {
      return releaseSummary(deps, scope, assessmentId, { releasedBy: scope.userId });
    },

    async familyView(athleteId: string): Promise<FamilyView> {
      const s = screeningRepo(db, scope);
      const repo = summaryRepo(db, scope);
      const [releases, releasedScreens, notes, settings, photoConsent] = await Promise.all([
        repo.releases(athleteId),
        repo.lastTwoReleasedScreens(athleteId),
        notesService(db, scope).list(athleteId, 'family'),
        careSettingsOf(db, scope.clubId),
        s.photoConsent(athleteId),
      ]);
      const [athlete, consents] = await Promise.all([athleteName(db, scope, athleteId), athletesRepo(db, scope).get(athleteId)]);
      const latest = releases[0] ?? null;
      const photosAllowed = settings.familyPhotos && photoConsent === true;
      const photos =
        latest && photosAllowed
          ? (await repo.currentPhotos(latest.assessmentId)).map((p) => ({
              id: p.id,
              url: `/api/family-photos/${p.id}?size=full`,
              thumbUrl: `/api/family-photos/${p.id}?size=thumb`,
              taskTitle: safeTaskTitle(p.taskId),
            }))
          : [];
      await recordAudit(db, {
        clubId: scope.clubId,
        actorId: scope.userId,
        action: 'view',
        subjectKind: 'athlete',
        subjectId: athleteId,
        athleteId,
        detail: { what: 'family summary' },
      });
      const [laterScreen, earlierScreen] = releasedScreens;
      const progress = progressRepo(db, scope);
      const [sessions, sessionsSinceLatest] = await Promise.all([
        laterScreen && earlierScreen ? progress.sessionsBetween(athleteId, earlierScreen.screenedOn, laterScreen.screenedOn) : null,
        // Up to and including today: the bound is the day after.
        latest ? progress.sessionsBetween(athleteId, latest.summary.screenedOn, addDays(todayIso(), 1)) : null,
      ]);
      return {
        athlete,
        takingPart: consents?.consents.screening ?? null,
        latest,
        comparison: familyComparison(releasedScreens, sessions),
        sessionsSinceLatest,
        earlier: releases.slice(1),
        notes,
        photos,
        photosAllowed,
        clubSharesPhotos: settings.familyPhotos,
      };
    },
  };
}

/**
 * The last two screens released to the family, compared by the same engine comparison the staff see
 * (`compareScreens`) and put in family wording (`familySummary`): only released screens, so a parent never
 * learns of a screen the care team has not reviewed and sent. Where the coaches record who took part in
 * each session, it also says how many the child took part in between the two.
 */
function familyComparison(
  screens: { assessmentId: string; screenedOn: string; taskIds: string[]; result: AssessmentResult }[],
  sessions: { attended: number; held: number } | null,
): FamilyComparison | null {
  const [later, earlier] = screens;
  if (!later || !earlier) return null;
  const asScreen = (s: (typeof screens)[number]) => ({
    assessmentId: s.assessmentId,
    screenedOn: s.screenedOn,
    tasksDone: s.taskIds as TaskId[],
    result: s.result,
  });
  return {
    earlierScreenedOn: earlier.screenedOn,
    laterScreenedOn: later.screenedOn,
    lines: familySummary(compareScreens(asScreen(earlier), asScreen(later)), sessions),
  };
}

function safeTaskTitle(id: string) {
  try {
    return getTask(id as TaskId).title;
  } catch {
    return id;
  }
}

async function athleteName(db: Db, scope: ClubScope, athleteId: string) {
  const [row] = await db
    .select({ id: athletes.id, firstName: athletes.firstName, lastName: athletes.lastName })
    .from(athletes)
    .where(and(eq(athletes.clubId, scope.clubId), eq(athletes.id, athleteId)));
  if (!row) throw notFound('The athlete');
  return row;
}

/**
 * The unsubscribe link (and the one-click header) records the parent's choice as a withdrawn e-mail
 * consent for that child, recorded by the parent, like any consent decision.
 */
export async function unsubscribe(db: Db, token: string): Promise<{ athleteFirstName: string; already: boolean }> {
  return db.transaction(async (tx) => {
    const [row] = await tx
      .select({
        id: summaryEmails.id,
        clubId: summaryEmails.clubId,
        athleteId: summaryEmails.athleteId,
        userId: summaryEmails.userId,
        unsubscribedAt: summaryEmails.unsubscribedAt,
        firstName: athletes.firstName,
      })
      .from(summaryEmails)
      .innerJoin(athletes, eq(athletes.id, summaryEmails.athleteId))
      .where(eq(summaryEmails.unsubscribeTokenHash, hashToken(token)))
      .for('update', { of: summaryEmails });
    if (!row) throw notFound('This unsubscribe link');
    if (row.unsubscribedAt) return { athleteFirstName: row.firstName, already: true };
    const now = new Date();
    await tx
      .update(summaryEmails)
      .set({ unsubscribedAt: now })
      .where(and(eq(summaryEmails.id, row.id), isNull(summaryEmails.unsubscribedAt)));
    const [consent] = await tx
      .insert(consents)
      .values({ athleteId: row.athleteId, kind: 'email_summaries', granted: false, decidedOn: now.toISOString().slice(0, 10), recordedBy: row.userId })
      .returning({ id: consents.id });
    await recordAudit(tx, {
      clubId: row.clubId,
      actorId: row.userId,
      action: 'withdraw',
      subjectKind: 'consent',
      subjectId: consent!.id,
      athleteId: row.athleteId,
      detail: { kind: 'email_summaries', via: 'unsubscribe link' },
    });
    return { athleteFirstName: row.firstName, already: false };
  });
}
