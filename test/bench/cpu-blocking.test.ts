import { describe, expect, it } from 'vitest';
import { blockingFromTrace } from './cpu-blocking.mjs';

// A hand-made trace: renderer pid 1, main thread 10, a worker thread 11; times in microseconds.
const main = { name: 'thread_name', pid: 1, tid: 10, args: { name: 'CrRendererMain' } };
const fcp = { name: 'firstContentfulPaint', pid: 1, tid: 10, ts: 1_000_000 };
const task = (ts: number, dur: number, tdur: number, tid = 10) => ({ name: 'RunTask', pid: 1, tid, ts, dur, tdur });

describe('blocking from thread CPU time', () => {
  it('counts each main-thread task that ends after the first paint: 4 x its CPU time, less 50 ms', () => {
    const events = [
      main,
      fcp,
      task(100_000, 200_000, 40_000), // before the paint: CPU 160 ms, not blocking
      task(900_000, 150_000, 30_000), // ends after the paint: 120 - 50 = 70 ms
      task(1_200_000, 400_000, 10_000), // long on the clock (cores taken away), 40 ms of CPU: 0
      task(1_700_000, 100_000, 25_000), // exactly 100 ms: 50 ms
      task(1_800_000, 500_000, 100_000, 11), // another thread: not counted
    ];
    // Worked by hand: 70 + 0 + 50 = 120 ms; CPU 160 + 120 + 40 + 100 = 420 ms.
    expect(blockingFromTrace(events)).toEqual({ blockingMs: 120, busyMs: 420 });
  });

  it('refuses a trace without a first paint rather than reporting no blocking', () => {
    expect(() => blockingFromTrace([main, task(0, 100_000, 50_000)])).toThrow(/painted nothing/);
  });
});
