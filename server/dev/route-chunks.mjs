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
// defined module at once instead of fetching its chunk again. Plain Node: it runs inside the bootstrap.
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

/** Rewrites every page of the export; returns how many changed. */
export function addRouteChunks(dist, root = ROOT) {
  const chunks = exportChunks(dist);
  const publicPages = publicPageNames(root);
  let changed = 0;
  for (const rel of htmlFiles(dist)) {
    const file = path.join(dist, rel);
    const html = fs.readFileSync(file, 'utf8');
    const next = withChunks(html, chunksFor(rel, chunks, publicPages));
    if (next !== html) {
      fs.writeFileSync(file, next);
      changed++;
    }
  }
  return changed;
}

if (process.argv[1] && path.resolve(process.argv[1]) === fileURLToPath(import.meta.url)) {
  const dist = process.argv[2];
  if (!dist) throw new Error('Usage: node server/dev/route-chunks.mjs <export folder>');
  console.log(`Route chunks named in ${addRouteChunks(dist)} pages.`);
}
