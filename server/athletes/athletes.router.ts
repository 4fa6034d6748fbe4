import { Router } from 'express';
import type { Db } from '@/db/client';
import { athletePatchSchema, athleteSchema, consentSchema, guardianSchema } from '@/features/athletes/schemas';
import { ALL_ROLES, STAFF } from '@/server/access/scope';
import { badRequest, notFound } from '@/server/http/errors';
import { validateBody } from '@/server/http/validate';
import { athletesRepo } from './athletes.repo';
import { athletesService, ROSTER_MANAGERS } from './athletes.service';
import { requireUuid } from './ids';
import { rosterImportRouter } from './roster-import.router';
import { athleteScope, callerClubScope, scoped, squadScope } from './scope-middleware';
import { squadsRouter } from './squads.router';

export { requireUuid } from './ids';

/**
 * Squads, athletes, consent decisions, guardian links and the CSV roster import. Admins and head
 * coaches change the roster; other staff read it; parents read their own children only.
 */
export function athletesRouter(db: Db) {
  const router = Router();
  const service = (res: Parameters<typeof scoped>[0]) => athletesService(db, scoped(res).scope);

  router.use(squadsRouter(db));
  router.use(rosterImportRouter(db));

  router.get('/squads/:id/athletes', squadScope(db, STAFF), async (_req, res) => {
    const { scope, id } = scoped(res);
    const repo = athletesRepo(db, scope);
    const squad = await repo.squad(id);
    if (!squad) throw notFound('The squad');
    res.json({ squad: { id: squad.id, name: squad.name }, athletes: await repo.list({ squadId: id }) });
  });

  // Parents get their own children here; club staff get the whole club.
  router.get('/athletes', callerClubScope(db, ALL_ROLES), async (req, res) => {
    const { scope } = scoped(res);
    const includeArchived = req.query.archived === 'include';
    if (includeArchived && scope.role === 'parent') throw badRequest('Archived athletes are not listed for parents.');
    res.json({ athletes: await athletesRepo(db, scope).list({ includeArchived }) });
  });

  router.post('/athletes', callerClubScope(db, ROSTER_MANAGERS), validateBody(athleteSchema), async (req, res) => {
    res.status(201).json({ athlete: await service(res).create(req.body) });
  });

  router.get('/athletes/:id', athleteScope(db, ALL_ROLES), async (_req, res) => {
    res.json({ athlete: await service(res).detail(scoped(res).id) });
  });

  router.patch('/athletes/:id', athleteScope(db, ROSTER_MANAGERS), validateBody(athletePatchSchema), async (req, res) => {
    res.json({ athlete: await service(res).update(scoped(res).id, req.body) });
  });

  // Athletes are never deleted (their results point at them): archived, and restored when they return.
  router.post('/athletes/:id/archive', athleteScope(db, ROSTER_MANAGERS), async (_req, res) => {
    res.json({ athlete: await service(res).setArchived(scoped(res).id, true) });
  });
  router.post('/athletes/:id/restore', athleteScope(db, ROSTER_MANAGERS), async (_req, res) => {
    res.json({ athlete: await service(res).setArchived(scoped(res).id, false) });
  });

  router.get('/athletes/:id/consents', athleteScope(db, ALL_ROLES), async (_req, res) => {
    res.json({ consents: await service(res).consentHistory(scoped(res).id) });
  });
  router.post('/athletes/:id/consents', athleteScope(db, ROSTER_MANAGERS), validateBody(consentSchema), async (req, res) => {
    res.status(201).json(await service(res).recordConsent(scoped(res).id, req.body));
  });

  router.post('/athletes/:id/guardians', athleteScope(db, ROSTER_MANAGERS), validateBody(guardianSchema), async (req, res) => {
    res.status(201).json({ athlete: await service(res).linkGuardian(scoped(res).id, req.body) });
  });
  router.delete('/athletes/:id/guardians/:userId', athleteScope(db, ROSTER_MANAGERS), async (req, res) => {
    const userId = requireUuid(String(req.params.userId), 'This guardian link');
    res.json({ athlete: await service(res).unlinkGuardian(scoped(res).id, userId) });
  });

  return router;
}
