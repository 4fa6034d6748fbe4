// Makes the web export installable and usable with no connection. Run after `expo export` (by
// ensureWebBuild in bootstrap.mjs) with the export's folder as its argument:
//
//   node server/dev/service-worker.mjs dist
//
// 1. Icons and a web manifest (name, colours, icons), linked from every HTML page of the export once
//    the page has been drawn.
// 2. sw-navigation.js: page loads go to the network first (4 s at most); without an answer they get
//    the page's own HTML from the cache when the export has one per route ("static" output), else the
//    app shell (index.html, the "single" output). API requests are never answered by the worker: the
//    data a tester keeps offline lives in IndexedDB (features/offline), not in the HTTP cache.
// 3. sw.js built by Workbox (generateSW): precaches the shell, every script chunk (the capture screens
//    load lazily), the fonts and the icons, and imports sw-navigation.js first.
import fs from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

const ROOT = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..', '..');
const THEME = '#0E5A45';
const BACKGROUND = '#F6F4EF';

/** The brand mark (a tilted square, as in the app's header) on the brand green. */
function iconSvg(size, { maskable }) {
  const inner = maskable ? size * 0.36 : size * 0.46;
  const c = size / 2;
  return `<svg xmlns="http://www.w3.org/2000/svg" width="${size}" height="${size}" viewBox="0 0 ${size} ${size}">
  <rect width="${size}" height="${size}" rx="${maskable ? 0 : size * 0.18}" fill="${THEME}"/>
  <rect x="${c - inner / 2}" y="${c - inner / 2}" width="${inner}" height="${inner}" rx="${inner * 0.08}" fill="#FFFFFF" transform="rotate(45 ${c} ${c})"/>
  <rect x="${c - inner * 0.18}" y="${c - inner * 0.18}" width="${inner * 0.36}" height="${inner * 0.36}" fill="${THEME}" transform="rotate(45 ${c} ${c})"/>
</svg>`;
}

async function writeIcons(dist) {
  const { default: sharp } = await import('sharp');
  const dir = path.join(dist, 'icons');
  fs.mkdirSync(dir, { recursive: true });
  const icons = [
    { file: 'icon-192.png', size: 192, maskable: false },
    { file: 'icon-512.png', size: 512, maskable: false },
    { file: 'icon-maskable-512.png', size: 512, maskable: true },
  ];
  for (const icon of icons) {
    await sharp(Buffer.from(iconSvg(icon.size, icon)))
      .png()
      .toFile(path.join(dir, icon.file));
  }
  return icons.map((i) => ({ src: `/icons/${i.file}`, sizes: `${i.size}x${i.size}`, type: 'image/png', purpose: i.maskable ? 'maskable' : 'any' }));
}

/** Every HTML page of the export, as paths relative to it with forward slashes, sorted. */
export function htmlFiles(dist) {
  const out = [];
  const walk = (dir) => {
    for (const entry of fs.readdirSync(dir, { withFileTypes: true })) {
      const full = path.join(dir, entry.name);
      if (entry.isDirectory()) walk(full);
      else if (entry.name.endsWith('.html')) out.push(path.relative(dist, full).split(path.sep).join('/'));
    }
  };
  walk(dist);
  return out.sort();
}

const MANIFEST = '/manifest.webmanifest';
const ICON = '/icons/icon-192.png';

// The manifest and the tab icon are linked once the page has been drawn (the start queue of the loader
// in route-chunks.mjs runs after the first contentful paint). Linked in the HTML, Chrome fetched both
// while the page was still loading, before its first paint: on a slow connection they shared its
// bandwidth, and Lighthouse counts them in the largest paint's time (about 0.2 s in its slow-4G
// simulation). The placeholder icon keeps browsers from asking for /favicon.ico (a 404) meanwhile;
// `apple-touch-icon` is read only when a phone saves the page to its home screen, so it stays.
const LINK_LATER = `(window.__squadlineOnStart=window.__squadlineOnStart||[]).push(function(){var d=document,m=d.createElement("link");m.rel="manifest";m.href="${MANIFEST}";d.head.appendChild(m);var i=d.querySelector('link[rel="icon"]');if(i){i.type="image/png";i.href="${ICON}"}});`;

const HEAD_TAGS = [
  `<meta name="theme-color" content="${THEME}">`,
  `<link rel="apple-touch-icon" href="${ICON}">`,
  '<link rel="icon" href="data:,">',
  `<script>${LINK_LATER}</script>`,
];

// Font files are not preloaded. With `font-display: optional`, Chrome holds the first paint of a page
// (up to about 100 ms) for a preloaded font; on a slow hall connection the file comes too late to be used
// on that visit anyway, so the page paints first in the system face. The files still load as soon as
// the text asks for them and are in the cache for the next visit.
const FONT_PRELOAD = /<link rel="preload" href="[^"]*" as="font"[^>]*>/g;

/** One exported page with the manifest, theme colour and icons linked (idempotent) and no font preloads. */
export function linkManifestInto(html) {
  const out = html.replace(FONT_PRELOAD, '');
  if (out.includes(MANIFEST)) return out;
  const tags = HEAD_TAGS.filter((t) => !(t.includes('theme-color') && out.includes('name="theme-color"')));
  return out.replace('</head>', `${tags.join('')}</head>`);
}

function linkManifest(dist, files) {
  for (const file of files) {
    const full = path.join(dist, file);
    fs.writeFileSync(full, linkManifestInto(fs.readFileSync(full, 'utf8')));
  }
}

/**
 * The route of each exported HTML file, as a pattern: "(club)/screening/rounds/[id].html" answers
 * /screening/rounds/<anything>. Groups in parentheses are not part of the URL.
 */
