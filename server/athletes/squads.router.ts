import { Router } from 'express';
import type { Db } from '@/db/client';
import { squadSchema } from '@/features/athletes/schemas';
import { STAFF } from '@/server/access/scope';
import { validateBody } from '@/server/http/validate';
import { athletesRepo } from './athletes.repo';
import { athletesService, ROSTER_MANAGERS } from './athletes.service';
import { callerClubScope, scoped, squadScope } from './scope-middleware';

const view = (s: { id: string; name: string; archivedAt: Date | null }) => ({ id: s.id, name: s.name, archived: s.archivedAt !== null });

export function squadsRouter(db: Db) {
  const router = Router();

  router.get('/squads', callerClubScope(db, STAFF), async (_req, res) => {
    res.json({ squads: await athletesRepo(db, scoped(res).scope).squads() });
  });

  router.post('/squads', callerClubScope(db, ROSTER_MANAGERS), validateBody(squadSchema), async (req, res) => {
    res.status(201).json({ squad: view(await athletesService(db, scoped(res).scope).createSquad(req.body)) });
  });

  router.patch('/squads/:id', squadScope(db, ROSTER_MANAGERS), validateBody(squadSchema), async (req, res) => {
    const { scope, id } = scoped(res);
    res.json({ squad: view(await athletesService(db, scope).renameSquad(id, req.body)) });
  });

  // Only an empty squad is archived: nobody is left without a squad by accident.
  router.post('/squads/:id/archive', squadScope(db, ROSTER_MANAGERS), async (_req, res) => {
    const { scope, id } = scoped(res);
    res.json({ squad: view(await athletesService(db, scope).archiveSquad(id)) });
  });

  return router;
}
