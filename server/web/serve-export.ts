// Serving the web export (`expo export --platform web`): hashed bundles and assets cached for a year,
// pages revalidated, each path answered by its pre-rendered HTML file (see page-routes.ts), and files
// compressed ahead of time (`name.br`, `name.gz` written after the export) sent as they are.
import { createHash } from 'node:crypto';
import express, { type Request, type RequestHandler, type Response } from 'express';
import fs from 'node:fs';
import path from 'node:path';
import { buildPageTable, listFiles, matchPage } from './page-routes';

export type WebExport = {
  handler: express.Router;
  /** CSP sources (`'sha256-...'`) for the inline scripts of the pre-rendered pages. */
  inlineScriptHashes: string[];
};

const YEAR = '365d';
const HASHED_FOLDERS = ['_expo', 'assets'];
// The pages' twins with web fonts on, and the cookie that asks for them (server/dev/route-chunks.mjs, step 5;
// set by features/ui/font-cache.web.ts once this browser has fetched the font files).
const FONTS_TWINS = '_fonts';
const FONTS_CACHED = /(?:^|;\s*)squadline_fonts=1(?:;|$)/;
const INLINE_SCRIPT = /<script(?![^>]*\bsrc=)[^>]*>([\s\S]*?)<\/script>/g;

/** The CSP hashes of every inline script in the exported pages (Expo adds one to turn on hydration). */
export function inlineScriptHashesOf(pages: string[]): string[] {
  const hashes = new Set<string>();
  for (const html of pages) {
    for (const m of html.matchAll(INLINE_SCRIPT)) {
      const body = m[1] ?? '';
      if (body.trim()) hashes.add(`'sha256-${createHash('sha256').update(body, 'utf8').digest('base64')}'`);
    }
  }
  return [...hashes].sort();
}

/** Null when `webDir` holds no export (API tests, or before the first build). */
export function webExport(webDir: string): WebExport | null {
  if (!fs.existsSync(webDir)) return null;
  const files = listFiles(webDir);
  const table = buildPageTable(files);
  if (!table.index && table.routes.length === 0) return null;
  const available = new Set(files);
  const htmlFiles = files.filter((f) => f.endsWith('.html'));
  const inlineScriptHashes = inlineScriptHashesOf(htmlFiles.map((f) => fs.readFileSync(path.join(webDir, f), 'utf8')));

  // `root` keeps send's dot-folder check off the export's own location (it may live under .tmp/).
  const sendFile = (res: Response, rel: string, cache: { immutable: boolean }, status = 200) => {
    const encoding = pickEncoding(res.req, rel, available);
    if (encoding) {
      res.setHeader('Content-Encoding', encoding);
      res.type(path.extname(rel));
    }
    if (!res.getHeader('Vary')) res.setHeader('Vary', 'Accept-Encoding');
    res.status(status);
    res.sendFile(encoding ? `${rel}.${encoding === 'br' ? 'br' : 'gz'}` : rel, {
      root: webDir,
      ...(cache.immutable ? { immutable: true, maxAge: YEAR } : { cacheControl: false, headers: { 'Cache-Control': 'no-cache' } }),
    });
  };

  const handler = express.Router();
  // Hashed bundles and assets never change under the same name.
  for (const folder of HASHED_FOLDERS) {
    handler.use(`/${folder}`, ((req, res, next) => {
      if (req.method !== 'GET' && req.method !== 'HEAD') return next();
      const rel = safeRelative(`${folder}${req.path}`);
      if (!rel || !available.has(rel)) return next();
      sendFile(res, rel, { immutable: true });
    }) as RequestHandler);
    handler.use(`/${folder}`, express.static(path.join(webDir, folder), { immutable: true, maxAge: YEAR, redirect: false }));
    // A missing bundle is a plain 404, not the not-found page a script tag cannot use.
    handler.use(`/${folder}`, ((_req, res) => res.status(404).end()) as RequestHandler);
  }
  // Other files of the export by their own name (favicon, files from public/), revalidated.
  handler.use(express.static(webDir, { index: false, redirect: false, maxAge: 0 }));
  handler.get('/{*splat}', ((req, res, next) => {
    const page = matchPage(table, req.path);
    if (!page) return next();
    // A browser that has the font files gets the page's twin with the web font rules on.
    const twin = `${FONTS_TWINS}/${page.file}`;
    const file = FONTS_CACHED.test(req.headers.cookie ?? '') && available.has(twin) ? twin : page.file;
    res.setHeader('Vary', 'Accept-Encoding, Cookie');
    sendFile(res, file, { immutable: false }, page.status);
  }) as RequestHandler);
  return { handler, inlineScriptHashes };
}

/** The precompressed copy to send, if the export has one the client accepts. */
function pickEncoding(req: Request, rel: string, available: Set<string>): 'br' | 'gzip' | null {
  if (available.has(`${rel}.br`) && req.acceptsEncodings('br') === 'br') return 'br';
  if (available.has(`${rel}.gz`) && req.acceptsEncodings('gzip') === 'gzip') return 'gzip';
  return null;
}

/** A path inside the export, or null for anything that tries to leave it. */
function safeRelative(urlPath: string): string | null {
  let decoded: string;
  try {
    decoded = decodeURIComponent(urlPath);
  } catch {
    return null;
  }
  const normal = path.posix.normalize(decoded);
  if (normal.startsWith('..') || normal.includes('\0') || path.posix.isAbsolute(normal)) return null;
  return normal;
}
