// Shared by the fault runs and the load benchmark: a throw-away PostgreSQL cluster, server processes
// started as in production (`tsx server/index.ts`), and a small HTTP client with the session cookie.
import { spawn } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import pg from 'pg';
import {
  clusterLayout,
  databaseUrl,
  ensureDatabase,
  ensureNodeModules,
  ensurePostgres,
  freePort,
  initCluster,
  log,
  makeClusterRoot,
  newPassword,
  startCluster,
  stopCluster,
  tsx,
  tsxSync,
} from '../../server/dev/bootstrap.mjs';

export { freePort, log, tsx };

const ROOT = path.resolve(path.dirname(new URL(import.meta.url).pathname), '../..');

/**
 * A TypeScript entry run as production should run it: `node --import tsx <file>`, one process that
 * receives the signals itself. (The tsx command line sits in between and kills a child with SIGKILL
 * when it does not acknowledge a signal within 30 ms, which a loaded machine can miss.)
 */
export function nodeTs(file, env, stdio = 'inherit') {
  return spawn(process.execPath, ['--import', 'tsx', file], { cwd: ROOT, env: { ...process.env, ...env }, stdio });
}

export const DEMO_PASSWORD = 'squadline-demo';

export function check(condition, message) {
  if (!condition) throw new Error(`FAILED: ${message}`);
  log(`ok: ${message}`);
}

export const sleep = (ms) => new Promise((r) => setTimeout(r, ms));

/** A private cluster with one database loaded with the demo data. */
export async function startDatabase(prefix, dbName) {
  ensureNodeModules();
  const bin = ensurePostgres();
  const root = makeClusterRoot(prefix);
  const layout = clusterLayout(root);
  const password = newPassword();
  const port = await freePort();
  initCluster(bin, layout, password);
  startCluster(bin, layout, port);
  ensureDatabase(bin, layout, port, dbName);
  const url = databaseUrl(port, password, dbName);
  tsxSync(['server/dev/db-cli.ts', 'reset'], { DATABASE_URL: url, LOG_LEVEL: 'warn' });
  return {
    url,
    root,
    /** The cluster's data folder (its postmaster.pid names the process). */
    dataDir: layout.data,
    stop: () => stopCluster(bin, layout),
    start: () => startCluster(bin, layout, port),
    cleanup() {
      stopCluster(bin, layout);
      fs.rmSync(root, { recursive: true, force: true });
    },
    async query(text, params = []) {
      const client = new pg.Client({ connectionString: url });
      await client.connect();
      try {
        return (await client.query(text, params)).rows;
      } finally {
        await client.end();
      }
    },
  };
}

/** One server process, as `npm start` runs it in production (no web export). */
export async function startServer(env, options = {}) {
  const port = options.port ?? (await freePort());
  const proc = nodeTs('server/index.ts', { PORT: String(port), LOG_LEVEL: 'warn', ...env }, ['ignore', 'inherit', 'inherit']);
  const base = `http://127.0.0.1:${port}`;
  const exited = new Promise((resolve) => proc.on('exit', (code, signal) => resolve({ code, signal, at: Date.now() })));
  const deadline = Date.now() + 60_000;
  for (;;) {
    if (proc.exitCode !== null) throw new Error('The server exited before it was ready.');
    try {
      if ((await fetch(`${base}/api/health`)).ok) break;
    } catch {
      // not listening yet
    }
    if (Date.now() > deadline) throw new Error(`The server did not answer ${base}/api/health within 60 s.`);
    await sleep(200);
  }
  return { proc, port, base, exited };
}

