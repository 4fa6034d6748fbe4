import type { Request, RequestHandler } from 'express';
import { preparedRows, type Db } from '@/db/client';
import type { Executor } from '@/server/screening/screening.repo';
import { OWN_CHILDREN_ONLY, rolesFor, type Action } from '@/features/access/permissions';
import { badRequest, forbidden, notFound, unauthorized } from '@/server/http/errors';
import { isUuid, requireUuid } from '@/server/http/ids';
import { callerMemberships, scopeForCallerClub, scopeForClub, type ClubScope } from './scope';

/**
 * The one way a route checks access: `guard(action, target)` runs before anything else (validation
 * included). It resolves the record the route touches to its club (and athlete), checks the caller's
 * role there against `PERMISSIONS`, limits parents to their own children, and leaves the caller's scope
 * in `res.locals.scope` for the service and its repositories.
 *
 * Answers: 401 signed out; 404 malformed or unknown id; 403 a club where the caller has no role holding
 * the action, or a parent reaching an athlete who is not theirs.
 */

/** Where a record lives: its club, and the athlete it belongs to when it belongs to one. */
export type RecordHome = { clubId: string; athleteId: string | null };
export type RecordResolver = (db: Executor, id: string) => Promise<RecordHome | null>;

const resolvers = new Map<string, { what: string; resolve: RecordResolver }>();

/**
 * Registers a kind of record a route can name in its path (`guard('x.read', on('note'))`). Each feature
 * registers its own kinds next to its router, so this file does not grow with every capability.
 */
export function registerRecord(kind: string, what: string, resolve: RecordResolver) {
  resolvers.set(kind, { what, resolve });
}

/** Where the record `id` of `kind` lives, or null when there is none. Throws for a kind nobody registered. */
export async function recordHome(db: Executor, kind: string, id: string): Promise<RecordHome | null> {
  const entry = resolvers.get(kind);
  if (!entry) throw new Error(`No resolver registered for record kind "${kind}".`);
  return entry.resolve(db, id);
}

/** The kinds of record registered so far (read by the route-table test). */
export const recordKinds = () => [...resolvers.keys()];

/**
 * A record's home by one prepared statement (`preparedRows`): every guarded request runs one of these,
 * so each is parsed and planned once per pooled connection and not rebuilt by the query builder.
 */
function homeBy(name: string, text: string): RecordResolver {
  return async (db, id) => (await preparedRows<RecordHome>(db, name, text, [id]))[0] ?? null;
}

registerRecord('athlete', 'The athlete', homeBy('guard_athlete_home', 'select club_id as "clubId", id as "athleteId" from athletes where id = $1'));
// A squad or a round belongs to the whole club, no single athlete.
registerRecord('squad', 'The squad', homeBy('guard_squad_home', 'select club_id as "clubId", null::uuid as "athleteId" from squads where id = $1'));
registerRecord('round', 'The round', homeBy('guard_round_home', 'select club_id as "clubId", null::uuid as "athleteId" from rounds where id = $1'));
registerRecord(
  'assessment',
  'The assessment',
  homeBy('guard_assessment_home', 'select club_id as "clubId", athlete_id as "athleteId" from assessments where id = $1'),
);
registerRecord(
  'photo',
  'The photo',
  homeBy(
    'guard_photo_home',
    'select p.club_id as "clubId", a.athlete_id as "athleteId" from photos p join assessments a on a.id = p.assessment_id where p.id = $1',
  ),
);

/** What a route touches: the caller's club (no record in the path), a club id, or a record. */
export type Target =
  | { kind: 'caller-club' }
  | { kind: 'club'; param: string }
  | { kind: 'record'; record: string; param: string; from: 'params' | 'body' }
  | { kind: 'signed-in' }
  | { kind: 'public' };

/** The caller's own club (X-Club-Id header, or their only club). */
export const callerClub: Target = { kind: 'caller-club' };
/** A club named by a path parameter. */
export const clubParam = (param = 'clubId'): Target => ({ kind: 'club', param });
/** A record named by a path parameter (default `:id`), or by a body field with `from: 'body'`. */
export const on = (record: string, param = 'id', from: 'params' | 'body' = 'params'): Target => ({ kind: 'record', record, param, from });

