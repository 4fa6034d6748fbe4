import { and, asc, eq, gt, inArray, isNull } from 'drizzle-orm';
import type { Db } from '@/db/client';
import { athletes, clubs, guardianLinks, invitationAthletes, invitations, memberships, passwordResets, sessions, users, type Role } from '@/db/schema';
import type { Outbox } from '@/server/mail/outbox';
import { AppError, badRequest, conflict, notFound, unauthorized } from '@/server/http/errors';
import { type Auth, newToken, sessionIdFromToken } from './lucia';
import { hashPassword, verifyDecoy, verifyPassword } from './password';

/** "Maya", "Maya and Theo", "Maya, Theo and Ava". */
function listNames(names: string[]): string {
  if (names.length <= 1) return names[0] ?? '';
  return `${names.slice(0, -1).join(', ')} and ${names[names.length - 1]}`;
}

export const INVITATION_TTL_MS = 7 * 24 * 3600 * 1000;
export const RESET_TTL_MS = 60 * 60 * 1000;
const WRONG_SIGN_IN = 'That e-mail and password do not match an account. Check both and try again.';
const BAD_LINK = 'This link is not valid any more: it was used already or has expired. Ask for a new one.';

export type AuthDeps = { db: Db; auth: Auth; outbox: Outbox; publicUrl: string };

