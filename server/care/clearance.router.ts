import { Router } from 'express';
import type { Db } from '@/db/client';
import type { ClearanceHold, ClearanceStatus } from '@/features/care/choices';
import { clearanceSchema } from '@/features/care/schemas';
import { and, eq, isNull } from 'drizzle-orm';
import { athletes } from '@/db/schema';
import { accessGuards, callerClub, on, scopeOf } from '@/server/access/guard';
import { validateBody } from '@/server/http/validate';
import { recordAudit } from './audit.repo';
import { clearanceRepo, latestClearances, painWaiting } from './clearance.repo';
import { applyClearance } from './clearance.service';

/** Clearance per athlete: set by a physiotherapist, every decision kept. */
export function clearanceRouter(db: Db) {
  const router = Router();
  const { guard } = accessGuards(db);
  const id = (res: { locals: object }) => (res.locals as { id: string }).id;

  router.put('/athletes/:id/clearance', guard('clearance.set', on('athlete')), validateBody(clearanceSchema), async (req, res) => {
    const scope = scopeOf(res);
    const athleteId = id(res);
    const body = req.body as { status: ClearanceStatus; detail: string; holds: ClearanceHold[] };
    const detail = body.detail ?? '';
    await db.transaction(async (tx) => {
      const { id: clearanceId, holds } = await clearanceRepo(tx, scope).add(athleteId, body.status, detail, body.holds);
      await recordAudit(tx, {
        clubId: scope.clubId,
        actorId: scope.userId,
        action: 'set',
        subjectKind: 'clearance',
        subjectId: clearanceId,
        athleteId,
        detail: { status: body.status, detail, ...(holds.length ? { holds } : {}) },
      });
      // The plan follows the decision: held-back work comes back (a new result version) or goes on hold.
      await applyClearance(tx, scope, athleteId, clearanceId, body.status);
    });
    res.json({ clearance: await clearanceRepo(db, scope).current(athleteId) });
  });

  // The clearance in force for every athlete of the club, for the badge beside names in staff screens, and
  // those whose newest screen reported pain with no decision since (`painWaiting`), for the stop notice in
  // capture, the round list and the athlete page.
  router.get('/clearances', guard('roster.read', callerClub), async (_req, res) => {
    const scope = scopeOf(res);
    const rows = await db
      .select({ id: athletes.id })
      .from(athletes)
      .where(and(eq(athletes.clubId, scope.clubId), isNull(athletes.archivedAt)));
    res.json({
      clearances: Object.fromEntries(
        await latestClearances(
          db,
          rows.map((r) => r.id),
        ),
      ),
      painWaiting: await painWaiting(db, scope.clubId),
    });
  });

  router.get('/athletes/:id/clearance', guard('screening.read', on('athlete')), async (_req, res) => {
    const scope = scopeOf(res);
    const repo = clearanceRepo(db, scope);
    const [clearance, history] = await Promise.all([repo.current(id(res)), repo.history(id(res))]);
    await recordAudit(db, { clubId: scope.clubId, actorId: scope.userId, action: 'view', subjectKind: 'clearance', athleteId: id(res) });
    res.json({ clearance, history });
  });

  return router;
}
