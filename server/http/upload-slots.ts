import type { RequestHandler } from 'express';
import { AppError } from './errors';

export type UploadSlotOptions = {
  /** Uploads read and processed at once. */
  slots?: number;
  /** Uploads waiting for a slot, at most. */
  maxWaiting?: number;
  /** A newcomer expected to wait longer than this for a slot is refused at once. */
  maxWaitMs?: number;
};

/** Weight of the newest upload in the running average of how long an upload holds its slot. */
const HOLD_SMOOTHING = 0.2;

/**
 * Bounds the uploads read at the same time. A request waits for a slot before its body is read (the
 * socket is not read meanwhile, so a waiting upload costs no memory); the slot is freed when the
 * response ends. With multer's memory storage at most `slots` x the size limit is held, plus sharp's
 * work on them.
 *
 * A server that cannot keep up answers at once rather than after the phone has given up: a newcomer
 * is refused (503 `busy`, with Retry-After) when the uploads already waiting, going through `slots`
 * at a time at the recent pace (a running average of how long an upload held its slot), would keep
 * it waiting longer than `maxWaitMs`, or when `maxWaiting` are already waiting. The app's outbox
 * sends it again after the wait. Numbers: our choice for a 2-core server; 20 s stays under the 30 s
 * after which clients and proxies commonly give up on an answer (common practice, no source).
 */
export function uploadSlots({ slots = 4, maxWaiting = 64, maxWaitMs = 20_000 }: UploadSlotOptions = {}) {
  let active = 0;
  let maxActive = 0;
  let refused = 0;
  /** How long an upload has recently held its slot (ms); 0 until one has finished. */
  let holdMs = 0;
  const waiting: (() => void)[] = [];

  const release = () => {
    const next = waiting.shift();
    if (next) next();
    else active--;
  };

  /** How long a request arriving now would wait for a slot, at the recent pace. */
  const expectedWaitMs = () => Math.ceil((waiting.length + 1) / slots) * holdMs;

  const middleware: RequestHandler = (req, res, next) => {
    const start = () => {
      // The caller gave up while waiting: hand the slot on.
      if (res.destroyed || req.socket?.destroyed) return release();
      maxActive = Math.max(maxActive, active);
      const startedAt = performance.now();
      let done = false;
      const free = () => {
        if (done) return;
        done = true;
        holdMs = holdMs === 0 ? performance.now() - startedAt : (1 - HOLD_SMOOTHING) * holdMs + HOLD_SMOOTHING * (performance.now() - startedAt);
        release();
      };
      res.on('finish', free);
      res.on('close', free);
      next();
    };
    if (active < slots) {
      active++;
      return start();
    }
    const wait = expectedWaitMs();
    if (waiting.length >= maxWaiting || wait > maxWaitMs) {
      refused++;
      res.setHeader('Retry-After', String(Math.min(30, Math.max(2, Math.ceil(wait / 1000)))));
      return next(new AppError(503, 'busy', 'Many photos are being uploaded right now. Yours will be retried in a moment.'));
    }
    // A slot handed over by `release` keeps `active` as it is.
    waiting.push(start);
    res.on('close', () => {
      const i = waiting.indexOf(start);
      if (i >= 0) waiting.splice(i, 1);
    });
  };

  return {
    middleware,
    stats: () => ({ active, waiting: waiting.length, maxActive, refused, holdMs, expectedWaitMs: expectedWaitMs() }),
  };
}

export type UploadSlots = ReturnType<typeof uploadSlots>;
