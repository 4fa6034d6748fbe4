// `Idempotency-Key` on changes sent from a device's outbox (draft saves, photo uploads, submits): the
// first request with a key runs and its answer is stored; a repeat with the same key (a retry after
// the answer was lost) gets the stored answer and runs nothing. Keys are per signed-in person.
//
// Minimal version written with the offline work; the fuller one (per-route fingerprints, expiry) may
// replace it as long as it keeps: table keyed by user + key, replay of the stored status and body, a
// 409 `request_in_progress` while the first request runs, 5xx answers not stored.
import { and, eq } from 'drizzle-orm';
import type { RequestHandler } from 'express';
import type { Db } from '@/db/client';
import { idempotencyKeys } from '@/db/schema';
import { AppError, badRequest } from './errors';

export const IDEMPOTENCY_HEADER = 'Idempotency-Key';
/** A first request that never finished (the server stopped) frees its key after this long (our choice). */
const STALE_MS = 2 * 60 * 1000;
const CHANGES = new Set(['POST', 'PUT', 'PATCH', 'DELETE']);

export function idempotencyMiddleware(db: Db): RequestHandler {
  return async (req, res, next) => {
    const key = req.get(IDEMPOTENCY_HEADER);
    if (key === undefined || !CHANGES.has(req.method) || !req.user) return next();
    try {
      if (!/^[\w.:-]{8,200}$/.test(key)) {
        throw badRequest('Some fields need attention.', { idempotencyKey: 'The Idempotency-Key header must be 8-200 letters, digits or -_.:' });
      }
      const userId = req.user.id;
      const path = req.originalUrl.split('?')[0]!;
      const where = and(eq(idempotencyKeys.userId, userId), eq(idempotencyKeys.key, key));
      const inserted = await db
        .insert(idempotencyKeys)
        .values({ userId, key, method: req.method, path })
        .onConflictDoNothing()
        .returning({ key: idempotencyKeys.key });
      if (inserted.length === 0) {
        const [row] = await db.select().from(idempotencyKeys).where(where);
        if (!row) throw new AppError(409, 'request_in_progress', 'This change is being saved. Try again in a moment.');
        if (row.method !== req.method || row.path !== path) {
          throw new AppError(422, 'idempotency_key_reused', 'This Idempotency-Key was already used for another request.');
        }
        if (row.status === null) {
          if (Date.now() - row.createdAt.getTime() > STALE_MS) {
            await db.delete(idempotencyKeys).where(where);
          } else {
            throw new AppError(409, 'request_in_progress', 'This change is being saved. Try again in a moment.');
          }
        } else {
          req.resume(); // an upload's body is not needed: discard it so the connection stays usable
          res.set('Idempotent-Replayed', 'true');
          if (row.body === null) res.status(row.status).end();
          else res.status(row.status).json(row.body);
          return;
        }
        await db.insert(idempotencyKeys).values({ userId, key, method: req.method, path }).onConflictDoNothing();
      }
      // The answer is stored as it is written, even if the device is gone by then (the connection
      // dropped): that is exactly the case a retry needs it for.
      let stored = false;
      const json = res.json.bind(res);
      res.json = (value: unknown) => {
        stored = true;
        // A server error is not an answer worth keeping: the retry runs the request again.
        const done =
          res.statusCode >= 500
            ? db.delete(idempotencyKeys).where(where)
            : db.update(idempotencyKeys).set({ status: res.statusCode, body: value ?? null }).where(where);
        // Stored before the answer leaves, so a retry right after it always finds it.
        void done.catch(() => undefined).then(() => json(value));
        return res;
      };
      res.on('close', () => {
        if (!stored) db.delete(idempotencyKeys).where(where).catch(() => undefined);
      });
      next();
    } catch (error) {
      req.resume();
      next(error);
    }
  };
}
