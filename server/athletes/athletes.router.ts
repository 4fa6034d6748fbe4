import { Router } from 'express';
import type { Db } from '@/db/client';
import { ALL_ROLES, STAFF, scopeForCallerClub, scopeForClub } from '@/server/access/scope';
import { badRequest, forbidden, notFound } from '@/server/http/errors';
import { athletesRepo, clubOfAthlete, clubOfSquad } from './athletes.repo';

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;
export function requireUuid(value: string, what: string): string {
  if (!UUID.test(value)) throw notFound(what);
  return value;
}

export function athletesRouter(db: Db) {
  const router = Router();

  router.get('/squads', async (req, res) => {
    const scope = await scopeForCallerClub(db, req, STAFF);
    res.json({ squads: await athletesRepo(db, scope).squads() });
  });

  router.get('/squads/:id/athletes', async (req, res) => {
    const id = requireUuid(req.params.id, 'The squad');
    const clubId = await clubOfSquad(db, id);
    if (!clubId) throw notFound('The squad');
    const scope = await scopeForClub(db, req, clubId, STAFF);
    const repo = athletesRepo(db, scope);
    const squad = await repo.squad(id);
    if (!squad) throw notFound('The squad');
    res.json({ squad: { id: squad.id, name: squad.name }, athletes: await repo.list({ squadId: id }) });
  });

  // Parents get their own children here; club staff get the whole club.
  router.get('/athletes', async (req, res) => {
    const scope = await scopeForCallerClub(db, req, ALL_ROLES);
    const includeArchived = req.query.archived === 'include';
    if (includeArchived && scope.role === 'parent') throw badRequest('Archived athletes are not listed for parents.');
    res.json({ athletes: await athletesRepo(db, scope).list({ includeArchived }) });
  });

  router.get('/athletes/:id', async (req, res) => {
    const id = requireUuid(req.params.id, 'The athlete');
    const clubId = await clubOfAthlete(db, id);
    if (!clubId) throw notFound('The athlete');
    const scope = await scopeForClub(db, req, clubId, ALL_ROLES);
    const athlete = await athletesRepo(db, scope).get(id);
    // The athlete exists in this club but is outside the caller's scope (another family's child).
    if (!athlete) throw forbidden('You can only see the athletes linked to you.');
    res.json({ athlete });
  });

  return router;
}
