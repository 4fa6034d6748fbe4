// Lighthouse's mobile performance run against a running Squadline (default: the sign-in page of
// `npm start`). Prints the median of several runs. Lighthouse is installed on first use into
// .tmp/lighthouse (pinned; it is not a dependency of the app or of `npm test`).
// Usage: npm run bench:web [-- URL [RUNS]]
import { execFileSync } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

const ROOT = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');
const url = process.argv[2] ?? 'http://127.0.0.1:8080/sign-in';
const runs = Number(process.argv[3] ?? 3);
const toolDir = path.join(ROOT, '.tmp', 'lighthouse');
const cli = path.join(toolDir, 'node_modules', 'lighthouse', 'cli', 'index.js');
if (!fs.existsSync(cli)) {
  fs.mkdirSync(toolDir, { recursive: true });
  console.log('Installing lighthouse@12.8.2 into .tmp/lighthouse (first run only)...');
  execFileSync('npm', ['install', '--prefix', toolDir, '--no-audit', '--no-fund', 'lighthouse@12.8.2'], { stdio: 'inherit' });
}
const flags = '--headless --no-sandbox --disable-gpu --disable-quic --no-first-run --disable-background-networking --disable-component-update --disable-sync';
const results = [];
for (let i = 0; i < runs; i++) {
  const out = path.join(toolDir, `report-${i}.json`);
  execFileSync(process.execPath, [cli, url, '--only-categories=performance', '--output=json', `--output-path=${out}`, `--chrome-flags=${flags}`, '--quiet'], {
    stdio: 'inherit',
    env: { ...process.env, CHROME_PATH: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium' },
  });
  const r = JSON.parse(fs.readFileSync(out, 'utf8'));
  const a = r.audits;
  results.push({
    score: Math.round(r.categories.performance.score * 100),
    fcp: a['first-contentful-paint'].numericValue,
    lcp: a['largest-contentful-paint'].numericValue,
    tbt: a['total-blocking-time'].numericValue,
    cls: a['cumulative-layout-shift'].numericValue,
    bytes: a['total-byte-weight'].numericValue,
  });
}
const median = (k) => [...results.map((r) => r[k])].sort((x, y) => x - y)[Math.floor(results.length / 2)];
console.log(`\nLighthouse mobile, ${url}, median of ${runs}:`);
console.log(`  performance score ${median('score')}`);
console.log(`  FCP ${(median('fcp') / 1000).toFixed(1)} s, LCP ${(median('lcp') / 1000).toFixed(1)} s, TBT ${Math.round(median('tbt'))} ms, CLS ${median('cls').toFixed(2)}`);
console.log(`  transferred ${Math.round(median('bytes') / 1024)} KB`);
