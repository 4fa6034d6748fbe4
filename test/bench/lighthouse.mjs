// `npm run bench:web`: Lighthouse's mobile performance run (simulated slow 4G, 4x slower CPU) on
// Squadline's first screens and, in the same run and alternating with them, on an empty two-route Expo
// Router app built from the same node_modules and served the same way (test/bench/baseline-app.mjs).
// Prints the medians of both, their ratio, and the size of each route's JavaScript.
//
// Needs a running `npm start` (the demo data signs in as each role). Lighthouse is an npm package,
// installed on first use into .tmp/lighthouse (pinned; not a dependency of the app or of `npm test`).
// Then, in Chromium traces of the same pages and the empty app (alternating again), the main-thread
// blocking counted from thread CPU time, which a shared machine's stolen time does not inflate
// (test/bench/cpu-blocking.mjs).
// Usage: npm run bench:web [-- --runs 3] [--url http://127.0.0.1:8080] [--pages sign-in,home-tester,...]
//        [--trace-runs 5] [--traces-only]
import { execFileSync, spawn } from 'node:child_process';
import fs from 'node:fs';
import net from 'node:net';
import path from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { DIST_DIR } from '../../server/dev/bootstrap.mjs';
import { buildBaselineApp } from './baseline-app.mjs';
import { firstChunk, kb, readmeBudgetKb, routeSizes } from './bundle-sizes.mjs';
import { cpuBlockingMeter } from './cpu-blocking.mjs';
import { CHROMIUM_ARGS } from '../chromium-args.mjs';

const ROOT = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');
const LIGHTHOUSE = 'lighthouse@12.8.2';
const DEMO_PASSWORD = 'squadline-demo';

const args = process.argv.slice(2);
const opt = (name, fallback) => {
  const i = args.indexOf(`--${name}`);
  return i >= 0 && args[i + 1] ? args[i + 1] : fallback;
};
const runs = Number(opt('runs', '3'));
const base = opt('url', 'http://127.0.0.1:8080').replace(/\/$/, '');
const only = opt('pages', '').split(',').filter(Boolean);
const traceRuns = Number(opt('trace-runs', '5'));
const tracesOnly = args.includes('--traces-only');

// ---------------------------------------------------------------------------------------------------
// Bundle sizes first: they need no server and are the quickest to read.
// ---------------------------------------------------------------------------------------------------
function printSizes(title, dist) {
  console.log(`\n${title} (${path.relative(ROOT, dist) || dist}): JavaScript each page loads before it responds`);
  console.log(`  ${'route'.padEnd(42)} ${'raw'.padStart(10)} ${'gzip -9'.padStart(10)}  scripts`);
  for (const r of routeSizes(dist)) {
    console.log(`  ${r.route.padEnd(42)} ${kb(r.bytes).padStart(10)} ${kb(r.gzip).padStart(10)}  ${r.scripts.length}`);
  }
}

if (!fs.existsSync(path.join(DIST_DIR, 'index.html')) && !fs.existsSync(path.join(DIST_DIR, 'sign-in.html'))) {
  console.error(`No web export in ${DIST_DIR}: run \`npm start\` (it builds the app) first.`);
  process.exit(1);
}
const baselineDist = await buildBaselineApp(ROOT);
printSizes('Squadline', DIST_DIR);
printSizes('Empty Expo Router app', baselineDist);
const first = firstChunk(DIST_DIR);
const budget = readmeBudgetKb(fs.readFileSync(path.join(ROOT, 'README.md'), 'utf8'));
console.log(`\nFirst chunk (the scripts of ${first.html}): ${kb(first.gzip)} gzip -9, budget ${budget} KB (README).`);
console.log(`Empty app's first page: ${kb(firstChunk(baselineDist).gzip)} gzip -9.`);

