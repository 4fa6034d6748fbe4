import type { RequestHandler } from 'express';
import { AppError } from './errors';

/**
 * Bounds the uploads read at the same time. A request waits for a slot before its body is read (the
 * socket is not read meanwhile, so a waiting upload costs no memory); the slot is freed when the
 * response ends. With multer's memory storage at most `slots` x the size limit is held, plus sharp's
 * work on them. Too many waiting: 503 with Retry-After. Numbers: our choice for a 2-core server.
 */
export function uploadSlots(slots = 4, maxWaiting = 64) {
  let active = 0;
  let maxActive = 0;
  const waiting: (() => void)[] = [];

  const release = () => {
    const next = waiting.shift();
    if (next) next();
    else active--;
  };

  const middleware: RequestHandler = (req, res, next) => {
    const start = () => {
      // The caller gave up while waiting: hand the slot on.
      if (res.destroyed || req.socket?.destroyed) return release();
      maxActive = Math.max(maxActive, active);
      let done = false;
      const free = () => {
        if (done) return;
        done = true;
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
    if (waiting.length >= maxWaiting) {
      res.setHeader('Retry-After', '5');
      return next(new AppError(503, 'busy', 'Many photos are being uploaded right now. Yours will be retried in a moment.'));
    }
    // A slot handed over by `release` keeps `active` as it is.
    waiting.push(start);
    res.on('close', () => {
      const i = waiting.indexOf(start);
      if (i >= 0) waiting.splice(i, 1);
    });
  };

  return { middleware, stats: () => ({ active, waiting: waiting.length, maxActive }) };
}

export type UploadSlots = ReturnType<typeof uploadSlots>;