/** What the route-table test reads from each route's guard. */
export type AccessMeta = { action: Action | null; target: Target };
export type Guard = RequestHandler & { access: AccessMeta };

export type Locals = { scope: ClubScope; id?: string; home?: RecordHome };

/** The scope `guard()` left for the handler. */
export function scopeOf(res: { locals: object }): ClubScope {
  const scope = (res.locals as Partial<Locals>).scope;
  if (!scope) throw new Error('Route without guard(): no scope in res.locals.');
  return scope;
}

/** The id of the record `guard(action, on(kind))` resolved (already checked: a well-formed, existing id). */
export function recordIdOf(res: { locals: object }): string {
  const id = (res.locals as Partial<Locals>).id;
  if (!id) throw new Error('Route without guard(action, on(kind)): no record id in res.locals.');
  return id;
}

export function accessGuards(db: Db) {
  async function check(req: Request, action: Action, target: Target): Promise<Locals> {
    const roles = rolesFor(action);
    if (target.kind === 'caller-club') return { scope: await scopeForCallerClub(db, req, roles) };
    if (target.kind === 'club') {
      const clubId = requireUuid(String(req.params[target.param] ?? ''), 'The club');
      return { scope: await scopeForClub(db, req, clubId, roles) };
    }
    if (target.kind === 'public' || target.kind === 'signed-in') throw new Error(`${target.kind} targets are not checked here`);
    const entry = resolvers.get(target.record);
    if (!entry) throw new Error(`No resolver registered for record kind "${target.record}".`);
    const source = target.from === 'body' ? (req.body as Record<string, unknown> | undefined) : req.params;
    const raw = source?.[target.param];
    if (target.from === 'body' && !isUuid(raw)) {
      // A body field that is not an id: a field error, but only for a caller whose role may do this at
      // all in one of their clubs (anyone else learns nothing about the body).
      const mine = await callerMemberships(db, req);
      if (!mine.some((m) => roles.includes(m.role))) throw forbidden();
      throw badRequest(`${entry.what} is not named by a valid id.`, { [target.param]: 'Must be an id (a UUID).' });
    }
    const id = requireUuid(String(raw ?? ''), entry.what);
    const home = await entry.resolve(db, id);
    if (!home) throw notFound(entry.what);
    const scope = await scopeForClub(db, req, home.clubId, roles);
    // A parent reaches only records of their own children; a squad or a round belongs to no one child.
    if (OWN_CHILDREN_ONLY.includes(scope.role) && (!home.athleteId || !scope.athleteIds?.includes(home.athleteId))) {
      throw forbidden('You can only see the athletes linked to you.');
    }
    return { scope, id, home };
  }

  /** Checks `action` on `target` before anything else in the route. */
  function guard(action: Action, target: Target): Guard {
    const handler: RequestHandler = async (req, res, next) => {
      try {
        Object.assign(res.locals, await check(req, action, target));
      } catch (error) {
        // A refused caller's upload (multipart, read later by multer) is discarded unread, so the
        // connection stays usable and nothing of it is buffered.
        req.resume();
        throw error;
      }
      next();
    };
    return Object.assign(handler, { access: { action, target } });
  }

  return { guard };
}

/** Marks a route open to anyone (sign-in, health, invitation links): stated, so the route-table test sees it. */
export function publicRoute(): Guard {
  const handler: RequestHandler = (_req, _res, next) => next();
  return Object.assign(handler, { access: { action: null, target: { kind: 'public' } as Target } });
}

/**
 * Marks a route for any signed-in person, whatever their clubs (their own account: `/me`, password
 * change). 401 when signed out. No club scope is left: such a route touches only the caller's account.
 */
export function signedInRoute(): Guard {
  const handler: RequestHandler = (req, _res, next) => next(req.user ? undefined : unauthorized());
  return Object.assign(handler, { access: { action: null, target: { kind: 'signed-in' } as Target } });
}

/** The access metadata of a route's handlers (the first guard found), or null: read by the route-table test. */
export function accessOf(handlers: readonly unknown[]): AccessMeta | null {
  for (const h of handlers) {
    const access = (h as Partial<Guard> | null)?.access;
    if (access) return access;
  }
  return null;
}
