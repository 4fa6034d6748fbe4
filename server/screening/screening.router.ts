import { Router, type Request, type RequestHandler } from 'express';
import multer from 'multer';
import type { Role } from '@/db/schema';
import { createRoundSchema, planAdjustmentSchema, saveDraftSchema } from '@/features/screening/contract';
import { PLAN_ADJUSTERS } from '@/features/screening/roles';
import { scopeForCallerClub, scopeForClub, STAFF, type ClubScope } from '@/server/access/scope';
import { badRequest, notFound } from '@/server/http/errors';
import { multipart } from '@/server/http/multipart';
import { validateBody } from '@/server/http/validate';
import { MAX_UPLOAD_BYTES } from './photo-processing';
import { clubOf } from './screening.repo';
import { DraftConflictError, screeningService, type ScreeningDeps } from './screening.service';

/** Who may read screening data; parents see none of it (their summaries are a later issue). */
export const SCREENING_READ: readonly Role[] = STAFF;
/** Who may open rounds, screen, upload photos, submit and adjust plans. */
export const SCREENING_WRITE: readonly Role[] = ['admin', 'head_coach', 'tester'];
/** Who may reopen a closed round: the head coach, who owns the season's screening (our choice). */
export const ROUND_REOPEN: readonly Role[] = ['head_coach'];

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;
const WHAT = { squad: 'The squad', round: 'The round', assessment: 'The assessment', photo: 'The photo', athlete: 'The athlete' } as const;

export function screeningRouter(deps: ScreeningDeps) {
  const { db } = deps;
  const service = screeningService(deps);
  const router = Router();
  // preservePath: a file name with folders reaches multipart(), which refuses it instead of busboy quietly trimming it.
  const upload = multer({ storage: multer.memoryStorage(), preservePath: true, limits: { fileSize: MAX_UPLOAD_BYTES, files: 1, fields: 10 } });

  /**
   * The caller's scope in the club that owns the record: 404 for a malformed or unknown id, 403 when
   * the record belongs to a club where the caller has no (suitable) role.
   */
  async function scopeFor(req: Request, kind: keyof typeof WHAT, id: string, roles: readonly Role[]): Promise<ClubScope> {
    if (!UUID.test(id)) throw notFound(WHAT[kind]);
    const clubId = await clubOf(db, kind, id);
    if (!clubId) throw notFound(WHAT[kind]);
    return scopeForClub(db, req, clubId, roles);
  }

  router.get('/rounds', async (req, res) => {
    const squadId = typeof req.query.squadId === 'string' && req.query.squadId !== '' ? req.query.squadId : undefined;
    const scope = squadId ? await scopeFor(req, 'squad', squadId, SCREENING_READ) : await scopeForCallerClub(db, req, SCREENING_READ);
    res.json(await service.listRounds(scope, squadId));
  });

  router.post('/rounds', validateBody(createRoundSchema), async (req, res) => {
    const scope = await scopeFor(req, 'squad', req.body.squadId, SCREENING_WRITE);
    res.status(201).json(await service.createRound(scope, req.body));
  });

  router.get('/rounds/:id', async (req, res) => {
    const scope = await scopeFor(req, 'round', String(req.params.id), SCREENING_READ);
    res.json(await service.roundDetail(scope, String(req.params.id)));
  });

  router.post('/rounds/:id/close', async (req, res) => {
    const scope = await scopeFor(req, 'round', String(req.params.id), SCREENING_WRITE);
    res.json(await service.setRoundClosed(scope, String(req.params.id), true));
  });

  router.post('/rounds/:id/reopen', async (req, res) => {
    const scope = await scopeFor(req, 'round', String(req.params.id), ROUND_REOPEN);
    res.json(await service.setRoundClosed(scope, String(req.params.id), false));
  });

  router.get('/assessments/:id', async (req, res) => {
    const scope = await scopeFor(req, 'assessment', String(req.params.id), SCREENING_READ);
    res.json(await service.assessmentDetail(scope, String(req.params.id)));
  });

  router.put('/assessments/:id', validateBody(saveDraftSchema), async (req, res) => {
    const scope = await scopeFor(req, 'assessment', String(req.params.id), SCREENING_WRITE);
    try {
      res.json(await service.saveDraft(scope, String(req.params.id), req.body));
    } catch (error) {
      if (!(error instanceof DraftConflictError)) throw error;
      // The error middleware only knows { error }; the client also needs the draft it lost against.
      res.status(409).json({ error: { code: error.code, message: error.message }, current: error.current });
    }
  });

  // Access is checked before multer reads the body, so a refused caller's upload is never buffered.
  const photoAccess: RequestHandler = async (req, res, next) => {
    try {
      res.locals.scope = await scopeFor(req, 'assessment', String(req.params.id), SCREENING_WRITE);
      next();
    } catch (error) {
      req.resume(); // discard the unread upload so the connection stays usable
      next(error);
    }
  };
  router.post('/assessments/:id/photos', photoAccess, multipart(upload.single('photo')), async (req, res) => {
    const scope = res.locals.scope as ClubScope;
    const body = (req.body ?? {}) as Record<string, unknown>;
    const photo = await service.uploadPhoto(scope, String(req.params.id), { buffer: req.file?.buffer, task: body.task, view: body.view });
    res.status(201).json(photo);
  });

  router.post('/assessments/:id/submit', async (req, res) => {
    const scope = await scopeFor(req, 'assessment', String(req.params.id), SCREENING_WRITE);
    res.json(await service.submit(scope, String(req.params.id)));
  });

  // The physiotherapist may adjust plans too; going past a limit is checked in the service by role
  // (head coach or physiotherapist, with a reason: PLAN_OVERRIDERS).
  router.put('/assessments/:id/plan', validateBody(planAdjustmentSchema), async (req, res) => {
    const scope = await scopeFor(req, 'assessment', String(req.params.id), PLAN_ADJUSTERS);
    res.json(await service.adjustPlan(scope, String(req.params.id), req.body));
  });

  router.get('/photos/:id', async (req, res) => {
    const scope = await scopeFor(req, 'photo', String(req.params.id), SCREENING_READ);
    const size = req.query.size ?? 'full';
    if (size !== 'full' && size !== 'thumb') throw badRequest('Some fields need attention.', { size: 'Size must be "full" or "thumb".' });
    const bytes = await service.photoBytes(scope, String(req.params.id), size);
    res.set({ 'Content-Type': 'image/jpeg', 'Cache-Control': 'private, max-age=300', 'X-Content-Type-Options': 'nosniff' });
    res.send(bytes);
  });

  router.get('/athletes/:id/assessments', async (req, res) => {
    const scope = await scopeFor(req, 'athlete', String(req.params.id), SCREENING_READ);
    res.json(await service.athleteAssessments(scope, String(req.params.id)));
  });

  return router;
}
