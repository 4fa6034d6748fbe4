// `npm run dev`: the private database, the API with reload (tsx watch) on PORT (8080), and the Expo
// dev server for the web on 8081. The app calls the API through EXPO_PUBLIC_API_URL; the API allows
// that one origin (DEV_WEB_ORIGIN) with credentials.
import { spawn } from 'node:child_process';
import path from 'node:path';
import { METRO_ENV, ROOT, ensureNodeModules, ensurePostgres, startDevCluster, tsx, tsxSync } from './bootstrap.mjs';

const apiPort = Number(process.env.PORT ?? 8080);
ensureNodeModules();
const bin = ensurePostgres();
const cluster = await startDevCluster(bin, 'squadline');
tsxSync(['server/dev/db-cli.ts', 'prepare'], { DATABASE_URL: cluster.url });

const webOrigin = 'http://localhost:8081';
const api = tsx(['watch', '--clear-screen=false', 'server/index.ts'], {
  DATABASE_URL: cluster.url,
  PORT: String(apiPort),
  DEV_WEB_ORIGIN: webOrigin,
  PUBLIC_URL: webOrigin,
  DEMO_BANNER: '1',
});
const web = spawn(path.join(ROOT, 'node_modules', '.bin', 'expo'), ['start', '--web', '--port', '8081'], {
  cwd: ROOT,
  stdio: 'inherit',
  env: { ...process.env, ...METRO_ENV, EXPO_PUBLIC_API_URL: `http://localhost:${apiPort}` },
});

let stopping = false;
const stop = () => {
  if (stopping) return;
  stopping = true;
  api.kill('SIGTERM');
  web.kill('SIGTERM');
  setTimeout(() => {
    cluster.stop();
    process.exit(0);
  }, 1500);
};
process.on('SIGINT', stop);
process.on('SIGTERM', stop);
api.on('exit', stop);
web.on('exit', stop);
