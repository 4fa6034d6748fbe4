// Names in each page's HTML the script chunks its first render needs but `expo export` leaves out, so
// the browser fetches them with the others instead of after the app has started. Run after
// `expo export` (by ensureWebBuild in bootstrap.mjs), before the service worker step (it precaches the
// HTML as changed here):
//
//   node server/dev/route-chunks.mjs dist
//
// 1. Every layout chunk, on every page. Expo Router loads every layout of the app before the first
//    render (it reads each layout's settings), but each page's HTML names only its own layouts: the
//    sign-in page started only after the signed-in layout had been fetched, and every signed-in page
//    after the signed-out layout (our measurement in Chromium: a second script fetch and a second long
//    task before the page responds; on a slow connection, at least one more round trip).
// 2. The signed-in shell (features/shell/components/club-shell.tsx, its own chunk: the signed-in layout
//    loads it lazily so that the sign-in page does not run it) on every page but the signed-out ones.
// 3. The device store (features/offline/device.ts, its own chunk) on the screening pages: only people
//    who screen reach them, and the store opens before their screens render (DeviceGate).
//
// A chunk named here is defined before the app starts; Expo's import on the web takes an already
// defined module at once instead of fetching its chunk again.
//
// 4. The scripts start after the first paint (`startAfterFirstPaint`). One small inline script, run when
//    the browser reports its first contentful paint, starts the page's early API requests (app/+html.tsx)
//    and appends the chunks as scripts, in order. Only the entry chunk, by far the largest, is fetched
//    from the head at once (a low-priority preload, as deferred scripts are fetched): the app cannot
//    start before it, and the small chunks requested at the paint arrive while it downloads.
//    Why: deferred script tags ran before the first paint whenever they had arrived (always on a fast
//    connection), so the painted page waited for them; and Lighthouse's simulation of a slow phone counts
//    every request that ended before the largest paint and whose running it cannot see separately (small
//    scripts, the session request) as needed for that paint (our measurement: sign-in painted at 0.3 s,
//    simulated LCP 1.2 s against an FCP of 0.8 s). Text typed into a pre-rendered field before the app
//    starts is kept (`useTypedBeforeStart` in features/ui).
//
// 5. Web fonts from the second visit on (`fontsFromSecondVisit`). The @font-face rules the pre-rendering
//    writes (`<style id="expo-generated-fonts">`) are switched off (`media="not all"`), and each page gets
//    a twin under `_fonts/` with them on (`fontsOn`). The server sends the twin when the request carries
//    the cookie features/ui/font-cache.web.ts sets once it has fetched the font files, after the first
//    visit is idle (FONTS_COOKIE; server/web/serve-export.ts). On a first visit the page is drawn in the
//    system face throughout: with `font-display: optional` a slow connection kept that face anyway, and
//    the two font files (50 KB) no longer compete with the scripts at the highest priority. Lighthouse's
//    simulation counted them as needed for the first paint whenever they arrived before it (our
//    measurement: sign-in FCP 0.7 or 1.1 s from one run to the next). The choice is the server's, not a
//    script's in the head: reading the browser's storage (or its cookies) from the page is a synchronous
//    call to the browser process, 12-16 ms before the first paint in our traces of the sign-in page
//    (4 times that in Lighthouse's simulation of a slower phone).
//
// 6. The app renders the page afresh instead of hydrating the pre-rendered one (`renderAfresh`: the
//    export's `__EXPO_ROUTER_HYDRATE__` flag is taken out). Hydration left every route's Suspense
//    boundary for later, and the first state change above it (the safe-area frame, measured in an
//    effect; the navigators' bookkeeping) made React hydrate the whole page in one synchronous render:
//    one long task of 0.3-0.6 s on a 4x slower CPU (our measurement in Chromium: React's commits and the
//    updates that forced them). A fresh render is one transition that React splits into short tasks; the
//    pre-rendered page stays on screen until the app's page replaces it in one commit, drawn the same.
//    What was typed into a pre-rendered field is handed over (`useTypedBeforeStart` in features/ui).
//
// Plain Node: it runs inside the bootstrap.
import fs from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { htmlFiles } from './service-worker.mjs';

const ROOT = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..', '..');
const SCRIPTS = '_expo/static/js/web';
const SCRIPT_TAG = /<script src="([^"]+)" defer><\/script>/g;

