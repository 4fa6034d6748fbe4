// Main-thread blocking read from the browser's own thread CPU time, for `npm run bench:web`.
//
// Lighthouse's blocking time is wall-clock time on this machine, scaled by its simulation; on a shared
// machine whose cores are taken away now and then (steal time), one page's blocking moved by a factor
// of two from one run to the next. Here Chromium loads the page unthrottled with a trace, and each main-
// thread task after the first contentful paint counts with its thread CPU time (`tdur`, which does not
// advance while the core is taken away) times 4, Lighthouse's CPU slowdown, less 50 ms: the same rule as
// total blocking time (our choice of measure; Lighthouse itself does not read thread time).
import { chromium } from '@playwright/test';

/** Opens a browser; `measure(url, cookie)` loads one page and returns { blockingMs, busyMs }. */
export async function cpuBlockingMeter({ executablePath = process.env.CHROMIUM_PATH ?? '/usr/bin/chromium', settleMs = 5000 } = {}) {
  const browser = await chromium.launch({ executablePath, args: ['--no-sandbox', '--disable-gpu'] });
  async function measure(url, cookie) {
    const context = await browser.newContext({ viewport: { width: 412, height: 823 }, serviceWorkers: 'block' });
    try {
      if (cookie) {
        await context.addCookies(
          cookie.split('; ').map((c) => {
            const at = c.indexOf('=');
            // For the whole site: given the page's own URL, the cookie's path would be that page's folder
            // (`/screening/rounds`) and the app's `/api` requests would go without it.
            return { name: c.slice(0, at), value: c.slice(at + 1), domain: new URL(url).hostname, path: '/' };
          }),
        );
      }
      const page = await context.newPage();
      const cdp = await context.newCDPSession(page);
      const events = [];
      cdp.on('Tracing.dataCollected', (d) => events.push(...d.value));
      const done = new Promise((resolve) => cdp.once('Tracing.tracingComplete', resolve));
      await cdp.send('Tracing.start', { categories: 'devtools.timeline,disabled-by-default-devtools.timeline,loading', transferMode: 'ReportEvents' });
      await page.goto(url, { waitUntil: 'load' });
      await page.waitForTimeout(settleMs);
      await cdp.send('Tracing.end');
      await done;
      // A signed-in page that went to sign-in measured another page.
      if (new URL(page.url()).pathname !== new URL(url).pathname) throw new Error(`Asked for ${url}, ended at ${page.url()}.`);
      return blockingFromTrace(events);
    } finally {
      await context.close();
    }
  }
  return { measure, close: () => browser.close() };
}

/** From a trace's events: thread-time blocking after the first contentful paint (x4, less 50 ms per task) and all main-thread CPU time (x4). */
export function blockingFromTrace(events) {
  const fcp = events.find((e) => e.name === 'firstContentfulPaint');
  if (!fcp) throw new Error('The page painted nothing (no first contentful paint in the trace).');
  const main = events.find((e) => e.name === 'thread_name' && e.pid === fcp.pid && e.args?.name === 'CrRendererMain');
  const tid = main?.tid ?? fcp.tid;
  const tasks = events.filter((e) => e.name === 'RunTask' && e.pid === fcp.pid && e.tid === tid && typeof e.tdur === 'number');
  const scaled = (e) => (4 * e.tdur) / 1000;
  return {
    blockingMs: tasks.filter((e) => e.ts + e.dur > fcp.ts).reduce((sum, e) => sum + Math.max(0, scaled(e) - 50), 0),
    busyMs: tasks.reduce((sum, e) => sum + scaled(e), 0),
  };
}
