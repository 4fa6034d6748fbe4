import { and, asc, eq, gt, inArray, isNull } from 'drizzle-orm';
import type { Executor } from '@/server/screening/screening.repo';
import { athletes, guardianLinks, invitations, memberships, users, type Role } from '@/db/schema';
import type { ClubScope } from '@/server/access/scope';

/** The people of the scope's club: every query filters by `scope.clubId`. */
export function clubsRepo(db: Executor, scope: ClubScope) {
  return {
    async members() {
      const rows = await db
        .select({ userId: users.id, displayName: users.displayName, email: users.email, role: memberships.role })
        .from(memberships)
        .innerJoin(users, eq(users.id, memberships.userId))
        .where(eq(memberships.clubId, scope.clubId))
        .orderBy(asc(users.displayName));
      // The club's children each parent account is linked to (names), so two parents of the same name are told apart.
      const links = await db
        .select({ userId: guardianLinks.userId, firstName: athletes.firstName, lastName: athletes.lastName })
        .from(guardianLinks)
        .innerJoin(athletes, eq(athletes.id, guardianLinks.athleteId))
        .where(and(eq(athletes.clubId, scope.clubId), isNull(athletes.archivedAt)))
        .orderBy(asc(athletes.firstName), asc(athletes.lastName));
      return rows.map((m) => ({
        ...m,
        ...(m.role === 'parent' ? { children: links.filter((l) => l.userId === m.userId).map((l) => `${l.firstName} ${l.lastName}`) } : {}),
      }));
    },

    async member(userId: string) {
      const [row] = await db
        .select({ userId: users.id, displayName: users.displayName, email: users.email, role: memberships.role })
        .from(memberships)
        .innerJoin(users, eq(users.id, memberships.userId))
        .where(and(eq(memberships.clubId, scope.clubId), eq(memberships.userId, userId)));
      return row ?? null;
    },

    async setRole(userId: string, role: Role) {
      await db
        .update(memberships)
        .set({ role })
        .where(and(eq(memberships.clubId, scope.clubId), eq(memberships.userId, userId)));
    },

    /** The membership and, for a parent, their links to this club's children: nothing of the club stays reachable. */
    async remove(userId: string) {
      const children = db.select({ id: athletes.id }).from(athletes).where(eq(athletes.clubId, scope.clubId));
      await db.delete(guardianLinks).where(and(eq(guardianLinks.userId, userId), inArray(guardianLinks.athleteId, children)));
      await db.delete(memberships).where(and(eq(memberships.clubId, scope.clubId), eq(memberships.userId, userId)));
    },

    /** Ends an open invitation now (its link stops working); null when none is open with that id. */
    async cancelInvitation(id: string, now = new Date()) {
      const [row] = await db
        .update(invitations)
        .set({ expiresAt: now })
        .where(and(eq(invitations.id, id), eq(invitations.clubId, scope.clubId), isNull(invitations.acceptedAt), gt(invitations.expiresAt, now)))
        .returning({ email: invitations.email, role: invitations.role });
      return row ?? null;
    },

    pendingInvitations(now = new Date()) {
      return db
        .select({ id: invitations.id, email: invitations.email, role: invitations.role, expiresAt: invitations.expiresAt })
        .from(invitations)
        .where(and(eq(invitations.clubId, scope.clubId), isNull(invitations.acceptedAt), gt(invitations.expiresAt, now)))
        .orderBy(asc(invitations.email));
    },
  };
}
