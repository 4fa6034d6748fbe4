import { and, asc, eq, gt, isNull } from 'drizzle-orm';
import type { Db } from '@/db/client';
import { invitations, memberships, users } from '@/db/schema';
import type { ClubScope } from '@/server/access/scope';

/** The people of the scope's club: every query filters by `scope.clubId`. */
export function clubsRepo(db: Db, scope: ClubScope) {
  return {
    members() {
      return db
        .select({ userId: users.id, displayName: users.displayName, email: users.email, role: memberships.role })
        .from(memberships)
        .innerJoin(users, eq(users.id, memberships.userId))
        .where(eq(memberships.clubId, scope.clubId))
        .orderBy(asc(users.displayName));
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
