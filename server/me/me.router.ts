import { Router } from 'express';
import type { Db } from '@/db/client';
import type { Me } from '@/features/auth/contract';
import { signedInRoute } from '@/server/access/guard';
import { membershipsOf, signedInUserId } from '@/server/access/scope';

export function meRouter(db: Db) {
  const router = Router();
  router.get('/me', signedInRoute(), async (req, res) => {
    const userId = signedInUserId(req);
    res.json({ user: req.user!, memberships: await membershipsOf(db, userId) } satisfies Me);
  });
  return router;
}
