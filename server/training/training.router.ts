import { Router } from 'express';
import type { Db } from '@/db/client';
import { todayIso } from '@/features/athletes/age';
import { buildSheet, type TrainingSheet } from '@/features/training/sheet';
import { accessGuards, on, scopeOf, type Locals } from '@/server/access/guard';
import { notFound } from '@/server/http/errors';
import { trainingRepo } from './training.repo';

/** A squad's training sheet (`training.read` on the squad: the club's staff). Read-only. */
export function trainingRouter(db: Db) {
  const router = Router();
  const { guard } = accessGuards(db);

  router.get('/squads/:id/training-sheet', guard('training.read', on('squad')), async (_req, res) => {
    const squadId = (res.locals as Locals).id!;
    const head = await trainingRepo(db, scopeOf(res)).sheetMembers(squadId);
    if (!head) throw notFound('The squad');
    const sheet: TrainingSheet = buildSheet(head.squad, head.members, todayIso());
    res.json(sheet);
  });

  return router;
}