// ---------------------------------------------------------------------------------------------------
// Lighthouse
// ---------------------------------------------------------------------------------------------------
const toolDir = path.join(ROOT, '.tmp', 'lighthouse');
const cli = path.join(toolDir, 'node_modules', 'lighthouse', 'cli', 'index.js');
if (!tracesOnly && !fs.existsSync(cli)) {
  fs.mkdirSync(toolDir, { recursive: true });
  console.log(`Installing ${LIGHTHOUSE} into .tmp/lighthouse (first run only)...`);
  execFileSync('npm', ['install', '--prefix', toolDir, '--no-audit', '--no-fund', '--save-exact', LIGHTHOUSE], { stdio: 'inherit' });
}

try {
  const health = await fetch(`${base}/api/health`);
  if (!health.ok) throw new Error(String(health.status));
} catch {
  console.error(`\nSquadline does not answer at ${base}: start it with \`npm start\` in another terminal, then run this again.`);
  process.exit(1);
}

async function signIn(email) {
  const res = await fetch(`${base}/api/auth/sign-in`, {
    method: 'POST',
    headers: { 'Content-Type': 'application/json', Origin: base },
    body: JSON.stringify({ email, password: DEMO_PASSWORD }),
  });
  if (!res.ok) throw new Error(`Signing in as ${email} failed (${res.status}): is the demo data loaded?`);
  const cookie = res.headers
    .getSetCookie()
    .map((c) => c.split(';')[0])
    .join('; ');
  return cookie;
}

async function getJson(urlPath, cookie) {
  const res = await fetch(`${base}/api${urlPath}`, { headers: { Cookie: cookie, Accept: 'application/json' } });
  if (!res.ok) throw new Error(`GET /api${urlPath} answered ${res.status}`);
  return res.json();
}

const cookies = {};
for (const role of ['tester', 'coach', 'physio', 'parent', 'admin']) cookies[role] = await signIn(`${role}@squadline.test`);
// A round with athletes, and an assessment in it, for the round and capture screens.
const rounds = await getJson('/rounds', cookies.tester);
const roundList = Array.isArray(rounds) ? rounds : rounds.rounds;
let roundId = null;
let assessmentId = null;
for (const r of roundList ?? []) {
  const detail = await getJson(`/rounds/${r.id}`, cookies.tester);
  const a = detail.athletes.find((x) => x.status !== 'submitted') ?? detail.athletes[0];
  if (a) {
    roundId = r.id;
    assessmentId = a.assessmentId;
    break;
  }
}

const pages = [
  { name: 'sign-in', path: '/sign-in', cookie: null },
  { name: 'home-tester', path: '/', cookie: cookies.tester },
  { name: 'home-coach', path: '/', cookie: cookies.coach },
  { name: 'home-physio', path: '/', cookie: cookies.physio },
  { name: 'home-parent', path: '/', cookie: cookies.parent },
  { name: 'home-admin', path: '/', cookie: cookies.admin },
  { name: 'rounds', path: '/screening', cookie: cookies.tester },
  ...(roundId ? [{ name: 'round', path: `/screening/rounds/${roundId}`, cookie: cookies.tester }] : []),
  ...(assessmentId ? [{ name: 'capture', path: `/screening/assessments/${assessmentId}`, cookie: cookies.tester }] : []),
].filter((p) => only.length === 0 || only.includes(p.name));
if (!roundId) console.warn('No screening round in the demo data: the round and capture screens are left out.');

const baselinePort = await freePort();
const baselineServer = spawn(path.join(ROOT, 'node_modules', '.bin', 'tsx'), ['test/bench/serve-export.ts', baselineDist, String(baselinePort)], {
  cwd: ROOT,
  stdio: ['ignore', 'pipe', 'inherit'],
});
await new Promise((resolve, reject) => {
  baselineServer.stdout.on('data', (d) => String(d).includes('ready') && resolve());
  baselineServer.on('exit', (code) => reject(new Error(`The comparison server exited (${code}).`)));
});
const stopBaseline = () => baselineServer.exitCode === null && baselineServer.kill('SIGTERM');
process.on('exit', stopBaseline);
process.on('SIGINT', () => process.exit(130));

