import { and, asc, eq, gt, isNull } from 'drizzle-orm';
import type { Db } from '@/db/client';
import { athletes, clubs, invitationAthletes, invitations, passwordResets, users } from '@/db/schema';
import type { MailRef, OutgoingMail } from '@/server/mail/outbox';
import { ROLE_LABELS } from '@/features/access/permissions';
import { newToken, sessionIdFromToken } from './lucia';

const withArticle = (words: string) => `${/^[aeiou]/.test(words) ? 'an' : 'a'} ${words}`;

/** "Maya", "Maya and Theo", "Maya, Theo and Ava". */
export function listNames(names: string[]): string {
  if (names.length <= 1) return names[0] ?? '';
  return `${names.slice(0, -1).join(', ')} and ${names[names.length - 1]}`;
}

/**
 * Renders the e-mails that carry a single-use link, at send time. The queue holds only
 * `{ template, id }`; here a fresh token is drawn, its hash replaces the row's, and the link goes into
 * the message handed to SMTP. The token itself is never stored: not in the database, not in the queue.
 * A retried send draws a new token (the earlier one stops working). Null: the link was used or has
 * expired meanwhile, so nothing is sent. See server/mail/README.md.
 */
export function linkMail(db: Db, publicUrl: string) {
  async function invitation(id: string): Promise<OutgoingMail | null> {
    const token = newToken();
    const [row] = await db
      .update(invitations)
      .set({ tokenHash: await sessionIdFromToken(token) })
      .where(and(eq(invitations.id, id), isNull(invitations.acceptedAt), gt(invitations.expiresAt, new Date())))
      .returning({ email: invitations.email, clubId: invitations.clubId, role: invitations.role, invitedBy: invitations.invitedBy });
    if (!row) return null;
    const [club] = await db.select({ name: clubs.name }).from(clubs).where(eq(clubs.id, row.clubId));
    const name = club?.name ?? 'your club';
    // Who sends it and as what: two invitations to one address never read the same.
    const [inviter] = row.invitedBy ? await db.select({ name: users.displayName }).from(users).where(eq(users.id, row.invitedBy)) : [];
    const by = inviter?.name ?? 'An admin';
    // The children a parent's invitation links, named in the e-mail.
    const children = await db
      .select({ firstName: athletes.firstName, lastName: athletes.lastName })
      .from(invitationAthletes)
      .innerJoin(athletes, eq(athletes.id, invitationAthletes.athleteId))
      .where(eq(invitationAthletes.invitationId, id))
      .orderBy(asc(athletes.firstName), asc(athletes.lastName));
    const names = listNames(children.map((c) => `${c.firstName} ${c.lastName}`));
    const link = `${publicUrl}/accept-invite?token=${encodeURIComponent(token)}`;
    return {
      to: row.email,
      subject: children.length > 0 ? `Follow ${names} at ${name} on Squadline` : `You are invited to ${name} on Squadline`,
      text:
        (children.length > 0
          ? `Hello,\n\n${by} of ${name} invites you to follow ${names} on Squadline: what they do in screening and training, and why.\n\n`
          : `Hello,\n\n${by} has invited you to join ${name} on Squadline as ${withArticle(ROLE_LABELS[row.role].toLowerCase())}.\n\n`) +
        `Open this link to choose your password (it works once, for 7 days):\n${link}\n\n` +
        `If you did not expect this e-mail, you can ignore it.\n`,
      tag: { kind: 'invitation', clubId: row.clubId },
    };
  }

  async function passwordReset(id: string): Promise<OutgoingMail | null> {
    const token = newToken();
    const [row] = await db
      .update(passwordResets)
      .set({ tokenHash: await sessionIdFromToken(token) })
      .where(and(eq(passwordResets.id, id), isNull(passwordResets.usedAt), gt(passwordResets.expiresAt, new Date())))
      .returning({ userId: passwordResets.userId });
    if (!row) return null;
    const [user] = await db.select({ email: users.email, displayName: users.displayName }).from(users).where(eq(users.id, row.userId));
    if (!user) return null;
    const link = `${publicUrl}/reset-password?token=${encodeURIComponent(token)}`;
    return {
      to: user.email,
      subject: 'Reset your Squadline password',
      text:
        `Hello ${user.displayName},\n\nSomeone asked to reset the password of your Squadline account.\n` +
        `Open this link within an hour to choose a new one (it works once):\n${link}\n\n` +
        `If it was not you, ignore this e-mail: your password stays as it is.\n`,
      tag: { kind: 'password-reset', clubId: null },
    };
  }

  return async function render(ref: MailRef): Promise<OutgoingMail | null> {
    if (ref.template === 'family-summary') throw new Error('linkMail renders invitations and resets only (see server/mail/render.ts)');
    return ref.template === 'invitation' ? invitation(ref.id) : passwordReset(ref.id);
  };
}