export function createAuthService({ db, auth, outbox, publicUrl }: AuthDeps) {
  /** Creates a session and returns the cookie token (the database keeps only its hash). */
  async function startSession(userId: string): Promise<string> {
    const token = newToken();
    await auth.createSession(userId, {}, { sessionId: await sessionIdFromToken(token) });
    return token;
  }

  async function signIn(email: string, password: string) {
    const [user] = await db.select().from(users).where(eq(users.email, email));
    if (!user?.passwordHash) {
      await verifyDecoy(password);
      throw unauthorized(WRONG_SIGN_IN);
    }
    if (!(await verifyPassword(user.passwordHash, password))) throw unauthorized(WRONG_SIGN_IN);
    return { user, token: await startSession(user.id) };
  }

  async function signOut(sessionId: string) {
    await auth.invalidateSession(sessionId);
  }

  /** The children an invitation links, by name (first name first), in name order. */
  async function invitedChildren(tokenHash: string): Promise<{ id: string; name: string }[]> {
    const rows = await db
      .select({ id: athletes.id, firstName: athletes.firstName, lastName: athletes.lastName })
      .from(invitationAthletes)
      .innerJoin(athletes, eq(athletes.id, invitationAthletes.athleteId))
      .where(eq(invitationAthletes.tokenHash, tokenHash))
      .orderBy(asc(athletes.firstName), asc(athletes.lastName));
    return rows.map((r) => ({ id: r.id, name: `${r.firstName} ${r.lastName}` }));
  }

  async function invite(input: { clubId: string; email: string; role: Role; invitedBy: string; athleteIds?: string[] }) {
    const [club] = await db.select().from(clubs).where(eq(clubs.id, input.clubId));
    if (!club) throw notFound('The club');
    const athleteIds = [...new Set(input.athleteIds ?? [])];
    if (athleteIds.length > 0 && input.role !== 'parent') {
      throw badRequest('Some fields need attention.', { athleteIds: 'Only a parent or guardian is linked to children.' });
    }
    const children =
      athleteIds.length === 0
        ? []
        : await db
            .select({ id: athletes.id, firstName: athletes.firstName, lastName: athletes.lastName })
            .from(athletes)
            .where(and(eq(athletes.clubId, input.clubId), inArray(athletes.id, athleteIds), isNull(athletes.archivedAt)))
            .orderBy(asc(athletes.firstName));
    if (children.length !== athleteIds.length) {
      throw badRequest('Some fields need attention.', { athleteIds: 'Choose children who are on the club’s roster.' });
    }
    const [existing] = await db
      .select({ role: memberships.role })
      .from(memberships)
      .innerJoin(users, eq(users.id, memberships.userId))
      .where(and(eq(users.email, input.email), eq(memberships.clubId, input.clubId)));
    if (existing) throw conflict('This person is already a member of the club.');
    const token = newToken();
    const tokenHash = await sessionIdFromToken(token);
    await db.transaction(async (tx) => {
      await tx.insert(invitations).values({
        tokenHash,
        clubId: input.clubId,
        email: input.email,
        role: input.role,
        invitedBy: input.invitedBy,
        expiresAt: new Date(Date.now() + INVITATION_TTL_MS),
      });
      if (children.length > 0) await tx.insert(invitationAthletes).values(children.map((c) => ({ tokenHash, athleteId: c.id })));
    });
    const link = `${publicUrl}/accept-invite?token=${encodeURIComponent(token)}`;
    const names = listNames(children.map((c) => `${c.firstName} ${c.lastName}`));
    await outbox.enqueue({
      to: input.email,
      subject: children.length > 0 ? `Follow ${names} at ${club.name} on Squadline` : `You are invited to ${club.name} on Squadline`,
      text:
        (children.length > 0
          ? `Hello,\n\n${club.name} invites you to follow ${names} on Squadline: what they do in screening and training, and why.\n\n`
          : `Hello,\n\nYou have been invited to join ${club.name} on Squadline.\n\n`) +
        `Open this link to choose your password (it works once, for 7 days):\n${link}\n\n` +
        `If you did not expect this e-mail, you can ignore it.\n`,
    });
    return { link };
  }

  async function findOpenInvitation(token: string) {
    const [row] = await db
      .select({ invitation: invitations, clubName: clubs.name })
      .from(invitations)
      .innerJoin(clubs, eq(clubs.id, invitations.clubId))
      .where(
        and(
          eq(invitations.tokenHash, await sessionIdFromToken(token)),
          isNull(invitations.acceptedAt),
          gt(invitations.expiresAt, new Date()),
        ),
      );
    if (!row) throw new AppError(404, 'link_expired', BAD_LINK);
    return row;
  }

  async function describeInvitation(token: string) {
    const { invitation, clubName } = await findOpenInvitation(token);
    const [user] = await db.select({ hasPassword: users.passwordHash }).from(users).where(eq(users.email, invitation.email));
    const children = (await invitedChildren(invitation.tokenHash)).map((c) => c.name);
    return { email: invitation.email, role: invitation.role, clubName, hasAccount: Boolean(user?.hasPassword), children };
  }

  async function acceptInvitation(input: { token: string; displayName: string; password: string }) {
    const { invitation } = await findOpenInvitation(input.token);
    const userId = await db.transaction(async (tx) => {
      const [existing] = await tx.select().from(users).where(eq(users.email, invitation.email));
      let id: string;
      if (existing?.passwordHash) {
        // An existing account confirms with its own password; it is not replaced.
        if (!(await verifyPassword(existing.passwordHash, input.password))) {
          throw badRequest('You already have a Squadline account: enter its password.', {
            password: 'Enter the password of your existing account.',
          });
        }
        id = existing.id;
      } else if (existing) {
        await tx
          .update(users)
          .set({ passwordHash: await hashPassword(input.password), displayName: input.displayName })
          .where(eq(users.id, existing.id));
        id = existing.id;
      } else {
        const [created] = await tx
          .insert(users)
          .values({ email: invitation.email, displayName: input.displayName, passwordHash: await hashPassword(input.password) })
          .returning({ id: users.id });
        id = created!.id;
      }
      await tx
        .insert(memberships)
        .values({ userId: id, clubId: invitation.clubId, role: invitation.role })
        .onConflictDoNothing();
      if (invitation.role === 'parent') {
        const children = await tx
          .select({ athleteId: invitationAthletes.athleteId })
          .from(invitationAthletes)
          .where(eq(invitationAthletes.tokenHash, invitation.tokenHash));
        if (children.length > 0) {
          await tx.insert(guardianLinks).values(children.map((c) => ({ athleteId: c.athleteId, userId: id }))).onConflictDoNothing();
        }
      }
      const accepted = await tx
        .update(invitations)
        .set({ acceptedAt: new Date() })
        .where(and(eq(invitations.tokenHash, invitation.tokenHash), isNull(invitations.acceptedAt)))
        .returning({ tokenHash: invitations.tokenHash });
      if (accepted.length === 0) throw new AppError(404, 'link_expired', BAD_LINK);
      return id;
    });
    return { token: await startSession(userId) };
  }

  /** Always looks the same to the caller, whether or not the e-mail has an account. */
  async function requestPasswordReset(email: string) {
    const [user] = await db.select().from(users).where(eq(users.email, email));
    if (!user?.passwordHash) return;
    const token = newToken();
    await db.insert(passwordResets).values({
      tokenHash: await sessionIdFromToken(token),
      userId: user.id,
      expiresAt: new Date(Date.now() + RESET_TTL_MS),
    });
    const link = `${publicUrl}/reset-password?token=${encodeURIComponent(token)}`;
    await outbox.enqueue({
      to: user.email,
      subject: 'Reset your Squadline password',
      text:
        `Hello ${user.displayName},\n\nSomeone asked to reset the password of your Squadline account.\n` +
        `Open this link within an hour to choose a new one (it works once):\n${link}\n\n` +
        `If it was not you, ignore this e-mail: your password stays as it is.\n`,
    });
  }

  async function resetPassword(token: string, password: string) {
    const tokenHash = await sessionIdFromToken(token);
    await db.transaction(async (tx) => {
      const [reset] = await tx
        .update(passwordResets)
        .set({ usedAt: new Date() })
        .where(and(eq(passwordResets.tokenHash, tokenHash), isNull(passwordResets.usedAt), gt(passwordResets.expiresAt, new Date())))
        .returning();
      if (!reset) throw new AppError(404, 'link_expired', BAD_LINK);
      await tx.update(users).set({ passwordHash: await hashPassword(password) }).where(eq(users.id, reset.userId));
      // A new password signs every other device out.
      await tx.delete(sessions).where(eq(sessions.userId, reset.userId));
    });
  }

  return { signIn, signOut, invite, invitedChildren, describeInvitation, acceptInvitation, requestPasswordReset, resetPassword };
}

export type AuthService = ReturnType<typeof createAuthService>;