// Lighthouse's Node API on a page of a fresh browser per run (a new profile: no cache, no service worker,
// no cookie but the one given). A signed-in page gets its session as a cookie in the browser's own jar,
// as a person's browser holds it: given as an extra request header instead (the CLI's --extra-headers),
// the header was dropped from every request once the page itself set a cookie (the web-font cookie),
// the app's requests were refused and the page went to sign-in, so its figures were sign-in's.
const { default: runLighthouse } = tracesOnly
  ? { default: null }
  : await import(pathToFileURL(path.join(toolDir, 'node_modules', 'lighthouse', 'core', 'index.js')).href);
const { default: puppeteer } = tracesOnly
  ? { default: null }
  : await import(pathToFileURL(path.join(toolDir, 'node_modules', 'puppeteer-core', 'lib', 'esm', 'puppeteer', 'puppeteer-core.js')).href);

// Lighthouse sometimes loses its trace on a loaded machine (NO_NAVSTART and the like): try once more
// before giving up, so one bad recording does not end a session of many runs.
async function lighthouse(url, cookie, label) {
  try {
    return await lighthouseOnce(url, cookie, label);
  } catch (error) {
    console.warn(`    ${label}: ${error instanceof Error ? error.message.split('\n')[0] : error}; running it again`);
    return lighthouseOnce(url, cookie, label);
  }
}

