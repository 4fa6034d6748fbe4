// `npm run bench:api`: a throw-away PostgreSQL, the seeded benchmark server (test/bench/api-server.ts),
// then autocannon (50 connections) against squad trends (a 40-athlete squad, 8 rounds), one athlete's
// history (8 screens), a bare `SELECT 1` route of the same server and the lightest signed-in route
// (`GET /api/me`: the session check and the app's middleware, the floor of any route behind sign-in),
// in the same run. Prints requests
// per second, p50/p95/p99 latency and errors per route, and each route's throughput as a ratio of the
// bare route's. Figures, not assertions: speed targets are read from this output.
//
//   npm run bench:api [-- --duration 15 --connections 50 --rounds 1 --warmup 3]
//
// For finding where the time goes:
//   --only me,trends        drive only these routes (select-1, me, trends, progress); the baseline always runs first
//   --cpu-prof DIR          the server profiles its CPU during each measured run: DIR/<route>.cpuprofile
//                           (read them with test/bench/cpu-profile.mjs)
//   --keep DIR              keep the seeded cluster in DIR and reuse it next time (no reseeding; migrations
//                           added since are applied by the server at start, as in production)
import autocannon from 'autocannon';
import readline from 'node:readline';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import {
  clusterLayout,
  databaseUrl,
  ensureDatabase,
  ensureNodeModules,
  ensurePostgres,
  SERVER_NODE_OPTIONS,
  freePort,
  initCluster,
  log,
  makeClusterRoot,
  newPassword,
  startCluster,
  stopCluster,
  tsx,
} from '../../server/dev/bootstrap.mjs';
import { postmasterPid as pmPid, treeCpuMs } from './cpu.mjs';

const arg = (name, fallback) => {
  const i = process.argv.indexOf(`--${name}`);
  return i > 0 ? Number(process.argv[i + 1]) : fallback;
};
const DURATION = arg('duration', 15);
const CONNECTIONS = arg('connections', 50);
const ROUNDS = arg('rounds', 1);
const WARMUP = arg('warmup', 3);
const text = (name) => {
  const i = process.argv.indexOf(`--${name}`);
  return i > 0 ? process.argv[i + 1] : undefined;
};
const ONLY = text('only')?.split(',');
const CPU_PROF = text('cpu-prof');
const KEEP = text('keep');

ensureNodeModules();
const bin = ensurePostgres();
const root = KEEP ? path.resolve(KEEP) : makeClusterRoot('squadline-bench-');
const layout = clusterLayout(root);
const stateFile = path.join(root, 'bench.json');
const kept = KEEP && fs.existsSync(stateFile) ? JSON.parse(fs.readFileSync(stateFile, 'utf8')) : null;
const password = kept?.password ?? newPassword();
const port = await freePort();
log(`Starting ${kept ? 'the kept' : KEEP ? 'a new kept' : 'a throw-away'} PostgreSQL on 127.0.0.1:${port}...`);
if (!kept) {
  if (KEEP) fs.mkdirSync(root, { recursive: true, mode: 0o755 });
  initCluster(bin, layout, password);
  if (KEEP) fs.writeFileSync(stateFile, JSON.stringify({ password }), { mode: 0o600 });
}
startCluster(bin, layout, port);
ensureDatabase(bin, layout, port, 'squadline_bench');
let server = null;
const cleanup = async () => {
  if (server && server.exitCode === null) {
    // Waited for (up to 15 s), so the kept cluster is stopped only after the server let go of it.
    const ended = new Promise((resolve) => server.once('exit', resolve));
    server.kill('SIGTERM');
    await Promise.race([ended, new Promise((resolve) => setTimeout(resolve, 15_000))]);
  }
  stopCluster(bin, layout);
  if (!KEEP) fs.rmSync(root, { recursive: true, force: true });
};
process.on('SIGINT', async () => {
  await cleanup();
  process.exit(130);
});

function percentile(sorted, p) {
  if (!sorted.length) return NaN;
  return sorted[Math.min(sorted.length - 1, Math.ceil((p / 100) * sorted.length) - 1)];
}

