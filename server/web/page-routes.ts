// Which pre-rendered HTML file answers a path. `expo export` with `web.output: "static"` writes one file per
// route, named after the route file: `sign-in.html`, `athletes/index.html`, `athletes/[id].html`,
// `docs/[...rest].html`. The route table is read from the export itself, so a new screen (static or
// dynamic) needs no change here. A single-page export (only `index.html`) works too: nothing but `/`
// matches, and every other path falls back to `index.html`.
import fs from 'node:fs';
import path from 'node:path';

type Segment = { kind: 'static'; value: string } | { kind: 'dynamic' } | { kind: 'catch-all'; optional: boolean };

export type PageRoute = {
  /** The HTML file, relative to the export folder, with forward slashes. */
  file: string;
  segments: Segment[];
};

export type PageMatch = { file: string; status: 200 | 404 };

const GROUP = /^\(.+\)$/;

/** The route a file stands for, or null for files that are not pages of their own. */
export function routeOfFile(file: string): PageRoute | null {
  if (!file.endsWith('.html')) return null;
  const parts = file.slice(0, -'.html'.length).split('/');
  // Expo writes each grouped route twice: `(club)/people.html` and `people.html`. The URL never has the group.
  if (parts.some((p) => GROUP.test(p))) return null;
  // `+not-found.html`, `+html`, `_sitemap` and other special files are not reachable by their own name.
  if (parts.some((p) => p.startsWith('+') || p.startsWith('_'))) return null;
  if (parts[parts.length - 1] === 'index') parts.pop();
  const segments = parts.map((part): Segment => {
    const optionalCatchAll = /^\[\[\.\.\.[^\]]+\]\]$/.test(part);
    if (optionalCatchAll) return { kind: 'catch-all', optional: true };
    if (/^\[\.\.\.[^\]]+\]$/.test(part)) return { kind: 'catch-all', optional: false };
    if (/^\[[^\]]+\]$/.test(part)) return { kind: 'dynamic' };
    return { kind: 'static', value: part };
  });
  return { file, segments };
}

function matches(route: PageRoute, parts: string[]): boolean {
  const { segments } = route;
  for (let i = 0; i < segments.length; i++) {
    const seg = segments[i]!;
    if (seg.kind === 'catch-all') {
      const rest = parts.length - i;
      return seg.optional ? rest >= 0 : rest >= 1;
    }
    const part = parts[i];
    if (part === undefined) return false;
    if (seg.kind === 'static' && seg.value !== part) return false;
  }
  return parts.length === segments.length;
}

const RANK = { static: 3, dynamic: 2, 'catch-all': 1 } as const;

/** Expo Router's preference: a static segment beats a dynamic one, which beats a catch-all, from the left. */
function compareRoutes(a: PageRoute, b: PageRoute): number {
  const n = Math.max(a.segments.length, b.segments.length);
  for (let i = 0; i < n; i++) {
    const ra = a.segments[i] ? RANK[a.segments[i]!.kind] : 0;
    const rb = b.segments[i] ? RANK[b.segments[i]!.kind] : 0;
    if (ra !== rb) return rb - ra;
  }
  return 0;
}

export type PageTable = {
  routes: PageRoute[];
  /** `+not-found.html` when the export has one. */
  notFound: string | null;
  /** `index.html` when the export has one (the single-page fallback). */
  index: string | null;
};

export function buildPageTable(files: string[]): PageTable {
  const routes = files
    .map(routeOfFile)
    .filter((r): r is PageRoute => r !== null)
    .sort(compareRoutes);
  return {
    routes,
    notFound: files.includes('+not-found.html') ? '+not-found.html' : null,
    index: files.includes('index.html') ? 'index.html' : null,
  };
}

/**
 * The file for a URL path (already without its query). Unknown paths get `+not-found.html` with a 404
 * when the export has one (static output), or `index.html` (single-page output, where the client decides).
 */
export function matchPage(table: PageTable, urlPath: string): PageMatch | null {
  let parts: string[];
  try {
    parts = urlPath
      .split('/')
      .filter(Boolean)
      .map((p) => decodeURIComponent(p));
  } catch {
    parts = urlPath.split('/').filter(Boolean);
  }
  const hit = table.routes.find((r) => matches(r, parts));
  if (hit) return { file: hit.file, status: 200 };
  if (table.notFound) return { file: table.notFound, status: 404 };
  if (table.index) return { file: table.index, status: 200 };
  return null;
}

/** Every file under `dir`, relative, with forward slashes. */
export function listFiles(dir: string): string[] {
  const out: string[] = [];
  const walk = (sub: string) => {
    for (const entry of fs.readdirSync(path.join(dir, sub), { withFileTypes: true })) {
      const rel = sub ? `${sub}/${entry.name}` : entry.name;
      if (entry.isDirectory()) walk(rel);
      else out.push(rel);
    }
  };
  walk('');
  return out;
}