async function lighthouseOnce(url, cookie, label) {
  const out = path.join(toolDir, `report-${label}.json`);
  const browser = await puppeteer.launch({ executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium', headless: true, args: [...CHROMIUM_ARGS] });
  let r;
  try {
    const page = await browser.newPage();
    if (cookie) {
      const { hostname } = new URL(url);
      await browser.setCookie(
        ...cookie.split('; ').map((c) => {
          const i = c.indexOf('=');
          return { name: c.slice(0, i), value: c.slice(i + 1), domain: hostname, path: '/', httpOnly: true, sameSite: 'Lax' };
        }),
      );
    }
    const run = await runLighthouse(url, { output: 'json', onlyCategories: ['performance'], logLevel: 'error' }, undefined, page);
    fs.writeFileSync(out, run.report);
    r = run.lhr;
  } finally {
    await browser.close();
  }
  if (r.runtimeError) throw new Error(`Lighthouse could not load ${url}: ${r.runtimeError.message}`);
  // A signed-in page that ended elsewhere (at sign-in) measured the wrong page: stop rather than print it.
  if (new URL(r.finalDisplayedUrl).pathname !== new URL(url).pathname) {
    throw new Error(`Lighthouse asked for ${url} and ended at ${r.finalDisplayedUrl}: its figures would be another page's.`);
  }
  const a = r.audits;
  const result = {
    score: Math.round(r.categories.performance.score * 100),
    fcp: a['first-contentful-paint'].numericValue,
    lcp: a['largest-contentful-paint'].numericValue,
    tbt: a['total-blocking-time'].numericValue,
    cls: a['cumulative-layout-shift'].numericValue,
    bytes: a['total-byte-weight'].numericValue,
  };
  // Each run as it ends, so a long session that is stopped still leaves its figures.
  console.log(
    `    score ${result.score}, FCP ${(result.fcp / 1000).toFixed(2)} s, LCP ${(result.lcp / 1000).toFixed(2)} s, TBT ${Math.round(result.tbt)} ms, CLS ${result.cls.toFixed(3)}`,
  );
  return result;
}

// Alternate: in each round the empty app, then every Squadline page, so drift in the machine's load
// (other builds on the shared cores) touches both sides alike.
const results = { baseline: [] };
for (const p of pages) results[p.name] = [];
const total = runs * (pages.length + 1);
let n = 0;
for (let round = 0; round < (tracesOnly ? 0 : runs); round++) {
  n++;
  process.stdout.write(`\n[${n}/${total}] empty app /\n`);
  results.baseline.push(await lighthouse(`http://127.0.0.1:${baselinePort}/`, null, `baseline-${round}`));
  for (const p of pages) {
    n++;
    process.stdout.write(`[${n}/${total}] Squadline ${p.name} ${p.path}\n`);
    results[p.name].push(await lighthouse(`${base}${p.path}`, p.cookie, `${p.name}-${round}`));
  }
}

const median = (list, k) => [...list.map((r) => r[k])].sort((x, y) => x - y)[Math.floor(list.length / 2)];
const row = (name, list) => {
  const m = (k) => median(list, k);
  return `  ${name.padEnd(14)} ${String(m('score')).padStart(5)} ${(m('fcp') / 1000).toFixed(2).padStart(7)} ${(m('lcp') / 1000).toFixed(2).padStart(7)} ${String(Math.round(m('tbt'))).padStart(7)} ${m('cls').toFixed(3).padStart(7)} ${String(Math.round(m('bytes') / 1024)).padStart(8)}`;
};
if (!tracesOnly) printLighthouse();

// Blocking time from thread CPU time, alternating the same way (`--trace-runs 0` leaves it out).
if (traceRuns < 1) {
  stopBaseline();
  process.exit(0);
}
const meter = await cpuBlockingMeter();
const traced = { baseline: [] };
for (const p of pages) traced[p.name] = [];
let t = 0;
const traceTotal = traceRuns * (pages.length + 1);
for (let round = 0; round < traceRuns; round++) {
  t++;
  traced.baseline.push(await meter.measure(`http://127.0.0.1:${baselinePort}/`, null));
  process.stdout.write(`\r[trace ${t}/${traceTotal}]`);
  for (const p of pages) {
    t++;
    traced[p.name].push(await meter.measure(`${base}${p.path}`, p.cookie));
    process.stdout.write(`\r[trace ${t}/${traceTotal}]`);
  }
}
await meter.close();
stopBaseline();
const tb = median(traced.baseline, 'blockingMs');
console.log(`\n\nMain-thread blocking after the first paint from thread CPU time x4 (Chromium traces, unthrottled), median of ${traceRuns}:`);
console.log(`  ${'page'.padEnd(14)} ${'blocking ms'.padStart(12)} ${'CPU ms'.padStart(8)}   blocking ratio`);
console.log(`  ${'empty app'.padEnd(14)} ${String(Math.round(tb)).padStart(12)} ${String(Math.round(median(traced.baseline, 'busyMs'))).padStart(8)}`);
for (const p of pages) {
  const mb = median(traced[p.name], 'blockingMs');
  console.log(
    `  ${p.name.padEnd(14)} ${String(Math.round(mb)).padStart(12)} ${String(Math.round(median(traced[p.name], 'busyMs'))).padStart(8)}   ${(mb / tb).toFixed(2).padStart(14)}`,
  );
}
console.log('\nblocking ratio = Squadline / empty app (1.00 or less: blocks no longer). CPU ms: all main-thread CPU time of the load, x4.');

function printLighthouse() {
  const b = { score: median(results.baseline, 'score'), lcp: median(results.baseline, 'lcp') };
  console.log(`\nLighthouse mobile (simulated slow 4G, 4x CPU), median of ${runs}, ${new Date().toISOString().slice(0, 10)}:`);
  console.log(
    `  ${'page'.padEnd(14)} ${'score'.padStart(5)} ${'FCP s'.padStart(7)} ${'LCP s'.padStart(7)} ${'TBT ms'.padStart(7)} ${'CLS'.padStart(7)} ${'KB sent'.padStart(8)}   score ratio  LCP ratio`,
  );
  console.log(row('empty app', results.baseline));
  for (const p of pages) {
    const s = median(results[p.name], 'score');
    const l = median(results[p.name], 'lcp');
    console.log(`${row(p.name, results[p.name])}   ${(s / b.score).toFixed(2).padStart(11)}  ${(l / b.lcp).toFixed(2).padStart(9)}`);
  }
  console.log('\nscore ratio = Squadline / empty app (1.00 or more: at least as good); LCP ratio = Squadline / empty app (1.00 or less: at least as fast).');
}

function freePort() {
  return new Promise((resolve, reject) => {
    const server = net.createServer();
    server.on('error', reject);
    server.listen(0, '127.0.0.1', () => {
      const { port } = server.address();
      server.close(() => resolve(port));
    });
  });
}
