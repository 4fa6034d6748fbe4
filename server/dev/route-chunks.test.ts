import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterEach, describe, expect, it } from 'vitest';
import vm from 'node:vm';
import { START_QUEUE_GLOBAL } from '@/features/api/client';
import {
  addRouteChunks,
  chunksFor,
  fontsFromSecondVisit,
  fontsOn,
  publicPageNames,
  renderAfresh,
  START_QUEUE,
  START_SCRIPT,
  startAfterFirstPaint,
  withChunks,
} from './route-chunks.mjs';

const JS = '/_expo/static/js/web';
const tag = (name: string) => `<script src="${JS}/${name}" defer></script>`;
// As `expo export` writes a page: the flag for hydrating the pre-rendered page, then the page and its scripts.
const HYDRATE = '<script type="module">globalThis.__EXPO_ROUTER_HYDRATE__=true;</script>';
const page = (...names: string[]) => `<html><head>${HYDRATE}</head><body><div id="root">x</div>${names.map(tag).join('')}</body></html>`;
const order = (html: string) => [...html.matchAll(/<script src="[^"]*\/([^"/]+)" defer>/g)].map((m) => m[1]);
// The chunks the start script appends, in order (its data-start attribute).
const started = (html: string) => (/<script data-start="([^"]*)">/.exec(html)?.[1]?.split(' ') ?? []).map((s) => s.replace(/^.*\//, ''));
const preloaded = (html: string) => [...html.matchAll(/<link rel="preload" as="script" href="[^"]*\/([^"/]+)" fetchpriority="low">/g)].map((m) => m[1]);

describe('every page names the chunks its first render needs', () => {
  it('adds the missing ones before the entry chunk, in the order given, and keeps what is there', () => {
    const html = page('__expo-metro-runtime-1.js', '_layout-root.js', '_layout-public.js', 'sign-in-2.js', '__common-3.js', 'entry-4.js');
    const next = withChunks(html, [`${JS}/_layout-root.js`, `${JS}/_layout-public.js`, `${JS}/_layout-club.js`]);
    expect(order(next)).toEqual([
      '__expo-metro-runtime-1.js',
      '_layout-root.js',
      '_layout-public.js',
      'sign-in-2.js',
      '__common-3.js',
      '_layout-club.js',
      'entry-4.js',
    ]);
    expect(next.replace(tag('_layout-club.js'), '')).toBe(html);
  });

  it('leaves a page that names them all as it is, and running twice adds nothing more', () => {
    const html = page('_layout-a.js', 'entry-1.js');
    expect(withChunks(html, [`${JS}/_layout-a.js`])).toBe(html);
    const once = withChunks(html, [`${JS}/_layout-b.js`]);
    expect(withChunks(once, [`${JS}/_layout-b.js`])).toBe(once);
  });

  it('refuses a page with no entry chunk rather than writing tags nowhere', () => {
    expect(() => withChunks(page('_layout-a.js'), [`${JS}/_layout-b.js`])).toThrow(/entry/);
  });

  it('gives the signed-in shell to the signed-in pages and the device store to the screening pages', () => {
    const chunks = { layouts: ['L1', 'L2'], shell: ['S'], device: ['D'] };
    const open = ['sign-in', 'accept-invite'];
    expect(chunksFor('screening/rounds/[id].html', chunks, open)).toEqual(['L1', 'L2', 'S', 'D']);
    expect(chunksFor('(club)/screening/assessments/[id].html', chunks, open)).toEqual(['L1', 'L2', 'S', 'D']);
    expect(chunksFor('index.html', chunks, open)).toEqual(['L1', 'L2', 'S']);
    expect(chunksFor('trends.html', chunks, open)).toEqual(['L1', 'L2', 'S']);
    expect(chunksFor('sign-in.html', chunks, open)).toEqual(['L1', 'L2']);
    expect(chunksFor('(public)/accept-invite.html', chunks, open)).toEqual(['L1', 'L2']);
    expect(chunksFor('+not-found.html', chunks, open)).toEqual(['L1', 'L2']);
  });

  it("reads the signed-out pages from the app's folder", () => {
    expect(publicPageNames(path.resolve(__dirname, '../..'))).toEqual(
      expect.arrayContaining(['sign-in', 'forgot-password', 'reset-password', 'accept-invite']),
    );
    expect(publicPageNames(path.resolve(__dirname, '../..'))).not.toContain('_layout');
  });
});

describe('rewriting an export folder', () => {
  let dir = '';
  afterEach(() => dir && fs.rmSync(dir, { recursive: true, force: true }));

  it('refuses an export without the signed-in shell chunk (renamed or merged) rather than leaving it to load late', () => {
    dir = fs.mkdtempSync(path.join(os.tmpdir(), 'route-chunks-'));
    const js = path.join(dir, '_expo/static/js/web');
    fs.mkdirSync(js, { recursive: true });
    for (const f of ['_layout-aa.js', 'device-cc.js', 'entry-dd.js']) fs.writeFileSync(path.join(js, f), '');
    expect(() => addRouteChunks(dir, dir)).toThrow(/club-shell/);
  });

  it('rewrites the pages, not the scripts, and names each chunk that exists', () => {
    dir = fs.mkdtempSync(path.join(os.tmpdir(), 'route-chunks-'));
    const js = path.join(dir, '_expo/static/js/web');
    fs.mkdirSync(js, { recursive: true });
    for (const f of ['_layout-aa.js', '_layout-bb.js', 'club-shell-ff.js', 'device-cc.js', 'entry-dd.js', 'sign-in-ee.js'])
      fs.writeFileSync(path.join(js, f), '');
    fs.mkdirSync(path.join(dir, 'app/(public)'), { recursive: true });
    for (const f of ['_layout.tsx', 'sign-in.tsx']) fs.writeFileSync(path.join(dir, 'app/(public)', f), '');
    fs.mkdirSync(path.join(dir, 'screening/rounds'), { recursive: true });
    const fonts = '<style id="expo-generated-fonts">@font-face{font-family:"A";src:url("/a.ttf")}</style>';
    fs.writeFileSync(path.join(dir, 'sign-in.html'), page('_layout-aa.js', 'sign-in-ee.js', 'entry-dd.js').replace('</head>', `${fonts}</head>`));
    fs.writeFileSync(path.join(dir, 'screening/rounds/[id].html'), page('_layout-aa.js', '_layout-bb.js', 'entry-dd.js'));
    expect(addRouteChunks(dir, dir)).toBe(2);
    // The twin with the fonts on, for browsers that have the files; none for a page without font rules.
    const twin = fs.readFileSync(path.join(dir, '_fonts/sign-in.html'), 'utf8');
    expect(twin).toContain(fonts);
    expect(fs.readFileSync(path.join(dir, 'sign-in.html'), 'utf8')).toBe(fontsFromSecondVisit(twin));
    expect(fs.existsSync(path.join(dir, '_fonts/screening/rounds/[id].html'))).toBe(false);
    const signIn = fs.readFileSync(path.join(dir, 'sign-in.html'), 'utf8');
    expect(order(signIn)).toEqual([]);
    expect(signIn).toContain(START_SCRIPT);
    expect(signIn).not.toContain('__EXPO_ROUTER_HYDRATE__');
    expect(started(signIn)).toEqual(['_layout-aa.js', 'sign-in-ee.js', '_layout-bb.js', 'entry-dd.js']);
    expect(preloaded(signIn)).toEqual(['entry-dd.js']);
    expect(started(fs.readFileSync(path.join(dir, 'screening/rounds/[id].html'), 'utf8'))).toEqual([
      '_layout-aa.js',
      '_layout-bb.js',
      'club-shell-ff.js',
      'device-cc.js',
      'entry-dd.js',
    ]);
    expect(addRouteChunks(dir, dir)).toBe(0);
    expect(fs.readFileSync(path.join(dir, '_fonts/sign-in.html'), 'utf8')).toBe(twin);
    expect(fs.existsSync(path.join(dir, '_fonts/_fonts'))).toBe(false);
  });
});

describe('the scripts start after the first paint', () => {
  it('names every chunk in order on one start script where the tags were, and preloads only the entry chunk from the head', () => {
    const html = page('__expo-metro-runtime-1.js', '_layout-root.js', 'sign-in-2.js', 'entry-4.js');
    const next = startAfterFirstPaint(html);
    expect(order(next)).toEqual([]);
    expect(started(next)).toEqual(['__expo-metro-runtime-1.js', '_layout-root.js', 'sign-in-2.js', 'entry-4.js']);
    expect(preloaded(next)).toEqual(['entry-4.js']);
    expect(next.indexOf('fetchpriority="low">')).toBeLessThan(next.indexOf('</head>'));
    expect(next.split(START_SCRIPT)).toHaveLength(2);
    expect(next).toMatch(/<div id="root">x<\/div><script data-start="[^"]+">.*<\/script><\/body>/);
  });

  it('leaves a rewritten page, and a page without scripts, as they are; refuses a page without an entry chunk', () => {
    const once = startAfterFirstPaint(page('_layout-a.js', 'entry-1.js'));
    expect(startAfterFirstPaint(once)).toBe(once);
    expect(startAfterFirstPaint(page())).toBe(page());
    expect(() => startAfterFirstPaint(page('_layout-a.js'))).toThrow(/entry/);
  });

  it("runs the queue that the page's head fills (the early API requests)", () => {
    expect(START_QUEUE).toBe(START_QUEUE_GLOBAL);
    expect(fs.readFileSync(path.resolve(__dirname, '../../app/+html.tsx'), 'utf8')).toContain('START_QUEUE_GLOBAL}||[]).push(');
  });

  // The start script run against a stand-in for the browser: what it runs and appends, and when.
  function browser(visibility: 'visible' | 'hidden', paintTiming = true) {
    const log: string[] = [];
    const appended: { src: string; async: boolean }[] = [];
    const frames: (() => void)[] = [];
    const timers: { ms: number; fn: () => void }[] = [];
    const observers: { fn: (list: { getEntries: () => { name: string }[] }, obs: { disconnect: () => void }) => void; connected: boolean }[] = [];
    const document = {
      visibilityState: visibility,
      currentScript: { getAttribute: (name: string) => (name === 'data-start' ? '/a.js /b.js /entry.js' : null) },
      createElement: () => ({ src: '', async: true }),
      body: {
        appendChild: (s: { src: string; async: boolean }) => {
          appended.push({ ...s });
          log.push(`script ${s.src}`);
        },
      },
    };
    class PerformanceObserver {
      static supportedEntryTypes = paintTiming ? ['paint', 'largest-contentful-paint'] : ['navigation'];
      private entry;
      constructor(fn: (typeof observers)[number]['fn']) {
        this.entry = { fn, connected: false };
        observers.push(this.entry);
      }
      observe(options: { type: string; buffered: boolean }) {
        expect(options).toEqual({ type: 'paint', buffered: true });
        this.entry.connected = true;
      }
    }
    const window = {
      requestAnimationFrame: (fn: () => void) => frames.push(fn),
      PerformanceObserver,
      [START_QUEUE]: [
        () => log.push('early requests'),
        () => {
          throw new Error('a queued function that fails');
        },
      ],
    };
    const setTimeout = (fn: () => void, ms: number) => timers.push({ fn, ms });
    vm.runInNewContext(START_SCRIPT, { document, window, setTimeout });
    const paint = (name: string) =>
      observers.forEach((o) => o.connected && o.fn({ getEntries: () => [{ name }] }, { disconnect: () => (o.connected = false) }));
    // Runs the timers of that delay that are due now (each once), not those they set.
    const run = (ms: number) => timers.splice(0).forEach((t) => (t.ms === ms ? t.fn() : timers.push(t)));
    return { log, appended, frames, paint, run };
  }
  const ALL = [
    { src: '/a.js', async: false },
    { src: '/b.js', async: false },
    { src: '/entry.js', async: false },
  ];

  it('starts nothing before the first contentful paint, then the queue and every chunk in order, not async, once', () => {
    const b = browser('visible');
    b.run(0);
    b.paint('first-paint'); // the background only: still nothing
    b.run(0);
    expect(b.log).toEqual([]);
    b.paint('first-contentful-paint');
    expect(b.log).toEqual([]); // not inside the paint's own callback: in the task after it
    b.run(0);
    expect(b.log).toEqual(['early requests']); // the scripts in the task after that
    b.run(0);
    expect(b.log).toEqual(['early requests', 'script /a.js', 'script /b.js', 'script /entry.js']);
    expect(b.appended).toEqual(ALL);
    b.run(500); // the fallback comes later and adds nothing
    b.paint('first-contentful-paint');
    b.run(0);
    expect(b.log).toHaveLength(4);
  });

  it('without paint timing, starts in the task after the next frame', () => {
    const b = browser('visible', false);
    b.frames.forEach((f) => f());
    expect(b.appended).toEqual([]);
    b.run(0);
    b.run(0);
    expect(b.appended).toEqual(ALL);
  });

  it('starts after half a second when nothing is painted, and at once on a hidden page', () => {
    const held = browser('visible');
    held.run(500);
    held.run(0);
    expect(held.appended).toEqual(ALL);
    const hidden = browser('hidden');
    hidden.run(0);
    expect(hidden.appended).toEqual(ALL);
  });
});

describe('the app renders the page afresh', () => {
  it('takes the hydrate flag out and nothing else; a second run or a page without it changes nothing', () => {
    const before = page('entry-dd.js');
    const next = renderAfresh(before);
    expect(next).toBe(before.replace(HYDRATE, ''));
    expect(next).not.toContain('__EXPO_ROUTER_HYDRATE__');
    expect(renderAfresh(next)).toBe(next);
  });
});

describe('web fonts from the second visit on', () => {
  const FONTS = '<style id="expo-generated-fonts">@font-face{font-family:"A";src:url("/a.ttf");font-display:optional}</style>';
  const withFonts = `<html><head>${FONTS}</head><body></body></html>`;

  it('switches the rules off with no script in the page; a second run or a page without rules changes nothing', () => {
    const next = fontsFromSecondVisit(withFonts);
    expect(next).toBe(
      '<html><head><style id="expo-generated-fonts" media="not all">@font-face{font-family:"A";src:url("/a.ttf");font-display:optional}</style></head><body></body></html>',
    );
    expect(fontsFromSecondVisit(next)).toBe(next);
    expect(fontsFromSecondVisit(page())).toBe(page());
  });

  it('the twin has them on again, and nothing else differs', () => {
    expect(fontsOn(fontsFromSecondVisit(withFonts))).toBe(withFonts);
    expect(fontsOn(page())).toBe(page());
  });
});