/** A signed-in client: JSON requests with the session cookie; `status` 0 means the connection failed. */
export async function client(base, email, password = DEMO_PASSWORD) {
  const res = await fetch(`${base}/api/auth/sign-in`, {
    method: 'POST',
    headers: { 'Content-Type': 'application/json' },
    body: JSON.stringify({ email, password }),
  });
  if (res.status !== 200) throw new Error(`sign-in failed for ${email}: ${res.status}`);
  const cookie = res.headers
    .getSetCookie()
    .find((c) => c.startsWith('squadline_session='))
    ?.split(';')[0];
  const call = async (method, p, { json, form, headers = {}, timeoutMs = 30_000 } = {}) => {
    const started = Date.now();
    try {
      const res = await fetch(`${base}${p}`, {
        method,
        headers: { Cookie: cookie, ...(json !== undefined ? { 'Content-Type': 'application/json' } : {}), ...headers },
        body: json !== undefined ? JSON.stringify(json) : form,
        signal: AbortSignal.timeout(timeoutMs),
      });
      const text = await res.text();
      let body = null;
      try {
        body = JSON.parse(text);
      } catch {
        body = text;
      }
      return { status: res.status, body, ms: Date.now() - started };
    } catch (error) {
      return { status: 0, body: null, error: String(error?.cause?.code ?? error?.name ?? error), ms: Date.now() - started };
    }
  };
  return { cookie, call, base };
}

/** New rounds on the caller's squads until `want` assessments of athletes with photo consent are open. */
export async function openRounds(c, name, want) {
  const squads = await c.call('GET', '/api/squads');
  if (squads.status !== 200) throw new Error(`squads: ${squads.status}`);
  const out = [];
  for (const s of squads.body.squads) {
    if (s.archivedAt || out.length >= want) continue;
    const res = await c.call('POST', '/api/rounds', { json: { squadId: s.id, name, screenedOn: new Date().toISOString().slice(0, 10) } });
    if (res.status !== 201) throw new Error(`round: ${res.status} ${JSON.stringify(res.body)}`);
    out.push(...res.body.athletes.filter((a) => a.photoConsent).map((a) => a.assessmentId));
  }
  if (out.length < want) throw new Error(`only ${out.length} assessments with photo consent, ${want} wanted`);
  return out.slice(0, want);
}

/** A draft with one recorded task, enough to submit. */
export function draftBody(draftVersion, note = 'ok') {
  return {
    draftVersion,
    draft: {
      body: { statureCm: 152, sittingHeightCm: 79, massKg: 41 },
      tasks: { 'two-leg-squat': { criteria: ['squat-right-knee-in'], notes: note } },
      step: 'two-leg-squat',
    },
  };
}

/** Consistency of the screening tables: what "no half-written screen" means, as SQL. */
export async function screeningConsistency(db) {
  const [r] = await db.query(`select
    (select count(*)::int from assessments a where a.status = 'submitted'
       and (select count(*) from assessment_results r where r.assessment_id = a.id and r.is_current) <> 1) as "submittedWithoutOneCurrent",
    (select count(*)::int from (select assessment_id from assessment_results where is_current group by 1 having count(*) > 1) x) as "severalCurrent",
    (select count(*)::int from (select assessment_id from assessment_results group by 1 having max(version) <> count(*)) x) as "versionGaps",
    (select count(*)::int from assessment_results r where not exists (select 1 from assessments a where a.id = r.assessment_id)) as "orphanResults",
    (select count(*)::int from photos p where not exists (select 1 from assessments a where a.id = p.assessment_id)) as "orphanPhotos",
    (select count(*)::int from plan_adjustments p where not exists (select 1 from assessment_results r where r.id = p.result_id)) as "orphanAdjustments"`);
  return r;
}

/** Files under the local photo store, relative to it. */
export function storedFiles(dir) {
  const out = [];
  const walk = (d) => {
    if (!fs.existsSync(d)) return;
    for (const e of fs.readdirSync(d, { withFileTypes: true })) {
      const full = path.join(d, e.name);
      if (e.isDirectory()) walk(full);
      else out.push(path.relative(dir, full).split(path.sep).join('/'));
    }
  };
  walk(dir);
  return out.sort();
}
