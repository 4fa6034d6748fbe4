// What each pre-rendered page of a web export makes the browser download as JavaScript before the page
// can respond: the `<script src>` tags of its HTML (entry, shared chunk, layouts, the route's own chunk),
// or, once the export's pages start their scripts after the first paint, the list on the start script
// (`<script data-start="...">`, server/dev/route-chunks.mjs).
// Shared by `npm run bench:web` (the size report) and the first-chunk budget test.
import fs from 'node:fs';
import path from 'node:path';
import zlib from 'node:zlib';

const SCRIPT_SRC = /<script[^>]*\bsrc="([^"]+)"/g;
const START_LIST = /<script data-start="([^"]*)">/g;

/** Bytes of a file as sent with gzip -9 (what the budget counts: stable, and what every browser accepts). */
export function gzipBytes(file) {
  return zlib.gzipSync(fs.readFileSync(file), { level: 9 }).length;
}

/** The scripts one page loads, with raw and gzip sizes. */
export function pageScripts(distDir, htmlFile) {
  const html = fs.readFileSync(path.join(distDir, htmlFile), 'utf8');
  const sources = [...html.matchAll(SCRIPT_SRC)].map((m) => m[1]);
  for (const m of html.matchAll(START_LIST)) sources.push(...m[1].split(' ').filter(Boolean));
  return sources.map((src) => {
    const file = path.join(distDir, decodeURIComponent(src.replace(/^\//, '').split('?')[0]));
    return { src, bytes: fs.statSync(file).size, gzip: gzipBytes(file) };
  });
}

/** Every page of the export (group copies and special files left out), with its JavaScript. */
export function routeSizes(distDir) {
  const pages = [];
  const walk = (sub) => {
    for (const entry of fs.readdirSync(path.join(distDir, sub), { withFileTypes: true })) {
      const rel = sub ? `${sub}/${entry.name}` : entry.name;
      if (entry.isDirectory()) {
        // Left out: group copies, scripts, assets and the pages' twins with web fonts on (`_fonts`).
        if (!entry.name.startsWith('(') && !entry.name.startsWith('_') && entry.name !== 'assets') walk(rel);
      } else if (entry.name.endsWith('.html') && !entry.name.startsWith('_')) pages.push(rel);
    }
  };
  walk('');
  return pages.sort().map((html) => {
    const scripts = pageScripts(distDir, html);
    const route = '/' + html.replace(/\.html$/, '').replace(/(^|\/)index$/, '');
    return {
      route: route === '/' ? '/' : route.replace(/\/$/, ''),
      html,
      scripts,
      bytes: scripts.reduce((s, x) => s + x.bytes, 0),
      gzip: scripts.reduce((s, x) => s + x.gzip, 0),
    };
  });
}

/** The first chunk: all the JavaScript the sign-in page (the first screen anyone sees) loads. */
export function firstChunk(distDir) {
  const html = fs.existsSync(path.join(distDir, 'sign-in.html')) ? 'sign-in.html' : 'index.html';
  const scripts = pageScripts(distDir, html);
  return { html, scripts, bytes: scripts.reduce((s, x) => s + x.bytes, 0), gzip: scripts.reduce((s, x) => s + x.gzip, 0) };
}

/** The budget the README states, in KB of gzip: the line `First-chunk budget: **N KB**`. */
export function readmeBudgetKb(readmeText) {
  const m = /First-chunk budget:\s*\*\*(\d+(?:\.\d+)?)\s*KB\*\*/.exec(readmeText);
  if (!m) throw new Error('README.md states no "First-chunk budget: **N KB**" line (Performance section).');
  return Number(m[1]);
}

export const kb = (n) => `${(n / 1024).toFixed(1)} KB`;
