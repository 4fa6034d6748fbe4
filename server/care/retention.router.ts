import { Router } from 'express';
import type { Db } from '@/db/client';
import { careSettingsSchema, type CareSettingsInput } from '@/features/care/schemas';
import { accessGuards, callerClub, scopeOf } from '@/server/access/guard';
import { validateBody } from '@/server/http/validate';
import type { PhotoStorage } from '@/server/storage/storage';
import { recordAudit } from './audit.repo';
import { runRetention } from './retention.service';
import { careSettingsOf, saveCareSettings } from './settings.repo';

/** Club care settings (retention, family photos, automatic release) and the retention dry run. */
export function retentionRouter(db: Db, storage: PhotoStorage) {
  const router = Router();
  const { guard } = accessGuards(db);

  router.get('/care-settings', guard('club.settings', callerClub), async (_req, res) => {
    res.json({ settings: await careSettingsOf(db, scopeOf(res).clubId) });
  });

  router.put('/care-settings', guard('club.settings', callerClub), validateBody(careSettingsSchema), async (req, res) => {
    const scope = scopeOf(res);
    const before = await careSettingsOf(db, scope.clubId);
    await db.transaction(async (tx) => {
      await saveCareSettings(tx, scope.clubId, req.body as CareSettingsInput);
      await recordAudit(tx, { clubId: scope.clubId, actorId: scope.userId, action: 'update', subjectKind: 'settings', detail: { before, after: req.body } });
    });
    res.json({ settings: await careSettingsOf(db, scope.clubId) });
  });

  // What the scheduled job would delete now; nothing is deleted here.
  router.get('/retention/dry-run', guard('club.settings', callerClub), async (_req, res) => {
    res.json(await runRetention(db, storage, scopeOf(res).clubId, { dryRun: true }));
  });

  return router;
}
