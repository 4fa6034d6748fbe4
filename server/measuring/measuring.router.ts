import { Router, type Request } from 'express';
import type { Role } from '@/db/schema';
import { saveLandmarksSchema } from '@/features/measuring/contract';
import { scopeForCallerClub, scopeForClub, type ClubScope } from '@/server/access/scope';
import { notFound } from '@/server/http/errors';
import { validateBody } from '@/server/http/validate';
import { clubOf } from '@/server/screening/screening.repo';
import type { Db } from '@/db/client';
import { measuringService } from './measuring.service';

/**
 * Who may use the "to measure" list: the roles that may write screening data (placing points changes
 * an assessment and may re-work its result). The one place this router checks roles.
 */
export const MEASURING_ROLES: readonly Role[] = ['admin', 'head_coach', 'tester'];

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

export function measuringRouter({ db }: { db: Db }) {
  const service = measuringService({ db });
  const router = Router();

  /** Scope in the caller's club, or in the club owning the round/squad/photo named (404 unknown, 403 another club). */
  async function scopeFor(req: Request, record?: { kind: 'round' | 'squad' | 'photo'; id: string }): Promise<ClubScope> {
    if (!record) return scopeForCallerClub(db, req, MEASURING_ROLES);
    const what = { round: 'The round', squad: 'The squad', photo: 'The photo' }[record.kind];
    if (!UUID.test(record.id)) throw notFound(what);
    const clubId = await clubOf(db, record.kind, record.id);
    if (!clubId) throw notFound(what);
    return scopeForClub(db, req, clubId, MEASURING_ROLES);
  }

  router.get('/measuring/queue', async (req, res) => {
    const roundId = typeof req.query.roundId === 'string' && req.query.roundId !== '' ? req.query.roundId : undefined;
    const squadId = typeof req.query.squadId === 'string' && req.query.squadId !== '' ? req.query.squadId : undefined;
    const scope = await scopeFor(req, roundId ? { kind: 'round', id: roundId } : squadId ? { kind: 'squad', id: squadId } : undefined);
    res.json(await service.queue(scope, { roundId, squadId }));
  });

  router.put('/measuring/photos/:id/landmarks', validateBody(saveLandmarksSchema), async (req, res) => {
    const scope = await scopeFor(req, { kind: 'photo', id: String(req.params.id) });
    res.json(await service.saveLandmarks(scope, String(req.params.id), req.body.landmarks));
  });

  return router;
}