/**
 * The HTML with a deferred script tag for each source it does not name yet, placed before the entry
 * chunk (the one that starts the app; deferred scripts run in document order).
 */
export function withChunks(html, sources) {
  const tags = [...html.matchAll(SCRIPT_TAG)];
  const named = new Set(tags.map((m) => m[1]));
  const missing = sources.filter((s) => !named.has(s));
  if (!missing.length) return html;
  const entry = tags.find((m) => /\/entry-[^/]*$/.test(m[1]));
  if (!entry) throw new Error('The page names no entry chunk: is this an `expo export` page?');
  const added = missing.map((s) => `<script src="${s}" defer></script>`).join('');
  return html.slice(0, entry.index) + added + html.slice(entry.index);
}

// The start script's own attribute: the page's chunks in order, separated by spaces.
const START_ATTR = 'data-start';
// The list of functions the page's head queues for the start (features/api/client.ts, START_QUEUE_GLOBAL).
export const START_QUEUE = '__squadlineOnStart';
// Plain ES5, the same text on every page (one CSP hash; the list is in an attribute, which the hash does
// not cover). The queue and the scripts run in two tasks (each is a few milliseconds: the first request
// and the first script appended set up the browser's machinery). It waits for the browser's first
// contentful paint entry (a frame callback alone ran the scripts before that frame was shown); without
// paint timing, for the task after the next frame. A hidden page paints nothing, so it starts at once;
// and a page that has not painted within half a second starts anyway (our choice: the app is never held
// long for a paint that something else holds back).
export const START_SCRIPT =
  `(function(){var d=document,w=window,me=d.currentScript,done=0;function start(){if(done)return;done=1;` +
  `var q=w.${START_QUEUE}||[];for(var j=0;j<q.length;j++){try{q[j]()}catch(e){}}setTimeout(scripts,0)}` +
  `function scripts(){var l=(me.getAttribute("${START_ATTR}")||"").split(" ");` +
  'for(var i=0;i<l.length;i++){if(!l[i])continue;var s=d.createElement("script");s.src=l[i];s.async=false;d.body.appendChild(s)}}' +
  'function later(){setTimeout(start,0)}' +
  'if(d.visibilityState!=="visible"){start();return}' +
  'setTimeout(start,500);' +
  'var P=w.PerformanceObserver;' +
  'if(P&&P.supportedEntryTypes&&P.supportedEntryTypes.indexOf("paint")>=0){' +
  'new P(function(list,obs){var e=list.getEntries();for(var i=0;i<e.length;i++)if(e[i].name==="first-contentful-paint"){obs.disconnect();later()}})' +
  '.observe({type:"paint",buffered:true})}' +
  'else if(w.requestAnimationFrame)w.requestAnimationFrame(later);else start()})();';

/**
 * The HTML with its deferred script tags replaced by the start script (where the tags were, naming them
 * in order) and a low-priority preload of the entry chunk at the end of the head. A page without script
 * tags, or already rewritten, is returned as it is.
 */
export function startAfterFirstPaint(html) {
  const tags = [...html.matchAll(SCRIPT_TAG)];
  if (!tags.length || html.includes(`<script ${START_ATTR}=`)) return html;
  const head = html.indexOf('</head>');
  if (head < 0 || head > tags[0].index) throw new Error('The page has no head before its scripts.');
  const entry = tags.find((m) => /\/entry-[^/]*$/.test(m[1]));
  if (!entry) throw new Error('The page names no entry chunk: is this an `expo export` page?');
  const preload = `<link rel="preload" as="script" href="${entry[1]}" fetchpriority="low">`;
  const start = `<script ${START_ATTR}="${tags.map((m) => m[1]).join(' ')}">${START_SCRIPT}</script>`;
  let body = '';
  let from = head;
  tags.forEach((m, i) => {
    body += html.slice(from, m.index) + (i === 0 ? start : '');
    from = m.index + m[0].length;
  });
  return html.slice(0, head) + preload + body + html.slice(from);
}

// The pre-rendering's @font-face rules; the cookie features/ui/font-cache.web.ts sets; the twins' folder.
const FONT_STYLE_ID = 'expo-generated-fonts';
const FONTS_OFF = `<style id="${FONT_STYLE_ID}" media="not all">`;
export const FONTS_COOKIE = 'squadline_fonts';
export const FONTS_TWINS = '_fonts';

