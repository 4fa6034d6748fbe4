import { and, asc, eq, gt, inArray, isNull, ne } from 'drizzle-orm';
import type { Db } from '@/db/client';
import { athletes, clubs, guardianLinks, invitationAthletes, invitations, memberships, passwordResets, sessions, users, type Role } from '@/db/schema';
import type { Outbox } from '@/server/mail/outbox';
import { AppError, badRequest, conflict, notFound, tooManyRequests, unauthorized } from '@/server/http/errors';
import { type Auth, newToken, sessionIdFromToken } from './lucia';
import { hashPassword, verifyDecoy, verifyPassword } from './password';
import { DEFAULT_AUTH_LIMITS, keyPart, rateLimiter, type AuthLimits } from './rate-limits';

export const INVITATION_TTL_MS = 7 * 24 * 3600 * 1000;
export const RESET_TTL_MS = 60 * 60 * 1000;
const WRONG_SIGN_IN = 'That e-mail and password do not match an account. Check both and try again.';
const BAD_LINK = 'This link is not valid any more: it was used already or has expired. Ask for a new one.';
const TOO_MANY = 'Too many attempts. Wait a few minutes, then try again.';

export type AuthDeps = { db: Db; auth: Auth; outbox: Outbox; limits?: AuthLimits };

/** A row's token hash until the link is rendered at send time: the hash of a token nobody ever sees. */
const placeholderHash = () => sessionIdFromToken(newToken());

