import { Router } from 'express';
import type { Db } from '@/db/client';
import { changeRoleSchema, inviteSchema } from '@/features/auth/schemas';
import { accessGuards, clubParam, scopeOf } from '@/server/access/guard';
import type { AuthService } from '@/server/auth/auth.service';
import { notFound } from '@/server/http/errors';
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

  router.patch('/clubs/:clubId/members/:userId', guard('members.manage', clubParam()), validateBody(changeRoleSchema), async (req, res) => {
    res.json(await service(res).changeRole(uuidParam(req.params.userId, 'member'), req.body.role));
  });

  router.delete('/clubs/:clubId/members/:userId', guard('members.manage', clubParam()), async (req, res) => {
    res.json(await service(res).remove(uuidParam(req.params.userId, 'member')));
  });

  router.delete('/clubs/:clubId/invitations/:invitationId', guard('members.manage', clubParam()), async (req, res) => {
    res.json(await service(res).cancelInvitation(uuidParam(req.params.invitationId, 'invitation')));
  });

  return router;
}

/** An id in the path that is no UUID names nothing here: a 404, not a database error. */
function uuidParam(value: string | string[] | undefined, what: string): string {
  const v = String(value ?? '');
  if (!/^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i.test(v)) throw notFound(`This ${what}`);
  return v;
}