export function routeTable(files) {
  const routes = [];
  for (const file of files) {
    const base = path.posix.basename(file);
    // The twins with web fonts on (`_fonts/`, route-chunks.mjs step 5) are chosen by the server only.
    if (base.startsWith('+') || base.startsWith('_') || file.startsWith('_')) continue;
    let route = file.replace(/\.html$/, '').replace(/(^|\/)index$/, '');
    const segments = route.split('/').filter((s) => s && !/^\(.*\)$/.test(s));
    let dynamic = 0;
    const pattern = segments
      .map((s) => {
        if (/^\[\.\.\..+\]$/.test(s)) {
          dynamic += 2;
          return '.+';
        }
        if (/^\[.+\]$/.test(s)) {
          dynamic += 1;
          return '[^/]+';
        }
        return s.replace(/[.*+?^${}()|[\]\\]/g, '\\$&');
      })
      .join('/');
    routes.push({ pattern: `^/${pattern}/?$`, file: `/${file}`, dynamic, length: segments.length });
  }
  // Static segments win over dynamic ones, longer routes over shorter.
  routes.sort((a, b) => a.dynamic - b.dynamic || b.length - a.length);
  return routes.map(({ pattern, file }) => ({ pattern, file }));
}

function navigationScript(routes) {
  return `// Written by server/dev/service-worker.mjs. Page loads: network first, then the page from the cache.
self.__WB_DISABLE_DEV_LOGS = true;
const ROUTES = ${JSON.stringify(routes)}.map((r) => ({ re: new RegExp(r.pattern), file: r.file }));
const SHELL = '/index.html';
const NETWORK_WAIT_MS = 4000;

function fileFor(pathname) {
  const hit = ROUTES.find((r) => r.re.test(pathname));
  return hit ? hit.file : SHELL;
}

async function fromCache(pathname) {
  for (const file of [fileFor(pathname), SHELL]) {
    const hit = await caches.match(new URL(file, self.location.origin).href, { ignoreSearch: true });
    if (hit) return hit;
  }
  return undefined;
}

self.addEventListener('fetch', (event) => {
  const req = event.request;
  if (req.mode !== 'navigate' || req.method !== 'GET') return;
  const url = new URL(req.url);
  if (url.origin !== self.location.origin || url.pathname === '/api' || url.pathname.startsWith('/api/')) return;
  event.respondWith(
    (async () => {
      const network = fetch(req);
      const timeout = new Promise((resolve) => setTimeout(() => resolve(undefined), NETWORK_WAIT_MS));
      try {
        const first = await Promise.race([network, timeout]);
        if (first) return first;
        // A connection too slow to answer (a hall's weak signal): the kept page now.
        return (await fromCache(url.pathname)) || (await network);
      } catch (error) {
        const cached = await fromCache(url.pathname);
        if (cached) return cached;
        throw error;
      }
    })(),
  );
});
`;
}

export async function buildServiceWorker(dist) {
  const { generateSW } = await import('workbox-build');
  const icons = await writeIcons(dist);
  fs.writeFileSync(
    path.join(dist, 'manifest.webmanifest'),
    JSON.stringify(
      {
        name: 'Squadline',
        short_name: 'Squadline',
        description: 'Movement screening for junior racket-sport squads, courtside.',
        start_url: '/',
        scope: '/',
        display: 'standalone',
        orientation: 'portrait',
        background_color: BACKGROUND,
        theme_color: THEME,
        icons,
      },
      null,
      2,
    ),
  );
  const files = htmlFiles(dist);
  linkManifest(dist, files);
  fs.writeFileSync(path.join(dist, 'sw-navigation.js'), navigationScript(routeTable(files)));
  for (const old of fs.readdirSync(dist)) if (/^workbox-.*\.js(\.map)?$/.test(old)) fs.rmSync(path.join(dist, old));
  const { count, size, warnings } = await generateSW({
    swDest: path.join(dist, 'sw.js'),
    globDirectory: dist,
    globPatterns: ['**/*.{html,js,css,ttf,otf,woff,woff2,png,jpg,svg,ico,webmanifest}'],
    globIgnores: ['sw.js', 'sw.js.map', 'workbox-*.js', 'sw-navigation.js', '_fonts/**'],
    // Bundles carry their hash in their name: no revision query needed.
    dontCacheBustURLsMatching: /\/_expo\/static\/.+-[0-9a-f]{8,}\.|\.[0-9a-f]{16,}\./,
    maximumFileSizeToCacheInBytes: 8 * 1024 * 1024,
    importScripts: ['/sw-navigation.js'],
    // The API is never cached by the worker (no runtime caching at all).
    runtimeCaching: [],
    skipWaiting: true,
    clientsClaim: true,
    cleanupOutdatedCaches: true,
    inlineWorkboxRuntime: true,
    sourcemap: false,
    mode: 'production',
  });
  for (const w of warnings) process.stderr.write(`[squadline] service worker: ${w}\n`);
  process.stdout.write(
    `[squadline] Service worker: ${count} files precached (${(size / 1024 / 1024).toFixed(1)} MB), ${files.filter((f) => !f.startsWith('_fonts/')).length} HTML page(s) linked to the manifest (and their twins with web fonts on).\n`,
  );
}

if (process.argv[1] && path.resolve(process.argv[1]) === fileURLToPath(import.meta.url)) {
  const dist = path.resolve(ROOT, process.argv[2] ?? 'dist');
  buildServiceWorker(dist).catch((error) => {
    process.stderr.write(`${error.stack ?? error}\n`);
    process.exit(1);
  });
}
