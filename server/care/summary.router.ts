import { and, eq, isNull } from 'drizzle-orm';
import express, { Router } from 'express';
import { photos } from '@/db/schema';
import { accessGuards, on, publicRoute, scopeOf } from '@/server/access/guard';
import { AppError, badRequest, notFound } from '@/server/http/errors';
import type { PhotoStorage } from '@/server/storage/storage';
import { summaryRepo } from './summary.repo';
import { careSettingsOf } from './settings.repo';
import { summaryService, unsubscribe, type SummaryDeps } from './summary.service';
import { screeningRepo } from '@/server/screening/screening.repo';

/** Family summaries: preview, release (with e-mails), the family view, family photos, unsubscribe. */
export function summaryRouter(deps: SummaryDeps & { storage: PhotoStorage }) {
  const { db } = deps;
  const router = Router();
  const { guard } = accessGuards(db);
  const id = (res: { locals: object }) => (res.locals as { id: string }).id;

  router.get('/assessments/:id/release-preview', guard('summary.release', on('assessment')), async (_req, res) => {
    res.json({ preview: await summaryService(deps, scopeOf(res)).preview(id(res)) });
  });

  router.post('/assessments/:id/release', guard('summary.release', on('assessment')), async (_req, res) => {
    res.status(201).json({ release: await summaryService(deps, scopeOf(res)).release(id(res)) });
  });

  router.get('/athletes/:id/summary', guard('summary.read', on('athlete')), async (_req, res) => {
    res.json(await summaryService(deps, scopeOf(res)).familyView(id(res)));
  });

  // A parent's own child's photo, only where the club allows it, consent is in force and the screen was released.
  router.get('/family-photos/:id', guard('summary.read', on('photo')), async (req, res) => {
    const scope = scopeOf(res);
    const size = req.query.size ?? 'full';
    if (size !== 'full' && size !== 'thumb') throw badRequest('Some fields need attention.', { size: 'Size must be "full" or "thumb".' });
    const [photo] = await db
      .select()
      .from(photos)
      .where(and(eq(photos.id, id(res)), eq(photos.clubId, scope.clubId), isNull(photos.replacedAt)));
    if (!photo) throw notFound('The photo');
    const settings = await careSettingsOf(db, scope.clubId);
    const owner = await screeningRepo(db, scope).assessment(photo.assessmentId);
    const released = owner ? (await summaryRepo(db, scope).releases(owner.athleteId)).some((r) => r.assessmentId === photo.assessmentId) : false;
    if (!settings.familyPhotos || !owner?.photoConsent || !released) {
      throw new AppError(403, 'no_family_photos', 'Photos are not shown in the family view for this screen.');
    }
    const stored = await deps.storage.get(size === 'thumb' ? photo.thumbKey : photo.storageKey);
    if (!stored) throw notFound('The photo file');
    res.set({ 'Content-Type': 'image/jpeg', 'Cache-Control': 'private, max-age=300', 'X-Content-Type-Options': 'nosniff' });
    res.send(stored.data);
  });

  // The e-mail's link (through the app's page) and the one-click header (RFC 8058) both land here.
  router.post('/unsubscribe/:token', publicRoute(), express.urlencoded({ extended: false, limit: '1kb' }), async (req, res) => {
    const token = String(req.params.token);
    if (!/^[A-Za-z0-9_-]{20,64}$/.test(token)) throw notFound('This unsubscribe link');
    res.json(await unsubscribe(db, token));
  });

  return router;
}
