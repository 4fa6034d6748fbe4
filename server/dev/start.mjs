// `npm start`: install what is missing, start the private database, migrate, seed the demo once,
// build the web app when its sources changed, and serve app + API from one process.
// `npm start -- --reset` (used by `npm run db:reset`) rebuilds the demo database first.
import fs from 'node:fs';
import path from 'node:path';
import {
  DATA_DIR, DIST_DIR, ROOT, clusterLayout, databaseUrl, ensureDatabase, ensureNodeModules, ensurePostgres,
  ensureWebBuild, fail, freePort, initCluster, isClusterRunning, log, makeClusterRoot, newPassword,
  startCluster, stopCluster, tsx, tsxSync,
} from './bootstrap.mjs';

const resetOnly = process.argv.includes('--reset-only');
const reset = resetOnly || process.argv.includes('--reset');
const webPort = Number(process.env.PORT ?? 8080);
if (!Number.isInteger(webPort) || webPort <= 0) fail(`PORT must be a port number, got "${process.env.PORT}".`);

ensureNodeModules();
const bin = ensurePostgres();

// The cluster's location, port and password are remembered in the git-ignored .data folder.
fs.mkdirSync(DATA_DIR, { recursive: true, mode: 0o700 });
const stateFile = path.join(DATA_DIR, 'postgres.json');
let state = fs.existsSync(stateFile) ? JSON.parse(fs.readFileSync(stateFile, 'utf8')) : null;
if (state && !fs.existsSync(path.join(state.root, 'data', 'PG_VERSION'))) state = null;
if (!state) {
  log('Creating a private PostgreSQL cluster (first run)...');
  const root = makeClusterRoot('squadline-pg-');
  const password = newPassword();
  initCluster(bin, clusterLayout(root), password);
  state = { root, password, port: await freePort() };
  fs.writeFileSync(stateFile, JSON.stringify(state, null, 2), { mode: 0o600 });
}
const layout = clusterLayout(state.root);
let startedCluster = false;
if (!isClusterRunning(bin, layout)) {
  state.port = await freePort();
  fs.writeFileSync(stateFile, JSON.stringify(state, null, 2), { mode: 0o600 });
  startCluster(bin, layout, state.port);
  startedCluster = true;
}
const stopDb = () => {
  if (startedCluster) {
    stopCluster(bin, layout);
    startedCluster = false;
  }
};

try {
  const env = { DATABASE_URL: databaseUrl(state.port, state.password, 'squadline') };
  ensureDatabase(bin, layout, state.port, 'squadline');
  tsxSync(['db/cli.ts', reset ? 'reset' : 'prepare'], env);
  if (resetOnly) {
    stopDb();
    log('Demo database rebuilt.');
    process.exit(0);
  }
  ensureWebBuild();

  const server = tsx(['server/index.ts'], {
    ...env,
    PORT: String(webPort),
    WEB_DIR: DIST_DIR,
    DEMO_BANNER: '1',
  });
  const shutdown = () => server.kill('SIGTERM');
  process.on('SIGINT', shutdown);
  process.on('SIGTERM', shutdown);
  server.on('exit', (code) => {
    stopDb();
    process.exit(code ?? 0);
  });
} catch (error) {
  stopDb();
  fail(error instanceof Error ? error.message : String(error));
}
