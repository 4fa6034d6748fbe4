import { Router } from 'express';
import type { Db } from '@/db/client';
import type { Outbox } from '@/server/mail/outbox';
import type { PhotoStorage } from '@/server/storage/storage';
import { auditTrailMiddleware } from './audit-middleware';
import { auditRouter } from './audit.router';
import { clearanceRouter } from './clearance.router';
import { notesRouter } from './notes.router';
import { retentionRouter } from './retention.router';
import { reviewsRouter } from './reviews.router';
import { summaryRouter } from './summary.router';

/**
 * The care team: reviews, notes, clearance, family summaries and their e-mails, retention, audit.
 * Every route states its access with guard() (or publicRoute() for the unsubscribe link), so this
 * router is mounted before the app's sign-in wall: guard() answers 401 itself.
 */
export function careRouter(deps: { db: Db; storage: PhotoStorage; outbox: Outbox; publicUrl: string }) {
  const router = Router();
  // Views and changes of athletes, assessments and consents made through other capabilities' routes.
  router.use(auditTrailMiddleware(deps.db));
  router.use(reviewsRouter(deps.db));
  router.use(notesRouter(deps.db));
  router.use(clearanceRouter(deps.db));
  router.use(summaryRouter(deps));
  router.use(auditRouter(deps.db));
  router.use(retentionRouter(deps.db, deps.storage));
  return router;
}
