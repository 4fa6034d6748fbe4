// `npm test`: the same bootstrap as `npm start`, then a throw-away PostgreSQL cluster on loopback,
// ESLint and Prettier (`npm run lint`), vitest (unit + API against the real database), and Playwright browser tests in Debian's Chromium.
// `npm test -- --unit` runs vitest only (no lint); `npm test -- --e2e` runs the browser tests only.
import { spawnSync } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import {
  DIST_DIR,
  ROOT,
  clusterLayout,
  databaseUrl,
  ensureChromium,
  ensureDatabase,
  ensureNodeModules,
  ensurePostgres,
  ensureSamplePhotos,
  ensureWebBuild,
  freePort,
  initCluster,
  log,
  makeClusterRoot,
  newPassword,
  startCluster,
  stopCluster,
  tsx,
  tsxSync,
} from './bootstrap.mjs';

const only = process.argv.includes('--unit') ? 'unit' : process.argv.includes('--e2e') ? 'e2e' : 'all';
const passThrough = process.argv.slice(2).filter((a) => a !== '--unit' && a !== '--e2e');

ensureNodeModules();
const bin = ensurePostgres();
const chromium = only === 'unit' ? null : ensureChromium();
// The suggested-points browser test runs the pose model on a real photograph from a Debian package.
const samplePhotos = only === 'unit' ? null : ensureSamplePhotos();

const root = makeClusterRoot('squadline-test-');
const layout = clusterLayout(root);
const password = newPassword();
const port = await freePort();
log(`Starting a throw-away PostgreSQL on 127.0.0.1:${port}...`);
initCluster(bin, layout, password);
startCluster(bin, layout, port);

let server = null;
const cleanup = () => {
  if (server && server.exitCode === null) server.kill('SIGTERM');
  stopCluster(bin, layout);
  fs.rmSync(root, { recursive: true, force: true });
};
process.on('SIGINT', () => {
  cleanup();
  process.exit(130);
});

let status = 0;
try {
  const env = { ...process.env, TEST_DATABASE_ADMIN_URL: databaseUrl(port, password, 'postgres') };
  if (only === 'all') {
    // Lint first: ESLint (Expo's config and TypeScript rules) and Prettier's check.
    log('Lint (ESLint, Prettier)...');
    const lint = spawnSync('npm', ['run', '--silent', 'lint'], { cwd: ROOT, stdio: 'inherit', env });
    status = lint.status ?? 1;
  }
  if (status === 0 && only !== 'e2e') {
    // The first-chunk budget test reads the web export: build it first (skipped when the sources are
    // unchanged, or when the vitest filters given leave that test out).
    const filters = passThrough.filter((a) => !a.startsWith('-'));
    if (filters.length === 0 || filters.some((f) => 'test/api/first-chunk-budget.test.ts'.includes(f))) ensureWebBuild();
    log('Unit and API tests (vitest)...');
    const vitest = spawnSync(path.join(ROOT, 'node_modules', '.bin', 'vitest'), ['run', '--config', 'test/vitest.config.mts', ...passThrough], {
      cwd: ROOT,
      stdio: 'inherit',
      env,
    });
    status = vitest.status ?? 1;
  }
  if (status === 0 && only !== 'unit') {
    ensureWebBuild();
    ensureDatabase(bin, layout, port, 'squadline_e2e');
    const dbEnv = { DATABASE_URL: databaseUrl(port, password, 'squadline_e2e') };
    tsxSync(['server/dev/db-cli.ts', 'reset'], dbEnv);
    const webPort = await freePort();
    const uploads = fs.mkdtempSync(path.join(root, 'uploads-'));
    server = tsx(['server/index.ts'], {
      ...dbEnv,
      PORT: String(webPort),
      WEB_DIR: DIST_DIR,
      LOCAL_UPLOADS_DIR: uploads,
      LOG_LEVEL: 'warn',
    });
    await waitForHealth(`http://127.0.0.1:${webPort}/api/health`);
    log('Browser tests (Playwright + Chromium)...');
    const pw = spawnSync(path.join(ROOT, 'node_modules', '.bin', 'playwright'), ['test', '--config', 'test/playwright.config.ts', ...passThrough], {
      cwd: ROOT,
      stdio: 'inherit',
      env: {
        ...process.env,
        BASE_URL: `http://127.0.0.1:${webPort}`,
        CHROMIUM_PATH: chromium,
        ...(samplePhotos ? { SAMPLE_PHOTOS_DIR: samplePhotos } : {}),
      },
    });
    status = pw.status ?? 1;
  }
} catch (error) {
  console.error(error);
  status = 1;
} finally {
  cleanup();
}
process.exit(status);

async function waitForHealth(url) {
  const deadline = Date.now() + 60_000;
  while (Date.now() < deadline) {
    if (server.exitCode !== null) throw new Error('The server exited before it was ready.');
    try {
      const res = await fetch(url);
      if (res.ok) return;
    } catch {
      // not listening yet
    }
    await new Promise((r) => setTimeout(r, 250));
  }
  throw new Error(`The server did not answer ${url} within 60 s.`);
}
