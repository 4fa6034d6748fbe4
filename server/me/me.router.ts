import { Router } from 'express';
import type { Db } from '@/db/client';
import { membershipsOf, signedInUserId } from '@/server/access/scope';

export function meRouter(db: Db) {
  const router = Router();
  router.get('/me', async (req, res) => {
    const userId = signedInUserId(req);
    res.json({ user: req.user, memberships: await membershipsOf(db, userId) });
  });
  return router;
}
