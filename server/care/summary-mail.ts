import { randomBytes } from 'node:crypto';
import { and, eq, isNull } from 'drizzle-orm';
import type { Db } from '@/db/client';
import { summaryEmails, summaryReleases, users } from '@/db/schema';
import type { FamilySummary } from '@/features/care/types';
import type { OutgoingMail } from '@/server/mail/mailer';
import { renderSummaryEmail } from './summary-email';
import { emailConsentInForce, familyNoteCount } from './summary.repo';
import { familyUrl, hashToken, oneClickUrl, unsubscribePageUrl } from './summary.service';

/**
 * Renders a family-summary e-mail at send time from its `summary_emails` row. The queue holds only
 * `{ template: 'family-summary', id }`: the unsubscribe token is drawn here, its hash replaces the row's,
 * and the token goes only into the message handed to SMTP. A retried send draws a new token (the
 * earlier one stops working). Null, so nothing is sent: the parent unsubscribed meanwhile, or the e-mail
 * consent in force is no longer a yes (withdrawn in the app by a parent or recorded by staff while the
 * message waited, for example for a retry).
 */
export function summaryMail(db: Db, publicUrl: string) {
  return async function render(emailId: string): Promise<OutgoingMail | null> {
    const token = randomBytes(24).toString('base64url');
    const [row] = await db
      .update(summaryEmails)
      .set({ unsubscribeTokenHash: hashToken(token) })
      .where(and(eq(summaryEmails.id, emailId), isNull(summaryEmails.unsubscribedAt)))
      .returning({
        releaseId: summaryEmails.releaseId,
        athleteId: summaryEmails.athleteId,
        userId: summaryEmails.userId,
        email: summaryEmails.email,
        clubId: summaryEmails.clubId,
      });
    if (!row) return null;
    if (!(await emailConsentInForce(db, row.athleteId))) return null;
    const [release] = await db.select({ summary: summaryReleases.summary }).from(summaryReleases).where(eq(summaryReleases.id, row.releaseId));
    if (!release) return null;
    const [user] = row.userId ? await db.select({ displayName: users.displayName }).from(users).where(eq(users.id, row.userId)) : [];
    const familyNotes = await familyNoteCount(db, row.athleteId);
    const rendered = await renderSummaryEmail({
      summary: release.summary as FamilySummary,
      viewUrl: familyUrl(publicUrl, row.athleteId),
      unsubscribeUrl: unsubscribePageUrl(publicUrl, token),
      recipientName: user?.displayName ?? 'parent or guardian',
      familyNotes,
    });
    return {
      to: row.email,
      subject: rendered.subject,
      text: rendered.text,
      html: rendered.html,
      headers: { 'List-Unsubscribe': `<${oneClickUrl(publicUrl, token)}>`, 'List-Unsubscribe-Post': 'List-Unsubscribe=One-Click' },
      tag: { kind: 'family-summary', clubId: row.clubId },
    };
  };
}
