import { Router } from 'express';
import type { Db } from '@/db/client';
import { inviteSchema } from '@/features/auth/schemas';
import { accessGuards, clubParam, scopeOf } from '@/server/access/guard';
import type { AuthService } from '@/server/auth/auth.service';
import { validateBody } from '@/server/http/validate';
import { clubsService } from './clubs.service';

export function clubsRouter(db: Db, authService: AuthService) {
  const router = Router();
  const { guard } = accessGuards(db);
  const service = (res: { locals: object }) => clubsService(db, authService, scopeOf(res));

  router.get('/clubs/:clubId/members', guard('members.read', clubParam()), async (_req, res) => {
    res.json(await service(res).members());
  });

  router.post('/clubs/:clubId/invitations', guard('members.invite', clubParam()), validateBody(inviteSchema), async (req, res) => {
    res.status(201).json(await service(res).invite(req.body));
  });

  return router;
}
