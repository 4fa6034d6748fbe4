import { Router } from 'express';
import type { Db } from '@/db/client';
import { can } from '@/features/access/permissions';
import { athletePatchSchema, athleteSchema, consentSchema, guardianSchema, ownConsentSchema } from '@/features/athletes/schemas';
import { accessGuards, callerClub, on, recordIdOf, scopeOf } from '@/server/access/guard';
import { badRequest, notFound } from '@/server/http/errors';
import { validateBody } from '@/server/http/validate';
import { athletesRepo } from './athletes.repo';
import { athletesService } from './athletes.service';
import { requireUuid } from '@/server/http/ids';
import { rosterImportRouter } from './roster-import.router';
import { squadsRouter } from './squads.router';
import { careSettingsOf } from '@/server/care/settings.repo';

/**
 * Squads, athletes, consent decisions, guardian links and the CSV roster import. Admins and head
 * coaches change the roster; other staff read it; parents read their own children only.
 */
export function athletesRouter(db: Db) {
  const router = Router();
  const { guard } = accessGuards(db);
  const service = (res: { locals: object }) => athletesService(db, scopeOf(res));

  router.use(squadsRouter(db));
  router.use(rosterImportRouter(db));

  router.get('/squads/:id/athletes', guard('roster.read', on('squad')), async (_req, res) => {
    const scope = scopeOf(res);
    const id = recordIdOf(res);
    const repo = athletesRepo(db, scope);
    const squad = await repo.squad(id);
    if (!squad) throw notFound('The squad');
    res.json({ squad: { id: squad.id, name: squad.name }, athletes: await repo.list({ squadId: id }) });
  });

  // Parents get their own children here; club staff get the whole club.
  router.get('/athletes', guard('athlete.read', callerClub), async (req, res) => {
    const scope = scopeOf(res);
    const includeArchived = req.query.archived === 'include';
    if (includeArchived && !can(scope.role, 'roster.read')) throw badRequest('Archived athletes are not listed for parents.');
    res.json({ athletes: await athletesRepo(db, scope).list({ includeArchived }) });
  });

  router.post('/athletes', guard('roster.manage', callerClub), validateBody(athleteSchema), async (req, res) => {
    res.status(201).json({ athlete: await service(res).create(req.body) });
  });

  router.get('/athletes/:id', guard('athlete.read', on('athlete')), async (_req, res) => {
    res.json({ athlete: await service(res).detail(recordIdOf(res)) });
  });

  router.patch('/athletes/:id', guard('roster.manage', on('athlete')), validateBody(athletePatchSchema), async (req, res) => {
    res.json({ athlete: await service(res).update(recordIdOf(res), req.body) });
  });

  // Athletes are never deleted (their results point at them): archived, and restored when they return.
  router.post('/athletes/:id/archive', guard('roster.manage', on('athlete')), async (_req, res) => {
    res.json({ athlete: await service(res).setArchived(recordIdOf(res), true) });
  });
  router.post('/athletes/:id/restore', guard('roster.manage', on('athlete')), async (_req, res) => {
    res.json({ athlete: await service(res).setArchived(recordIdOf(res), false) });
  });

  router.get('/athletes/:id/consents', guard('consent.read', on('athlete')), async (_req, res) => {
    const consents = await service(res).consentHistory(recordIdOf(res));
    // How long the club keeps photos, so that the family reads days and months rather than "the club's period".
    const settings = await careSettingsOf(db, scopeOf(res).clubId);
    res.json({ consents, photoTerms: { graceDays: settings.photoGraceDays, retentionMonths: settings.photoRetentionMonths } });
  });
  router.post('/athletes/:id/consents', guard('consent.manage', on('athlete')), validateBody(consentSchema), async (req, res) => {
    res.status(201).json(await service(res).recordConsent(recordIdOf(res), req.body));
  });

  // A parent's own decision, from their child's page: dated today, audited, 200 whether or not it changed anything.
  router.post('/athletes/:id/consents/own', guard('consent.own', on('athlete')), validateBody(ownConsentSchema), async (req, res) => {
    res.json(await service(res).recordOwnConsent(recordIdOf(res), req.body));
  });

  router.post('/athletes/:id/guardians', guard('guardians.manage', on('athlete')), validateBody(guardianSchema), async (req, res) => {
    res.status(201).json({ athlete: await service(res).linkGuardian(recordIdOf(res), req.body) });
  });
  router.delete('/athletes/:id/guardians/:userId', guard('guardians.manage', on('athlete')), async (req, res) => {
    const userId = requireUuid(String(req.params.userId), 'This guardian link');
    res.json({ athlete: await service(res).unlinkGuardian(recordIdOf(res), userId) });
  });

  return router;
}
