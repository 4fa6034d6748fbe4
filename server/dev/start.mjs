// `npm start`: install what is missing, start the private database, migrate, seed the demo once,
// build the web app when its sources changed, and serve app + API from one process.
// `npm run db:reset` runs this with --reset-only: rebuild the demo database, then stop.
import { DIST_DIR, ensureNodeModules, ensurePostgres, ensureWebBuild, fail, log, SERVER_NODE_OPTIONS, startDevCluster, tsx, tsxSync } from './bootstrap.mjs';

const resetOnly = process.argv.includes('--reset-only');
const webPort = Number(process.env.PORT ?? 8080);
if (!Number.isInteger(webPort) || webPort <= 0) fail(`PORT must be a port number, got "${process.env.PORT}".`);

ensureNodeModules();
const bin = ensurePostgres();
const cluster = await startDevCluster(bin, 'squadline');

try {
  const env = { DATABASE_URL: cluster.url };
  tsxSync(['server/dev/db-cli.ts', resetOnly ? 'reset' : 'prepare'], env);
  if (resetOnly) {
    cluster.stop();
    log('Demo database rebuilt.');
    process.exit(0);
  }
  ensureWebBuild();

  const nodeOptions = `${process.env.NODE_OPTIONS ?? ''} ${SERVER_NODE_OPTIONS}`.trim();
  const server = tsx(['server/index.ts'], { ...env, PORT: String(webPort), WEB_DIR: DIST_DIR, DEMO_BANNER: '1', NODE_OPTIONS: nodeOptions });
  const shutdown = () => server.kill('SIGTERM');
  process.on('SIGINT', shutdown);
  process.on('SIGTERM', shutdown);
  server.on('exit', (code) => {
    cluster.stop();
    process.exit(code ?? 0);
  });
} catch (error) {
  cluster.stop();
  fail(error instanceof Error ? error.message : String(error));
}
