import { Router } from 'express';
import type { Db } from '@/db/client';
import { accessGuards, callerClub, on, scopeOf } from '@/server/access/guard';
import { reviewsService } from './reviews.service';

/** The physiotherapist's review list, the review mark, and the care state shown on a result. */
export function reviewsRouter(db: Db) {
  const router = Router();
  const { guard } = accessGuards(db);
  const id = (res: { locals: object }) => (res.locals as { id: string }).id;

  router.get('/reviews', guard('review.read', callerClub), async (_req, res) => {
    res.json(await reviewsService(db, scopeOf(res)).list());
  });

  router.post('/assessments/:id/review', guard('review.mark', on('assessment')), async (_req, res) => {
    res.json({ care: await reviewsService(db, scopeOf(res)).markReviewed(id(res)) });
  });

  router.get('/assessments/:id/care', guard('screening.read', on('assessment')), async (_req, res) => {
    res.json({ care: await reviewsService(db, scopeOf(res)).care(id(res)) });
  });

  return router;
}
