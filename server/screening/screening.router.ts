import { Router } from 'express';
import multer from 'multer';
import { createRoundSchema, planAdjustmentSchema, saveDraftSchema, submitSchema, type SaveDraftResponse } from '@/features/screening/contract';
import { accessGuards, callerClub, on, recordHome, recordIdOf, scopeOf } from '@/server/access/guard';
import { badRequest, forbidden, notFound } from '@/server/http/errors';
import { requireUuid } from '@/server/http/ids';
import { uploadSlots, type UploadSlots } from '@/server/http/upload-slots';
import { multipart } from '@/server/http/multipart';
import { validateBody } from '@/server/http/validate';
import { MAX_UPLOAD_BYTES } from './photo-processing';
import { screeningService, type ScreeningDeps } from './screening.service';

export function screeningRouter(deps: ScreeningDeps & { uploads?: UploadSlots }) {
  const { db } = deps;
  const uploads = deps.uploads ?? uploadSlots();
  const service = screeningService(deps);
  const router = Router();
  const { guard } = accessGuards(db);
  // preservePath: a file name with folders reaches multipart(), which refuses it instead of busboy quietly trimming it.
  const upload = multer({ storage: multer.memoryStorage(), preservePath: true, limits: { fileSize: MAX_UPLOAD_BYTES, files: 1, fields: 10 } });

  router.get('/rounds', guard('screening.read', callerClub), async (req, res) => {
    const scope = scopeOf(res);
    const squadId = typeof req.query.squadId === 'string' && req.query.squadId !== '' ? requireUuid(req.query.squadId, 'The squad') : undefined;
    if (squadId) {
      const home = await recordHome(db, 'squad', squadId);
      if (!home) throw notFound('The squad');
      if (home.clubId !== scope.clubId) throw forbidden();
    }
    res.json(await service.listRounds(scope, squadId));
  });

  router.post('/rounds', guard('screening.write', on('squad', 'squadId', 'body')), validateBody(createRoundSchema), async (req, res) => {
    res.status(201).json(await service.createRound(scopeOf(res), req.body));
  });

  router.get('/rounds/:id', guard('screening.read', on('round')), async (_req, res) => {
    res.json(await service.roundDetail(scopeOf(res), recordIdOf(res)));
  });

  router.post('/rounds/:id/close', guard('screening.write', on('round')), async (_req, res) => {
    res.json(await service.setRoundClosed(scopeOf(res), recordIdOf(res), true));
  });

  router.post('/rounds/:id/newcomers', guard('screening.write', on('round')), async (_req, res) => {
    res.json(await service.addNewcomers(scopeOf(res), recordIdOf(res)));
  });

  router.post('/rounds/:id/reopen', guard('round.reopen', on('round')), async (_req, res) => {
    res.json(await service.setRoundClosed(scopeOf(res), recordIdOf(res), false));
  });

  router.get('/assessments/:id', guard('screening.read', on('assessment')), async (_req, res) => {
    res.json(await service.assessmentDetail(scopeOf(res), recordIdOf(res)));
  });

  router.put('/assessments/:id', guard('screening.write', on('assessment')), validateBody(saveDraftSchema), async (req, res) => {
    // A stale draftVersion: 409 `draft_conflict` with the server's draft (DraftConflictCurrent) to merge.
    res.json((await service.saveDraft(scopeOf(res), recordIdOf(res), req.body)) satisfies SaveDraftResponse);
  });

  // Access is checked before multer reads the body, so a refused caller's upload is never buffered.
  // Then waits for one of a few upload slots, so 20 phones uploading at once hold a bounded amount of memory.
  router.post(
    '/assessments/:id/photos',
    guard('screening.write', on('assessment')),
    uploads.middleware,
    multipart(upload.single('photo')),
    async (req, res) => {
      const body = (req.body ?? {}) as Record<string, unknown>;
      const photo = await service.uploadPhoto(scopeOf(res), recordIdOf(res), { buffer: req.file?.buffer, task: body.task, view: body.view });
      res.status(201).json(photo);
    },
  );

  router.post('/assessments/:id/submit', guard('screening.write', on('assessment')), validateBody(submitSchema), async (req, res) => {
    res.json(await service.submit(scopeOf(res), recordIdOf(res), req.body));
  });

  // The physiotherapist may adjust plans too; going past a limit is checked in the service by role
  // (head coach or physiotherapist, with a reason: 'plan.override').
  router.put('/assessments/:id/plan', guard('plan.adjust', on('assessment')), validateBody(planAdjustmentSchema), async (req, res) => {
    res.json(await service.adjustPlan(scopeOf(res), recordIdOf(res), req.body));
  });

  router.get('/photos/:id', guard('screening.read', on('photo')), async (req, res) => {
    const size = req.query.size ?? 'full';
    if (size !== 'full' && size !== 'thumb') throw badRequest('Some fields need attention.', { size: 'Size must be "full" or "thumb".' });
    const bytes = await service.photoBytes(scopeOf(res), recordIdOf(res), size);
    // Photos of minors: never kept by a browser or proxy cache (consent can be withdrawn any time).
    res.set({ 'Content-Type': 'image/jpeg', 'Cache-Control': 'no-store', 'X-Content-Type-Options': 'nosniff' });
    res.send(bytes);
  });

  router.get('/athletes/:id/assessments', guard('screening.read', on('athlete')), async (_req, res) => {
    res.json(await service.athleteAssessments(scopeOf(res), recordIdOf(res)));
  });

  return router;
}
