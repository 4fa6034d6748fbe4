import { and, eq, inArray } from 'drizzle-orm';
import { OWN_CHILDREN_ONLY } from '@/features/access/permissions';
import type { Request, RequestHandler } from 'express';
import type { Db } from '@/db/client';
import { clubs, guardianLinks, memberships, type Role } from '@/db/schema';
import { badRequest, forbidden, unauthorized } from '@/server/http/errors';
import { isUuid } from '@/server/http/ids';

export type MembershipView = { clubId: string; clubName: string; role: Role };

/**
 * What the caller may reach in one club. Repositories are built from a scope, so every query they run
 * filters by the club and, for a parent, by the athletes linked to them.
 */
export type ClubScope = {
  userId: string;
  clubId: string;
  role: Role;
  /** null: every athlete of the club; otherwise only these (parents). */
  athleteIds: string[] | null;
};

/** Deny by default: mounted before the routes that need a signed-in caller (their guards check again). */
export const requireSignedIn: RequestHandler = (req, _res, next) => {
  next(req.user ? undefined : unauthorized());
};

export function signedInUserId(req: Request): string {
  if (!req.user) throw unauthorized();
  return req.user.id;
}

export async function membershipsOf(db: Db, userId: string): Promise<MembershipView[]> {
  return db
    .select({ clubId: memberships.clubId, clubName: clubs.name, role: memberships.role })
    .from(memberships)
    .innerJoin(clubs, eq(clubs.id, memberships.clubId))
    .where(eq(memberships.userId, userId))
    .orderBy(clubs.name);
}

/**
 * The signed-in caller's clubs and roles, ordered by club name. Read with the session by the session
 * middleware (`req.access`, this request's own reading, never kept across requests); asked from the
 * database only where no session middleware ran.
 */
export async function callerMemberships(db: Db, req: Request): Promise<MembershipView[]> {
  const userId = signedInUserId(req);
  return req.access ? req.access.memberships : membershipsOf(db, userId);
}

/** The caller's scope in `clubId`, or 403 when they are not a member with one of `roles`. */
export async function scopeForClub(db: Db, req: Request, clubId: string, roles: readonly Role[]): Promise<ClubScope> {
  const userId = signedInUserId(req);
  const access = req.access;
  const [membership] = access
    ? access.memberships.filter((m) => m.clubId === clubId)
    : await db
        .select({ role: memberships.role })
        .from(memberships)
        .where(and(eq(memberships.userId, userId), eq(memberships.clubId, clubId)));
  if (!membership || !roles.includes(membership.role)) throw forbidden();
  let athleteIds: string[] | null = null;
  if (OWN_CHILDREN_ONLY.includes(membership.role)) {
    athleteIds = access
      ? [...access.athleteIds]
      : (await db.select({ athleteId: guardianLinks.athleteId }).from(guardianLinks).where(eq(guardianLinks.userId, userId))).map((l) => l.athleteId);
  }
  return { userId, clubId, role: membership.role, athleteIds };
}

/**
 * For routes without a club in the path: the club named by the `X-Club-Id` header, or the caller's
 * only club. A person in several clubs must say which one.
 */
export async function scopeForCallerClub(db: Db, req: Request, roles: readonly Role[]): Promise<ClubScope> {
  signedInUserId(req); // 401 for a signed-out caller before anything about the header
  const header = req.get('x-club-id');
  if (header !== undefined && header !== '') {
    if (!isUuid(header.trim())) {
      throw badRequest('The X-Club-Id header does not name a club.', {
        'X-Club-Id': 'Must be a club id (a UUID such as 0f8fad5b-d9cb-469f-a165-70867728950e).',
      });
    }
    return scopeForClub(db, req, header.trim(), roles);
  }
  const mine = await callerMemberships(db, req);
  if (mine.length === 0) throw forbidden('You are not a member of any club.');
  if (mine.length > 1) throw badRequest('You belong to several clubs: choose one (X-Club-Id header).');
  return scopeForClub(db, req, mine[0]!.clubId, roles);
}

/** Restricts a query on athletes to the scope's athletes (parents); a no-op for club staff. */
export function athleteFilter<T>(scope: ClubScope, column: T) {
  if (scope.athleteIds === null) return undefined;
  // An empty list must match nothing, not everything.
  return inArray(column as never, scope.athleteIds.length > 0 ? scope.athleteIds : ['00000000-0000-0000-0000-000000000000']);
}
