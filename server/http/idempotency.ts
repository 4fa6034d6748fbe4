import { createHash } from 'node:crypto';
import { sql } from 'drizzle-orm';
import type { RequestHandler } from 'express';
import type { Db } from '@/db/client';
import { AppError, badRequest } from './errors';

/**
 * `Idempotency-Key` on any write (draft saves, photo uploads, submits, and whatever comes later): a phone
 * that lost the answer to a request can send it again with the same key and get the first answer back,
 * instead of the server doing the work twice. Keys are per user and kept for a day, in PostgreSQL, so
 * every server process sees the same keys.
 *
 * - First request with a key: claims it (one INSERT), runs, and a 2xx answer is stored with the key.
 *   Any other answer releases the key: the request changed nothing, and a retry runs again.
 * - Same key while the first still runs: 409 `request_in_progress` (retry shortly).
 * - Same key, same request, after a 2xx: the stored answer, status and body, with
 *   `Idempotent-Replayed: true`.
 * - Same key, another request (method, path or JSON body differ): 422 `idempotency_key_reused`.
 * - A claim whose request never answered (the process died) is taken over after `abandonAfterMs`.
 *
 * Multipart bodies (photo uploads) are not read here, so for them the fingerprint is method and path.
 */

export const IDEMPOTENCY_HEADER = 'Idempotency-Key';
const KEY = /^[\x21-\x7e]{8,200}$/;
const WRITE = new Set(['POST', 'PUT', 'PATCH', 'DELETE']);

export type IdempotencyOptions = { abandonAfterMs?: number; keepForMs?: number };

/** JSON with sorted keys, so `{a,b}` and `{b,a}` are the same request. */
function canonical(value: unknown): string {
  if (Array.isArray(value)) return `[${value.map(canonical).join(',')}]`;
  if (value && typeof value === 'object') {
    return `{${Object.keys(value)
      .sort()
      .map((k) => `${JSON.stringify(k)}:${canonical((value as Record<string, unknown>)[k])}`)
      .join(',')}}`;
  }
  return JSON.stringify(value) ?? 'null';
}

export function idempotency(db: Db, options: IdempotencyOptions = {}): RequestHandler {
  const abandonAfter = `${Math.round((options.abandonAfterMs ?? 30_000) / 1000)} seconds`;
  const keepFor = `${Math.round((options.keepForMs ?? 24 * 3600 * 1000) / 1000)} seconds`;
  let lastPurge = 0;

  return async (req, res, next) => {
    const key = req.get(IDEMPOTENCY_HEADER);
    if (key === undefined || !WRITE.has(req.method) || !req.user) return next();
    if (!KEY.test(key)) {
      req.resume();
      throw badRequest('The Idempotency-Key header is not a usable key.', {
        [IDEMPOTENCY_HEADER]: 'Use 8 to 200 visible ASCII characters, for example a UUID made on the device.',
      });
    }
    const userId = req.user.id;
    const path = req.originalUrl.split('?')[0]!;
    const body = req.is('application/json') ? canonical(req.body ?? null) : '';
    const fingerprint = createHash('sha256').update(`${req.method} ${req.originalUrl}\n${body}`).digest('hex');

    if (Date.now() - lastPurge > 10 * 60 * 1000) {
      lastPurge = Date.now();
      db.execute(sql`delete from idempotency_keys where created_at < now() - ${keepFor}::interval`).catch(() => undefined);
    }

    // Claim the key, or take over one that expired or whose request was abandoned.
    const claimed = await db.execute(sql`
      insert into idempotency_keys (user_id, key, method, path, fingerprint)
      values (${userId}, ${key}, ${req.method}, ${path}, ${fingerprint})
      on conflict (user_id, key) do update
        set method = excluded.method, path = excluded.path, fingerprint = excluded.fingerprint,
            status = null, response = null, created_at = now()
        where idempotency_keys.created_at < now() - ${keepFor}::interval
           or (idempotency_keys.status is null and idempotency_keys.created_at < now() - ${abandonAfter}::interval)
      returning 1`);

    if (claimed.rows.length === 0) {
      req.resume();
      const found = await db.execute<{ fingerprint: string; status: number | null; response: unknown }>(
        sql`select fingerprint, status, response from idempotency_keys where user_id = ${userId} and key = ${key}`,
      );
      const row = found.rows[0];
      if (!row) throw new AppError(409, 'request_in_progress', 'This request is being processed. Send it again in a moment.');
      if (row.fingerprint !== fingerprint) {
        throw new AppError(422, 'idempotency_key_reused', 'This Idempotency-Key was already used for a different request. Make a new key for a new request.');
      }
      if (row.status === null) {
        res.setHeader('Retry-After', '1');
        throw new AppError(409, 'request_in_progress', 'The same request is still being processed. Send it again in a moment.');
      }
      res.setHeader('Idempotent-Replayed', 'true');
      res.status(row.status).json(row.response);
      return;
    }

    // Ours: keep a 2xx answer, release the key on anything else. The answer goes out once stored, so a
    // retry can never arrive between the answer and the record of it.
    let settled = false;
    const release = () => db.execute(sql`delete from idempotency_keys where user_id = ${userId} and key = ${key} and status is null`);
    const send = res.json.bind(res);
    res.json = (payload: unknown) => {
      if (settled) return send(payload);
      settled = true;
      const status = res.statusCode;
      const record =
        status >= 200 && status < 300
          ? db.execute(
              sql`update idempotency_keys set status = ${status}, response = ${JSON.stringify(payload ?? null)}::jsonb where user_id = ${userId} and key = ${key}`,
            )
          : release();
      record.catch((err: unknown) => req.log?.warn({ err }, 'idempotency key not recorded')).finally(() => send(payload));
      return res;
    };
    // Answers that never went through res.json (a stream, an empty body) leave nothing to replay.
    res.on('finish', () => {
      if (!settled) {
        settled = true;
        release().catch(() => undefined);
      }
    });
    next();
  };
}