/** One autocannon run; latencies are recorded per response so p95 can be read (autocannon reports p97.5). */
function run(url, headers, duration) {
  return new Promise((resolve, reject) => {
    const latencies = [];
    const instance = autocannon({ url, connections: CONNECTIONS, duration, headers }, (err, result) => {
      if (err) return reject(err);
      latencies.sort((a, b) => a - b);
      resolve({ result, latencies });
    });
    instance.on('response', (_client, _status, _bytes, responseTime) => latencies.push(responseTime));
  });
}

// CPU time of the benchmark server's process tree and of the PostgreSQL postmaster's (its backends and
// workers); autocannon runs in this process and is not counted.
const serverCpuMs = treeCpuMs;
const postmasterPid = () => pmPid(layout.data);

async function finishedCount(base) {
  const res = await fetch(`${base}/bench/finished`);
  return (await res.json()).finished;
}

let status = 0;
try {
  log('Seeding 2,000 athletes x 8 rounds (16,000 screens through the engine; several minutes on 2 busy cores)...');
  // The server runs with the Node options it has in production (SERVER_NODE_OPTIONS; README, Deployment).
  const env = { DATABASE_URL: databaseUrl(port, password, 'squadline_bench'), NODE_OPTIONS: `${process.env.NODE_OPTIONS ?? ''} ${SERVER_NODE_OPTIONS}`.trim() };
  // The server profiles itself (node:inspector) during each route's measured run, one file per route.
  if (CPU_PROF) env.BENCH_CPU_PROF_DIR = path.resolve(CPU_PROF);
  server = tsx(['test/bench/api-server.ts'], env, ['ignore', 'pipe', 'inherit']);
  const ready = await new Promise((resolve, reject) => {
    const lines = readline.createInterface({ input: server.stdout });
    lines.on('line', (line) => {
      if (line.startsWith('READY ')) resolve(JSON.parse(line.slice(6)));
    });
    server.on('exit', (code) => reject(new Error(`The benchmark server exited (${code}).`)));
  });
  const base = `http://127.0.0.1:${ready.port}`;
  const auth = { cookie: ready.cookie };
  const allTargets = [
    { key: 'select-1', name: 'SELECT 1 (bare baseline)', url: `${base}/bench/select-1`, headers: {} },
    // The floor of any signed-in route: session check, one membership query, the app's middleware.
    { key: 'me', name: 'GET /api/me (signed-in floor)', url: `${base}/api/me`, headers: auth },
    { key: 'trends', name: 'GET /api/squads/:id/trends (40 athletes, 8 rounds)', url: `${base}/api/squads/${ready.squadId}/trends`, headers: auth },
    { key: 'progress', name: 'GET /api/athletes/:id/progress (8 screens)', url: `${base}/api/athletes/${ready.athleteId}/progress`, headers: auth },
  ];
  const unknown = (ONLY ?? []).filter((k) => !allTargets.some((t) => t.key === k));
  if (unknown.length) throw new Error(`--only: unknown route(s) ${unknown.join(', ')}; choose from ${allTargets.map((t) => t.key).join(', ')}.`);
  // Ratios are read against the baseline, so it always runs first.
  const targets = allTargets.filter((t, i) => i === 0 || !ONLY || ONLY.includes(t.key));
  for (const t of targets) {
    const check = await fetch(t.url, { headers: t.headers });
    if (!check.ok) throw new Error(`${t.name} answered ${check.status} before the run.`);
  }
  if (process.argv.includes('--hold')) {
    // For looking at query plans: keep the seeded database and server until Ctrl-C.
    console.log(JSON.stringify({ databaseUrl: databaseUrl(port, password, 'squadline_bench'), base, ...ready }));
    await new Promise(() => {});
  }
  // On a shared machine the load changes from one minute to the next, so with `--rounds N` the routes
  // take turns N times (baseline, then each route, again and again) and each ratio is read against the
  // baseline of its own turn; the table gives the medians over the turns.
  const turns = [];
  for (let round = 0; round < ROUNDS; round++) {
    const rows = [];
    for (const t of targets) {
      log(`turn ${round + 1}/${ROUNDS}, ${t.name}: warm-up ${WARMUP} s, then ${DURATION} s with ${CONNECTIONS} connections...`);
      await run(t.url, t.headers, WARMUP);
      if (CPU_PROF) await fetch(`${base}/bench/profile/start`, { method: 'POST' });
      const finishedBefore = await finishedCount(base);
      const nodeBefore = serverCpuMs([server.pid]);
      const pgBefore = serverCpuMs([postmasterPid()]);
      const { result, latencies } = await run(t.url, t.headers, DURATION);
      const nodeCpu = serverCpuMs([server.pid]) - nodeBefore;
      const pgCpu = serverCpuMs([postmasterPid()]) - pgBefore;
      // Divided by the answers the server finished in the window (the count request itself excluded).
      const n = (await finishedCount(base)) - finishedBefore - 1;
      if (CPU_PROF) await fetch(`${base}/bench/profile/stop?name=${t.key}-${round + 1}`, { method: 'POST' });
      rows.push({
        cpuPerRequest: n ? (nodeCpu + pgCpu) / n : NaN,
        nodePerRequest: n ? nodeCpu / n : NaN,
        pgPerRequest: n ? pgCpu / n : NaN,
        load: os.loadavg()[0],
        route: t.name,
        rps: result.requests.average,
        p50: percentile(latencies, 50),
        p95: percentile(latencies, 95),
        p99: percentile(latencies, 99),
        errors: result.errors + result.timeouts + result.non2xx,
        requests: result.requests.total,
      });
    }
    for (const r of rows) {
      r.ratio = r.rps / rows[0].rps;
      r.cpuRatio = rows[0].cpuPerRequest / r.cpuPerRequest;
    }
    turns.push(rows);
  }
  const median = (values) => {
    const v = [...values].sort((a, b) => a - b);
    return v.length % 2 ? v[(v.length - 1) / 2] : (v[v.length / 2 - 1] + v[v.length / 2]) / 2;
  };
  const ms = (v) => Math.round(v).toLocaleString('en-GB');
  console.log('');
  console.log(
    `API benchmark, ${new Date().toISOString().slice(0, 10)}, ${CONNECTIONS} connections, ${DURATION} s per route and turn, ${ROUNDS} turn(s), ${os.cpus().length} cores`,
  );
  if (ROUNDS > 1) console.log('Medians over the turns; each ratio against the SELECT 1 run of the same turn; load: range of 1-minute load averages.');
  console.log(
    'CPU ms/req: CPU time of the server and PostgreSQL per request the server finished in the window; CPU ratio: SELECT 1 CPU per request over the route CPU per request (the throughput ratio on an otherwise idle machine).',
  );
  console.log('| route | req/s | ratio to SELECT 1 | CPU ms/req (Node + PG) | CPU ratio | p50 ms | p95 ms | p99 ms | errors | requests | load |');
  console.log('| --- | ---: | ---: | ---: | ---: | ---: | ---: | ---: | ---: | ---: | ---: |');
  targets.forEach((t, i) => {
    const runs = turns.map((rows) => rows[i]);
    const pick = (key) => median(runs.map((r) => r[key]));
    const loads = runs.map((r) => r.load);
    const load = ROUNDS > 1 ? `${Math.min(...loads).toFixed(1)}-${Math.max(...loads).toFixed(1)}` : loads[0].toFixed(1);
    const sum = (key) => runs.reduce((n, r) => n + r[key], 0);
    console.log(
      `| ${t.name} | ${pick('rps').toFixed(0)} | ${pick('ratio').toFixed(2)} | ${pick('cpuPerRequest').toFixed(2)} (${pick('nodePerRequest').toFixed(2)} + ${pick('pgPerRequest').toFixed(2)}) | ${pick('cpuRatio').toFixed(2)} | ${ms(pick('p50'))} | ${ms(pick('p95'))} | ${ms(pick('p99'))} | ${sum('errors')} | ${sum('requests')} | ${load} |`,
    );
  });
  if (ROUNDS > 1) {
    console.log('');
    console.log('Per turn (req/s, ratio; CPU per request):');
    turns.forEach((rows, n) =>
      console.log(`  turn ${n + 1}: ${rows.map((r) => `${r.rps.toFixed(0)} (${r.ratio.toFixed(2)}; CPU ${r.cpuPerRequest.toFixed(2)} ms)`).join(' | ')}`),
    );
  }
} catch (error) {
  console.error(error);
  status = 1;
} finally {
  await cleanup();
}
process.exit(status);
