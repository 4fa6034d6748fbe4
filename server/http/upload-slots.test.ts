import { EventEmitter } from 'node:events';
import type { Request, Response } from 'express';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { AppError } from './errors';
import { uploadSlots, type UploadSlotOptions } from './upload-slots';

/** A request as the middleware sees it: a response that can finish or close, and its headers. */
function fakeUpload() {
  const res = Object.assign(new EventEmitter(), { destroyed: false, headers: {} as Record<string, string> }) as EventEmitter & {
    destroyed: boolean;
    headers: Record<string, string>;
    setHeader(name: string, value: string): void;
  };
  res.setHeader = (name, value) => {
    res.headers[name] = value;
  };
  const req = { socket: { destroyed: false } };
  let outcome: 'waiting' | 'started' | AppError = 'waiting';
  return {
    req: req as unknown as Request,
    res: res as unknown as Response,
    headers: res.headers,
    next: (error?: unknown) => {
      outcome = error instanceof AppError ? error : 'started';
    },
    outcome: () => outcome,
    finish: () => res.emit('finish'),
    leave: () => {
      res.destroyed = true;
      req.socket.destroyed = true;
      res.emit('close');
    },
  };
}

function arrive(slots: ReturnType<typeof uploadSlots>) {
  const u = fakeUpload();
  slots.middleware(u.req, u.res, u.next);
  return u;
}

/** Four uploads arriving one after another. */
const arriveFour = (slots: ReturnType<typeof uploadSlots>) => [arrive(slots), arrive(slots), arrive(slots), arrive(slots)] as const;

describe('upload slots', () => {
  const options: UploadSlotOptions = { slots: 2, maxWaiting: 10, maxWaitMs: 60_000 };

  it('starts `slots` uploads at once and the next in order of arrival as each ends', () => {
    const slots = uploadSlots(options);
    const u = arriveFour(slots);
    expect(u.map((x) => x.outcome())).toEqual(['started', 'started', 'waiting', 'waiting']);
    u[1].finish();
    expect(u.map((x) => x.outcome())).toEqual(['started', 'started', 'started', 'waiting']);
    u[0].finish();
    u[2].finish();
    u[3].finish();
    expect(slots.stats()).toMatchObject({ active: 0, waiting: 0, maxActive: 2, refused: 0 });
  });

  it('hands the slot of a caller who left while waiting to the next one', () => {
    const slots = uploadSlots(options);
    const [first, , leaving, next] = arriveFour(slots);
    leaving.leave();
    first.finish();
    expect(leaving.outcome()).toBe('waiting');
    expect(next.outcome()).toBe('started');
  });

  it('refuses at once, with Retry-After, when too many are waiting', () => {
    const slots = uploadSlots({ ...options, maxWaiting: 1 });
    const u = arriveFour(slots);
    expect(u.slice(0, 3).map((x) => x.outcome())).toEqual(['started', 'started', 'waiting']);
    const refused = u[3].outcome();
    expect(refused).toBeInstanceOf(AppError);
    expect(refused).toMatchObject({ status: 503, code: 'busy' });
    expect(Number(u[3].headers['Retry-After'])).toBeGreaterThanOrEqual(2);
  });

  afterEach(() => {
    vi.useRealTimers();
  });

  it('refuses a newcomer whose wait at the recent pace would pass maxWaitMs, and takes one again once the queue is short', () => {
    vi.useFakeTimers({ toFake: ['performance'] });
    // One slot, an upload holding it 60 ms: a newcomer behind one waiting upload would wait 120 ms.
    const slots = uploadSlots({ slots: 1, maxWaiting: 10, maxWaitMs: 100 });
    const warm = arrive(slots);
    vi.advanceTimersByTime(60);
    warm.finish();
    expect(slots.stats().holdMs).toBe(60);

    const holding = arrive(slots);
    const second = arrive(slots); // expected wait 60 ms: admitted
    const third = arrive(slots); // 120 ms: refused
    expect([holding.outcome(), second.outcome()]).toEqual(['started', 'waiting']);
    expect(third.outcome()).toMatchObject({ status: 503, code: 'busy' });
    expect(third.headers['Retry-After']).toBe('2');
    expect(slots.stats()).toMatchObject({ refused: 1, waiting: 1 });

    holding.finish(); // held 0 ms: the pace is now 0.8 x 60 + 0.2 x 0 = 48 ms
    expect(second.outcome()).toBe('started');
    expect(slots.stats().holdMs).toBeCloseTo(48);
    const fourth = arrive(slots); // nobody waiting ahead of it: 48 ms, admitted
    expect(fourth.outcome()).toBe('waiting');
  });
});