export function createAuthService({ db, auth, outbox, limits = DEFAULT_AUTH_LIMITS }: AuthDeps) {
  const limiter = rateLimiter(db);
  /** Creates a session and returns the cookie token (the database keeps only its hash). */
  async function startSession(userId: string): Promise<string> {
    const token = newToken();
    await auth.createSession(userId, {}, { sessionId: await sessionIdFromToken(token) });
    return token;
  }

  /**
   * Failed attempts count per account (from any address) and per address. Unknown e-mails count the
   * same way and verify against a decoy hash, so neither the answer nor its timing tells whether an
   * account exists. `previousSessionId`: the session this browser had, ended (the id rotates).
   */
  async function signIn(email: string, password: string, context: { address: string; previousSessionId?: string; signal?: AbortSignal }) {
    const accountKey = `sign-in:account:${keyPart(email)}`;
    const addressKey = `sign-in:address:${keyPart(context.address)}`;
    if ((await limiter.over(accountKey, limits.signInPerAccount)) || (await limiter.over(addressKey, limits.signInPerAddress))) {
      throw tooManyRequests(TOO_MANY);
    }
    const [user] = await db.select().from(users).where(eq(users.email, email));
    const ok = user?.passwordHash ? await verifyPassword(user.passwordHash, password, context.signal) : (await verifyDecoy(password, context.signal), false);
    if (!ok || !user) {
      await limiter.hit(accountKey, limits.signInPerAccount);
      await limiter.hit(addressKey, limits.signInPerAddress);
      throw unauthorized(WRONG_SIGN_IN);
    }
    if (context.previousSessionId) await auth.invalidateSession(context.previousSessionId);
    return { user, token: await startSession(user.id) };
  }

  async function signOut(sessionId: string) {
    await auth.invalidateSession(sessionId);
  }

  /** The children an invitation links, by name (first name first), in name order. */
  async function invitedChildren(invitationId: string): Promise<{ id: string; name: string }[]> {
    const rows = await db
      .select({ id: athletes.id, firstName: athletes.firstName, lastName: athletes.lastName })
      .from(invitationAthletes)
      .innerJoin(athletes, eq(athletes.id, invitationAthletes.athleteId))
      .where(eq(invitationAthletes.invitationId, invitationId))
      .orderBy(asc(athletes.firstName), asc(athletes.lastName));
    return rows.map((r) => ({ id: r.id, name: `${r.firstName} ${r.lastName}` }));
  }

  /** Counts a request for a link-bearing route from one address (reset, invitation acceptance). */
  async function limitAddress(address: string) {
    if (await limiter.hit(`links:address:${keyPart(address)}`, limits.linksPerAddress)) throw tooManyRequests(TOO_MANY);
  }

  /** Changes the password of a signed-in person: every other session ends, this one gets a new id. */
  async function changePassword(userId: string, currentSessionId: string, input: { currentPassword: string; newPassword: string }) {
    const key = `password-change:account:${userId}`;
    if (await limiter.over(key, limits.signInPerAccount)) throw tooManyRequests(TOO_MANY);
    const [user] = await db.select().from(users).where(eq(users.id, userId));
    if (!user?.passwordHash || !(await verifyPassword(user.passwordHash, input.currentPassword))) {
      await limiter.hit(key, limits.signInPerAccount);
      throw badRequest('Some fields need attention.', { currentPassword: 'This is not your current password.' });
    }
    const passwordHash = await hashPassword(input.newPassword);
    await db.transaction(async (tx) => {
      await tx.update(users).set({ passwordHash }).where(eq(users.id, userId));
      await tx.delete(sessions).where(and(eq(sessions.userId, userId), ne(sessions.id, currentSessionId)));
    });
    await auth.invalidateSession(currentSessionId);
    return { token: await startSession(userId) };
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
    const tokenHash = await placeholderHash();
    const row = await db.transaction(async (tx) => {
      // One open invitation per address and club: a new one (another role, other children) replaces
      // those sent before, whose links stop working.
      const now = new Date();
      await tx
        .update(invitations)
        .set({ expiresAt: now })
        .where(and(eq(invitations.clubId, input.clubId), eq(invitations.email, input.email), isNull(invitations.acceptedAt), gt(invitations.expiresAt, now)));
      const [created] = await tx
        .insert(invitations)
        .values({
          tokenHash,
          clubId: input.clubId,
          email: input.email,
          role: input.role,
          invitedBy: input.invitedBy,
          expiresAt: new Date(Date.now() + INVITATION_TTL_MS),
        })
        .returning({ id: invitations.id });
      if (children.length > 0) await tx.insert(invitationAthletes).values(children.map((c) => ({ invitationId: created!.id, athleteId: c.id })));
      return created!;
    });
    // The link is made when the mail is sent (server/auth/link-mail.ts, which names the children): the queue holds no token.
    await outbox.enqueue({ template: 'invitation', id: row.id });
    return { id: row.id, children: children.map((c) => ({ id: c.id, name: `${c.firstName} ${c.lastName}` })) };
  }

  async function findOpenInvitation(token: string) {
    const [row] = await db
      .select({ invitation: invitations, clubName: clubs.name })
      .from(invitations)
      .innerJoin(clubs, eq(clubs.id, invitations.clubId))
      .where(and(eq(invitations.tokenHash, await sessionIdFromToken(token)), isNull(invitations.acceptedAt), gt(invitations.expiresAt, new Date())));
    if (!row) throw new AppError(404, 'link_expired', BAD_LINK);
    return row;
  }

  async function describeInvitation(token: string) {
    const { invitation, clubName } = await findOpenInvitation(token);
    const [user] = await db.select({ hasPassword: users.passwordHash }).from(users).where(eq(users.email, invitation.email));
    const children = (await invitedChildren(invitation.id)).map((c) => c.name);
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
      await tx.insert(memberships).values({ userId: id, clubId: invitation.clubId, role: invitation.role }).onConflictDoNothing();
      if (invitation.role === 'parent') {
        const children = await tx
          .select({ athleteId: invitationAthletes.athleteId })
          .from(invitationAthletes)
          .where(eq(invitationAthletes.invitationId, invitation.id));
        if (children.length > 0) {
          await tx
            .insert(guardianLinks)
            .values(children.map((c) => ({ athleteId: c.athleteId, userId: id })))
            .onConflictDoNothing();
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

  /**
   * Every request counts against the e-mail's cooldown and the address's limit, whether or not the
   * e-mail has an account, so a 429 says nothing about accounts either. The router answers before
   * `send` runs: the response time does not depend on the account existing.
   */
  async function requestPasswordReset(email: string, address: string) {
    await limitAddress(address);
    if (await limiter.hit(`reset:email:${keyPart(email)}`, limits.resetPerEmail)) throw tooManyRequests(TOO_MANY);
    return {
      async send() {
        const [user] = await db.select().from(users).where(eq(users.email, email));
        if (!user?.passwordHash) return;
        const [row] = await db
          .insert(passwordResets)
          .values({ tokenHash: await placeholderHash(), userId: user.id, expiresAt: new Date(Date.now() + RESET_TTL_MS) })
          .returning({ id: passwordResets.id });
        await outbox.enqueue({ template: 'password-reset', id: row!.id });
      },
    };
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
      await tx
        .update(users)
        .set({ passwordHash: await hashPassword(password) })
        .where(eq(users.id, reset.userId));
      // A new password signs every other device out.
      await tx.delete(sessions).where(eq(sessions.userId, reset.userId));
    });
  }

  return {
    signIn,
    signOut,
    changePassword,
    limitAddress,
    invite,
    invitedChildren,
    describeInvitation,
    acceptInvitation,
    requestPasswordReset,
    resetPassword,
  };
}

export type AuthService = ReturnType<typeof createAuthService>;
