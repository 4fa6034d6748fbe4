import { Router } from 'express';
import type { Db } from '@/db/client';
import { saveLandmarksSchema } from '@/features/measuring/contract';
import { accessGuards, callerClub, on, recordHome, recordIdOf, scopeOf } from '@/server/access/guard';
import { forbidden, notFound } from '@/server/http/errors';
import { requireUuid } from '@/server/http/ids';
import { validateBody } from '@/server/http/validate';
import { measuringService } from './measuring.service';

/**
 * The "to measure" list and the points placed on photos. Placing points changes an assessment and may
 * re-work its result, so both routes need 'screening.write'.
 */
export function measuringRouter({ db }: { db: Db }) {
  const service = measuringService({ db });
  const router = Router();
  const { guard } = accessGuards(db);

  router.get('/measuring/queue', guard('screening.write', callerClub), async (req, res) => {
    const scope = scopeOf(res);
    const roundId = typeof req.query.roundId === 'string' && req.query.roundId !== '' ? requireUuid(req.query.roundId, 'The round') : undefined;
    const squadId = typeof req.query.squadId === 'string' && req.query.squadId !== '' ? requireUuid(req.query.squadId, 'The squad') : undefined;
    // A round or squad named must belong to the caller's club: 404 unknown, 403 another club.
    for (const [kind, id, what] of [
      ['round', roundId, 'The round'],
      ['squad', squadId, 'The squad'],
    ] as const) {
      if (!id) continue;
      const home = await recordHome(db, kind, id);
      if (!home) throw notFound(what);
      if (home.clubId !== scope.clubId) throw forbidden();
    }
    res.json(await service.queue(scope, { roundId, squadId }));
  });

  router.put('/measuring/photos/:id/landmarks', guard('screening.write', on('photo')), validateBody(saveLandmarksSchema), async (req, res) => {
    res.json(await service.saveLandmarks(scopeOf(res), recordIdOf(res), req.body.landmarks));
  });

  return router;
}
