import { Router } from 'express';
import type { Db } from '@/db/client';
import type { Me } from '@/features/auth/contract';
import { signedInRoute } from '@/server/access/guard';
import { callerMemberships } from '@/server/access/scope';

export function meRouter(db: Db) {
  const router = Router();
  router.get('/me', signedInRoute(), async (req, res) => {
    res.json({ user: req.user!, memberships: await callerMemberships(db, req) } satisfies Me);
  });
  return router;
}