/** The HTML with its web font rules off (see 5. above); unchanged without rules or when already off. */
export function fontsFromSecondVisit(html) {
  return html.replace(`<style id="${FONT_STYLE_ID}">`, FONTS_OFF);
}

/** The twin of a page for a browser that has the font files: the rules on. */
export function fontsOn(html) {
  return html.replace(FONTS_OFF, `<style id="${FONT_STYLE_ID}">`);
}

// The export's flag for hydrating the pre-rendered page (expo-router's entry reads it).
const HYDRATE_FLAG = '<script type="module">globalThis.__EXPO_ROUTER_HYDRATE__=true;</script>';

/** The HTML without the hydrate flag, so the app renders the page afresh (see 6. above). */
export function renderAfresh(html) {
  return html.split(HYDRATE_FLAG).join('');
}

/**
 * Which extra chunks a page needs, from its path inside the export (`screening/index.html`) and the
 * names of the signed-out pages (`sign-in`, the files of app/(public)).
 */
export function chunksFor(page, chunks, publicPages) {
  const name = page.replace(/^\(public\)\//, '').replace(/\.html$/, '');
  const signedOut = publicPages.includes(name) || page.startsWith('+') || page.startsWith('_');
  const screening = /^(\(club\)\/)?screening\//.test(page);
  return [...chunks.layouts, ...(signedOut ? [] : chunks.shell), ...(screening ? chunks.device : [])];
}

/** The signed-out pages: the route files of app/(public). */
export function publicPageNames(root) {
  const dir = path.join(root, 'app', '(public)');
  return fs
    .readdirSync(dir)
    .filter((f) => /\.tsx?$/.test(f) && !f.startsWith('_') && !f.startsWith('+'))
    .map((f) => f.replace(/\.tsx?$/, ''));
}

/** The export's layout chunks and device-store chunk, as the HTML names them. */
export function exportChunks(dist) {
  const files = fs.readdirSync(path.join(dist, SCRIPTS)).filter((f) => f.endsWith('.js'));
  const src = (f) => `/${SCRIPTS}/${f}`;
  const layouts = files.filter((f) => /^_layout-[0-9a-f]+\.js$/.test(f)).map(src);
  const one = (prefix) => {
    const found = files.filter((f) => new RegExp(`^${prefix}-[0-9a-f]+\\.js$`).test(f)).map(src);
    if (found.length !== 1) throw new Error(`Expected one ${prefix} chunk in ${path.join(dist, SCRIPTS)}, found ${found.length}.`);
    return found;
  };
  if (!layouts.length) throw new Error(`No layout chunk in ${path.join(dist, SCRIPTS)}.`);
  return { layouts, shell: one('club-shell'), device: one('device') };
}

/** Rewrites every page of the export and writes its twin with the fonts on; returns how many changed. */
export function addRouteChunks(dist, root = ROOT) {
  const chunks = exportChunks(dist);
  const publicPages = publicPageNames(root);
  let changed = 0;
  for (const rel of htmlFiles(dist)) {
    if (rel.startsWith(`${FONTS_TWINS}/`)) continue;
    const file = path.join(dist, rel);
    const html = fs.readFileSync(file, 'utf8');
    // A page rewritten by an earlier run gets only what it lacks.
    const next = renderAfresh(
      html.includes(START_SCRIPT) ? html : fontsFromSecondVisit(startAfterFirstPaint(withChunks(html, chunksFor(rel, chunks, publicPages)))),
    );
    if (next !== html) {
      fs.writeFileSync(file, next);
      changed++;
    }
    const twin = fontsOn(next);
    if (twin !== next) {
      fs.mkdirSync(path.dirname(path.join(dist, FONTS_TWINS, rel)), { recursive: true });
      fs.writeFileSync(path.join(dist, FONTS_TWINS, rel), twin);
    }
  }
  return changed;
}

if (process.argv[1] && path.resolve(process.argv[1]) === fileURLToPath(import.meta.url)) {
  const dist = process.argv[2];
  if (!dist) throw new Error('Usage: node server/dev/route-chunks.mjs <export folder>');
  console.log(`Route chunks named in ${addRouteChunks(dist)} pages.`);
}
