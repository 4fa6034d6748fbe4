import { Router } from 'express';
import type { Db } from '@/db/client';
import { todayIso } from '@/features/athletes/age';
import { recordSessionSchema, type RecordSessionInput } from '@/features/training/schemas';
import { buildSheet, type TrainingSheet } from '@/features/training/sheet';
import { accessGuards, on, scopeOf, type Locals } from '@/server/access/guard';
import { badRequest, notFound } from '@/server/http/errors';
import { validateBody } from '@/server/http/validate';
import { sessionsRepo, trainingRepo } from './training.repo';

/**
 * A squad's training sheet and its recorded sessions (`training.read` on the squad: the club's staff),
 * and recording who took part in one (`training.record`).
 */
export function trainingRouter(db: Db) {
  const router = Router();
  const { guard } = accessGuards(db);
  const squadOf = (res: { locals: object }) => (res.locals as Locals).id!;

  router.get('/squads/:id/training-sheet', guard('training.read', on('squad')), async (_req, res) => {
    const head = await trainingRepo(db, scopeOf(res)).sheetMembers(squadOf(res));
    if (!head) throw notFound('The squad');
    const sheet: TrainingSheet = buildSheet(head.squad, head.members, todayIso());
    res.json(sheet);
  });

  router.get('/squads/:id/training-sessions', guard('training.read', on('squad')), async (_req, res) => {
    res.json({ sessions: await sessionsRepo(db, scopeOf(res)).latest(squadOf(res)) });
  });

  router.post('/squads/:id/training-sessions', guard('training.record', on('squad')), validateBody(recordSessionSchema), async (req, res) => {
    const input = req.body as RecordSessionInput;
    const repo = sessionsRepo(db, scopeOf(res));
    const squadId = squadOf(res);
    const members = await repo.currentMembers(squadId, input.athleteIds);
    if (input.athleteIds.some((id) => !members.has(id))) {
      throw badRequest('Some fields need attention.', { athleteIds: 'Some of these athletes are not in this squad any more: open the sheet again.' });
    }
    // Nobody is recorded as doing corrective exercises their family has not agreed to (our rule).
    const refused = await repo.withoutConsent(input.athleteIds);
    if (refused.length) {
      throw badRequest('Some fields need attention.', {
        athleteIds: `No agreement from the family to corrective exercises is in force for ${refused.join(', ')}: leave them out.`,
      });
    }
    const { id, created } = await repo.record(squadId, input);
    const [session] = await repo.latest(squadId, { onlyId: id });
    res.status(created ? 201 : 200).json({ session });
  });

  return router;
}
