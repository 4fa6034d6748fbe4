import type { Request, RequestHandler, Response } from 'express';
import type { Db } from '@/db/client';
import type { Role } from '@/db/schema';
import { scopeForCallerClub, scopeForClub, type ClubScope } from '@/server/access/scope';
import { notFound } from '@/server/http/errors';
import { clubOfAthlete, clubOfSquad } from './athletes.repo';
import { requireUuid } from './ids';

// Access is settled before the body is validated: a caller without the role learns nothing from field errors.

type Locals = { scope: ClubScope; id: string };

export function scoped(res: Response): Locals {
  return res.locals as Locals;
}

/** The caller's scope in the club of the athlete named by `:id`; 404 unknown athlete, 403 other club or role. */
export function athleteScope(db: Db, roles: readonly Role[]): RequestHandler {
  return async (req, res, next) => {
    const id = requireUuid(String(req.params.id), 'The athlete');
    const clubId = await clubOfAthlete(db, id);
    if (!clubId) throw notFound('The athlete');
    Object.assign(res.locals, { id, scope: await scopeForClub(db, req, clubId, roles) });
    next();
  };
}

export function squadScope(db: Db, roles: readonly Role[]): RequestHandler {
  return async (req, res, next) => {
    const id = requireUuid(String(req.params.id), 'The squad');
    const clubId = await clubOfSquad(db, id);
    if (!clubId) throw notFound('The squad');
    Object.assign(res.locals, { id, scope: await scopeForClub(db, req, clubId, roles) });
    next();
  };
}

/** Routes without a record in the path: the caller's club (X-Club-Id header or their only club). */
export function callerClubScope(db: Db, roles: readonly Role[]): RequestHandler {
  return async (req: Request, res, next) => {
    Object.assign(res.locals, { scope: await scopeForCallerClub(db, req, roles) });
    next();
  };
}
