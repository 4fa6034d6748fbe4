import { Router } from 'express';
import type { Db } from '@/db/client';
import { squadSchema } from '@/features/athletes/schemas';
import { accessGuards, callerClub, on, recordIdOf, scopeOf } from '@/server/access/guard';
import { validateBody } from '@/server/http/validate';
import { athletesRepo } from './athletes.repo';
import { athletesService } from './athletes.service';

const view = (s: { id: string; name: string; archivedAt: Date | null }) => ({ id: s.id, name: s.name, archived: s.archivedAt !== null });

export function squadsRouter(db: Db) {
  const router = Router();
  const { guard } = accessGuards(db);

  router.get('/squads', guard('roster.read', callerClub), async (_req, res) => {
    res.json({ squads: await athletesRepo(db, scopeOf(res)).squads() });
  });

  router.post('/squads', guard('roster.manage', callerClub), validateBody(squadSchema), async (req, res) => {
    res.status(201).json({ squad: view(await athletesService(db, scopeOf(res)).createSquad(req.body)) });
  });

  router.patch('/squads/:id', guard('roster.manage', on('squad')), validateBody(squadSchema), async (req, res) => {
    const scope = scopeOf(res);
    const id = recordIdOf(res);
    res.json({ squad: view(await athletesService(db, scope).renameSquad(id, req.body)) });
  });

  // Only an empty squad is archived: nobody is left without a squad by accident.
  router.post('/squads/:id/archive', guard('roster.manage', on('squad')), async (_req, res) => {
    const scope = scopeOf(res);
    const id = recordIdOf(res);
    res.json({ squad: view(await athletesService(db, scope).archiveSquad(id)) });
  });

  return router;
}
