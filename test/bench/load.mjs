// `npm run bench:load [-- --processes 2] [--duration 30] [--connections 50]`
//
// Load benchmark with autocannon against a seeded club of 2,000 athletes: sign-in, squad list, athlete
// history, draft saves and photo uploads, each for `--duration` seconds with `--connections`
// connections, beside a bare route of the same server in the same run (figures as ratios to it).
// Prints requests per second, p50/p95/p99 latency, errors and the server's peak memory, then counts
// what was written (zero lost writes is the bar). With `--processes N` (N > 1) the same runs are made
// on one process and on N processes sharing the port (Node's cluster module), and the checks that
// several processes must pass are made: sessions, sign-in rate limits, the e-mail queue and draft
// version checks behave as with one.
import autocannon from 'autocannon';
import { spawn } from 'node:child_process';
import { randomUUID } from 'node:crypto';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import readline from 'node:readline';
import sharp from 'sharp';
import { check, client, freePort, log, nodeTs, sleep, startDatabase } from '../faults/harness.mjs';
import { machineBusyMs, postmasterPid, treeCpuMs } from './cpu.mjs';

const ROOT = path.resolve(path.dirname(new URL(import.meta.url).pathname), '../..');
const arg = (name, fallback) => {
  const i = process.argv.indexOf(`--${name}`);
  return i >= 0 ? Number(process.argv[i + 1]) : fallback;
};
const PROCESSES = arg('processes', 1);
const DURATION = arg('duration', 30);
const CONNECTIONS = arg('connections', 50);
const ATHLETES = 2000;
const SQUADS = 20;

const work = fs.mkdtempSync(path.join(os.tmpdir(), 'squadline-bench-'));
const db = await startDatabase('squadline-bench-', 'squadline_bench');
const children = new Set();
let status = 0;
// A failed check is reported and the run goes on, so that every figure is printed; the exit status says it.
const failures = [];
function soft(condition, message) {
  try {
    check(condition, message);
  } catch (error) {
    log(error.message);
    failures.push(error.message);
  }
}
const loadNow = () =>
  os
    .loadavg()
    .map((l) => l.toFixed(1))
    .join(' ');
const loadAtStart = loadNow();

async function seedClub() {
  // One statement per table: a club, 20 squads of 100, 2,000 athletes whose families agreed to screening
  // and to photos (nothing of a screen is saved without the first), a head coach
  // signing in with the demo password (its hash is copied from a demo account).
  await db.query(`
    with club as (insert into clubs (name) values ('Bench Racket Club') returning id),
    sq as (insert into squads (club_id, name) select club.id, 'Squad ' || lpad(g::text, 2, '0') from club, generate_series(1, ${SQUADS}) g returning id, club_id, name),
    numbered as (select id, club_id, row_number() over (order by name) - 1 as n from sq),
    ath as (
      insert into athletes (club_id, squad_id, first_name, last_name, date_of_birth, sex, racket_hand, take_off_leg)
      select s.club_id, s.id, 'Athlete' || g, 'Bench' || (g % 97), (date '2011-01-01' + (g % 1500)::int)::date,
             (case when g % 2 = 0 then 'female' else 'male' end)::sex,
             (case when g % 7 = 0 then 'left' else 'right' end)::side, (case when g % 3 = 0 then 'right' else 'left' end)::side
      from numbered s, generate_series(1, ${ATHLETES / SQUADS}) g0, lateral (select s.n * ${ATHLETES / SQUADS} + g0 as g) x
      returning id)
    insert into consents (athlete_id, kind, granted, decided_on)
      select id, k::consent_kind, true, date '2026-09-01' from ath, unnest(array['photos', 'screening']) k`);
  await db.query(`
    with u as (insert into users (email, display_name, password_hash)
               select 'coach@bench.test', 'Bench Coach', password_hash from users where email = 'tester@squadline.test' returning id)
    insert into memberships (user_id, club_id, role) select u.id, c.id, 'head_coach' from u, clubs c where c.name = 'Bench Racket Club'`);
  // Accounts for the e-mail queue checks: one password reset each (a reset per address has a cooldown).
  await db.query(`
    insert into users (email, display_name, password_hash)
    select 'reset-' || t || '-' || g || '@bench.test', 'Reset ' || g, (select password_hash from users where email = 'tester@squadline.test')
    from unnest(array['one', 'many']) t, generate_series(1, 10) g`);
  // The sign-in runs: one account per server, so that each counts its own sessions.
  await db.query(`
    insert into users (email, display_name, password_hash)
    select 'signin-' || t || '@bench.test', 'Sign-in ' || t, (select password_hash from users where email = 'tester@squadline.test')
    from unnest(array['one', 'many']) t`);
  const [n] = await db.query(`select count(*)::int as n from athletes a join clubs c on c.id = a.club_id where c.name = 'Bench Racket Club'`);
  check(n.n === ATHLETES, `seeded a club of ${n.n} athletes in ${SQUADS} squads`);
}

function startSmtp(port, inbox) {
  const proc = spawn(path.join(ROOT, 'node_modules', '.bin', 'tsx'), ['test/faults/smtp.ts', String(port)], {
    cwd: ROOT,
    stdio: ['ignore', 'pipe', 'inherit'],
  });
  children.add(proc);
  return new Promise((resolve) => {
    readline.createInterface({ input: proc.stdout }).on('line', (line) => {
      const msg = JSON.parse(line);
      if (msg.listening) resolve(proc);
      if (msg.message) inbox.push(msg.message);
    });
  });
}

async function startBenchServer(processes, env) {
  const port = await freePort();
  const proc = nodeTs('test/bench/server.ts', { PORT: String(port), LOG_LEVEL: 'error', BENCH_PROCESSES: String(processes), ...env }, [
    'ignore',
    'inherit',
    'inherit',
  ]);
  children.add(proc);
  const base = `http://127.0.0.1:${port}`;
  const deadline = Date.now() + 180_000;
  // Ready when every process answers (each has its own pid).
  const pids = new Set();
  while (pids.size < processes) {
    if (Date.now() > deadline) throw new Error('bench server did not start');
    try {
      // A new connection each time: the cluster hands connections, not requests, round-robin.
      const res = await fetch(`${base}/api/health`, { headers: { Connection: 'close' } });
      if (res.ok) pids.add(res.headers.get('x-bench-pid'));
      else await sleep(300);
    } catch {
      await sleep(300);
    }
  }
  return {
    base,
    pid: proc.pid,
    async stop() {
      const exited = new Promise((r) => proc.on('exit', r));
      proc.kill('SIGTERM');
      await exited;
      children.delete(proc);
    },
    /** Peak resident memory of each server process (asked until every pid answered). */
    async peakMemory() {
      const seen = new Map();
      for (let i = 0; i < 40 && seen.size < processes; i++) {
        const m = await (await fetch(`${base}/bench/memory`, { headers: { Connection: 'close' } })).json();
        seen.set(m.pid, m.peakRssBytes);
      }
      return Math.max(...seen.values());
    },
  };
}

function percentile(sorted, p) {
  if (sorted.length === 0) return NaN;
  return sorted[Math.min(sorted.length - 1, Math.floor((p / 100) * sorted.length))];
}

/**
 * CPU time so far, in ms: the server's process tree (with two processes, the cluster's primary and its
 * workers), PostgreSQL (the postmaster and its backends), this process (autocannon, the load
 * generator), and the whole machine. Differences over a run say where the cores went.
 */
function cpuNow(server) {
  const own = process.cpuUsage();
  return {
    server: treeCpuMs([server.pid]),
    postgres: treeCpuMs([postmasterPid(db.dataDir)]),
    client: (own.user + own.system) / 1000,
    machine: machineBusyMs(),
    at: performance.now(),
  };
}

/** One autocannon run; latencies collected per response to give p95 too. */
async function run(name, server, options) {
  const latencies = [];
  const statuses = {};
  const cpuBefore = cpuNow(server);
  // 30 s timeout: on a small shared machine a photo upload can queue behind others for a while.
  const instance = autocannon({ url: server.base, connections: CONNECTIONS, duration: DURATION, timeout: 30, ...options });
  instance.on('response', (_client, statusCode, _bytes, responseTime) => {
    latencies.push(responseTime);
    statuses[statusCode] = (statuses[statusCode] ?? 0) + 1;
  });
  const result = await instance;
  const cpuAfter = cpuNow(server);
  latencies.sort((a, b) => a - b);
  const ok = Object.entries(statuses)
    .filter(([s]) => Number(s) < 300)
    .reduce((n, [, c]) => n + c, 0);
  const wall = cpuAfter.at - cpuBefore.at;
  const spent = Object.fromEntries(['server', 'postgres', 'client', 'machine'].map((k) => [k, cpuAfter[k] - cpuBefore[k]]));
  return {
    name,
    rps: result.requests.average,
    p50: percentile(latencies, 50),
    p95: percentile(latencies, 95),
    p99: percentile(latencies, 99),
    // autocannon counts a timeout among its errors too: not added twice.
    errors: result.errors + result.non2xx,
    detail: { errors: result.errors, timeouts: result.timeouts, non2xx: result.non2xx },
    ok,
    statuses,
    cpu: {
      // CPU ms per answered request, and cores kept busy on average over the run.
      serverPerRequest: spent.server / latencies.length,
      postgresPerRequest: spent.postgres / latencies.length,
      cores: {
        server: spent.server / wall,
        postgres: spent.postgres / wall,
        client: spent.client / wall,
        other: (spent.machine - spent.server - spent.postgres - spent.client) / wall,
        machine: spent.machine / wall,
      },
    },
  };
}

function table(rows, bare, peakBare, peakAll) {
  const f = (n, d = 0) => (Number.isFinite(n) ? n.toFixed(d) : '-');
  const lines = [
    `| route | req/s | vs bare | p50 ms | p95 ms | p99 ms | errors |`,
    `| --- | ---: | ---: | ---: | ---: | ---: | ---: |`,
    ...rows.map((r) => `| ${r.name} | ${f(r.rps)} | ${f(r.rps / bare.rps, 3)} | ${f(r.p50)} | ${f(r.p95)} | ${f(r.p99)} | ${r.errors} |`),
  ];
  lines.push(
    '',
    `server peak memory: ${f(peakBare / 2 ** 20)} MB after the bare run, ${f(peakAll / 2 ** 20)} MB after all runs (x${f(peakAll / peakBare, 2)})`,
    '',
    `CPU per answered request, and cores kept busy during the run (of ${os.cpus().length}; "other" is everything else on the machine):`,
    '',
    `| route | server ms/req | PostgreSQL ms/req | cores: server | PostgreSQL | load generator | other | machine |`,
    `| --- | ---: | ---: | ---: | ---: | ---: | ---: | ---: |`,
    ...rows.map(
      ({ name, cpu: c }) =>
        `| ${name} | ${f(c.serverPerRequest, 2)} | ${f(c.postgresPerRequest, 2)} | ${f(c.cores.server, 2)} | ${f(c.cores.postgres, 2)} | ${f(c.cores.client, 2)} | ${f(c.cores.other, 2)} | ${f(c.cores.machine, 2)} |`,
    ),
  );
  return lines.join('\n');
}

/**
 * The photo a phone sends after the web client has scaled it (scale-photo.web.ts: long side 1600 px,
 * JPEG quality 0.85): 1200x1600 with grain and a gradient like a photo of a sports hall, about 270 KB.
 * A flat synthetic image would be a tenth of that and cheaper to decode and encode than any real photo.
 */
async function jpeg() {
  const width = 1200;
  const height = 1600;
  const pixels = Buffer.alloc(width * height * 3);
  let seed = 1;
  for (let i = 0; i < pixels.length; i++) {
    seed = (seed * 1103515245 + 12345) & 0x7fffffff;
    pixels[i] = 90 + ((seed >> 16) % 80) + (Math.floor(i / 3 / width) % 40);
  }
  return sharp(pixels, { raw: { width, height, channels: 3 } })
    .blur(1.2)
    .composite([{ input: Buffer.from(`<svg width="${width}" height="${height}"><circle cx="600" cy="500" r="250" fill="#223"/></svg>`) }])
    .jpeg({ quality: 85 })
    .toBuffer();
}

function multipartBody(photo) {
  const b = `----bench${randomUUID().replaceAll('-', '')}`;
  const part = (name, value) => `--${b}\r\nContent-Disposition: form-data; name="${name}"\r\n\r\n${value}\r\n`;
  const body = Buffer.concat([
    Buffer.from(
      part('task', 'two-leg-squat') +
        part('view', 'front') +
        `--${b}\r\nContent-Disposition: form-data; name="photo"; filename="squat.jpg"\r\nContent-Type: image/jpeg\r\n\r\n`,
    ),
    photo,
    Buffer.from(`\r\n--${b}--\r\n`),
  ]);
  return { body, contentType: `multipart/form-data; boundary=${b}` };
}

/**
 * One server's side of the runs: its rounds, its routes (as autocannon options) and, after the runs,
 * the count of what it wrote against what it acknowledged.
 */
async function prepare(server, label, tag) {
  const coach = await client(server.base, 'coach@bench.test');
  const squads = (await coach.call('GET', '/api/squads')).body.squads;
  const athletes = (await coach.call('GET', `/api/squads/${squads[0].id}/athletes`)).body;
  const athleteIds = (athletes.athletes ?? athletes).map((a) => a.id);
  // Fresh rounds for this server: draft saves on one squad, photos on another.
  const round = async (squadId) => {
    const r = await coach.call('POST', '/api/rounds', { json: { squadId, name: `Bench ${label}`, screenedOn: '2026-11-20' } });
    if (r.status !== 201) throw new Error(`round: ${r.status} ${JSON.stringify(r.body)}`);
    return r.body.athletes.map((a) => a.assessmentId);
  };
  const draftIds = await round(squads[1].id);
  const photoIds = await round(squads[2].id);
  const headers = { Cookie: coach.cookie };
  const upload = multipartBody(await jpeg());
  // Each connection is one phone with its own address, as behind a load balancer that sets
  // X-Forwarded-For (trusted from loopback only): 50 sign-ins at once from one address would be held
  // back by the per-address limit, which counts attempts until they succeed.
  let phone = 0;
  let h = 0;
  let p = 0;
  // Each save takes an assessment nobody else is saving and follows its version, as a tester's phone
  // does; the answer hands it back with the new version. (autocannon resets a connection's context
  // after each request, so the free list lives here.) 100 assessments for 50 connections: never empty.
  const free = draftIds.map((id) => ({ id, version: 0 }));
  const acknowledged = new Map();
  const routes = [
    { name: 'bare route (baseline)', requests: [{ method: 'GET', path: '/bench/bare' }] },
    {
      name: 'sign-in',
      requests: [
        {
          method: 'POST',
          path: '/api/auth/sign-in',
          body: JSON.stringify({ email: `signin-${tag}@bench.test`, password: 'squadline-demo' }),
          setupRequest(req, context) {
            context.address ??= `10.${label.length}.${Math.floor(phone / 250)}.${(phone++ % 250) + 1}`;
            return { ...req, headers: { 'Content-Type': 'application/json', 'X-Forwarded-For': context.address } };
          },
        },
      ],
    },
    { name: 'squad list (100 athletes)', requests: [{ method: 'GET', path: `/api/squads/${squads[0].id}/athletes`, headers }] },
    {
      name: 'athlete history',
      requests: [{ method: 'GET', headers, setupRequest: (req) => ({ ...req, path: `/api/athletes/${athleteIds[h++ % athleteIds.length]}/assessments` }) }],
    },
    {
      name: 'draft save',
      requests: [
        {
          method: 'PUT',
          headers: { ...headers, 'Content-Type': 'application/json' },
          setupRequest(req, context) {
            const a = free.shift();
            context.assessment = a;
            const body = { draftVersion: a.version, draft: { body: { statureCm: 150 }, tasks: { 'two-leg-squat': { criteria: [], notes: `v${a.version}` } } } };
            return { ...req, path: `/api/assessments/${a.id}`, body: JSON.stringify(body) };
          },
          onResponse(statusCode, body, context) {
            const a = context.assessment;
            if (statusCode === 200) {
              a.version = JSON.parse(body).draftVersion;
              acknowledged.set(a.id, (acknowledged.get(a.id) ?? 0) + 1);
            }
            free.push(a);
          },
        },
      ],
    },
    {
      name: 'photo upload (1200x1600 JPEG)',
      requests: [
        {
          method: 'POST',
          headers: { ...headers, 'Content-Type': upload.contentType },
          body: upload.body,
          setupRequest: (req) => ({ ...req, path: `/api/assessments/${photoIds[p++ % photoIds.length]}/photos` }),
        },
      ],
    },
  ];
  const [sessionsBefore] = await db.query('select count(*)::int as n from sessions s join users u on u.id = s.user_id where u.email = $1', [
    `signin-${tag}@bench.test`,
  ]);

  /**
   * Count what was written against what was acknowledged. A run ends with up to one request per
   * connection in flight, and a request the client gave up on (timeout) still completes on the
   * server: those may add to each count, never take from it (a lost write) nor add more (a doubled one).
   */
  async function verify(results) {
    const [, signIn, , , drafts, photos] = results;
    await sleep(3000); // let the requests in flight at the end finish
    const rows = await db.query('select id, draft_version as v from assessments where id = any($1)', [draftIds]);
    const wrong = rows.filter((r) => r.v - (acknowledged.get(r.id) ?? 0) < 0 || r.v - (acknowledged.get(r.id) ?? 0) > 1 + drafts.detail.timeouts);
    const inFlight = rows.reduce((n, r) => n + r.v - (acknowledged.get(r.id) ?? 0), 0);
    soft(
      wrong.length === 0 && inFlight <= CONNECTIONS + drafts.detail.timeouts,
      `${label}: draft saves: ${drafts.ok} acknowledged, none lost, none doubled (${inFlight} more completed after the client stopped waiting; ${wrong.length} assessments off)`,
    );
    const [photoRows] = await db.query('select count(*)::int as n from photos where assessment_id = any($1)', [photoIds]);
    soft(
      photoRows.n >= photos.ok && photoRows.n <= photos.ok + CONNECTIONS + photos.detail.timeouts,
      `${label}: photo uploads: ${photos.ok} acknowledged, ${photoRows.n} stored (the difference completed after the client stopped waiting)`,
    );
    // Sessions of this side's sign-in account (each side signs in to its own).
    const [sessionsAfter] = await db.query('select count(*)::int as n from sessions s join users u on u.id = s.user_id where u.email = $1', [
      `signin-${tag}@bench.test`,
    ]);
    const sessions = sessionsAfter.n - sessionsBefore.n;
    soft(
      sessions >= signIn.ok && sessions <= signIn.ok + CONNECTIONS + signIn.detail.timeouts,
      `${label}: sign-ins: ${signIn.ok} acknowledged, ${sessions} sessions stored`,
    );
  }
  return { server, label, routes, verify };
}

/** Which process answered (the bench server's header). */
const pidOf = (res) => res.headers.get('x-bench-pid');

/**
 * What several processes must do as one; run on the one-process server too, as the reference.
 * `tag` keeps the two runs apart (other accounts, other e-mail addresses).
 */
async function crossChecks(server, inbox, tag, processes) {
  log(`--- ${processes} process${processes > 1 ? 'es' : ''}: sessions, rate limits, e-mail queue, draft versions ---`);
  const out = {};
  // Sessions: one sign-in, then the cookie on fresh connections (round-robin over the processes).
  const coach = await client(server.base, 'coach@bench.test');
  const byPid = new Map();
  let ok = 0;
  for (let i = 0; i < 20; i++) {
    const res = await fetch(`${server.base}/api/me`, { headers: { Cookie: coach.cookie, Connection: 'close' } });
    byPid.set(pidOf(res), (byPid.get(pidOf(res)) ?? 0) + 1);
    if (res.status === 200) ok += 1;
  }
  soft(
    ok === 20 && byPid.size === processes,
    `sessions: one sign-in valid on every process (${ok}/20 answered 200, by ${byPid.size} process(es): ${[...byPid.values()].join(' + ')})`,
  );

  // Rate limits: wrong passwords for one account, each on a fresh connection, so that with two
  // processes they alternate between them. The attempt refused first must be the same as with one.
  const attempts = [];
  const pids = new Set();
  for (let i = 0; i < 12; i++) {
    const res = await fetch(`${server.base}/api/auth/sign-in`, {
      method: 'POST',
      headers: { 'Content-Type': 'application/json', Connection: 'close' },
      body: JSON.stringify({ email: `limit-${tag}@bench.test`, password: 'wrong password' }),
    });
    attempts.push(`${res.status}@${pidOf(res)}`);
    pids.add(pidOf(res));
  }
  out.limitedAt = attempts.findIndex((a) => a.startsWith('429')) + 1;
  soft(
    out.limitedAt === 9 && pids.size === processes,
    `rate limits: wrong passwords for one account over ${pids.size} process(es), the first refused is attempt ${out.limitedAt} (limit 8) [${attempts.join(' ')}]`,
  );

  // E-mail queue: one password reset for each of 10 accounts (the per-address cooldown allows one
  // each), every process runs a mail worker on the same queue; each address must get exactly one.
  const before = inbox.length;
  const resetPids = new Set();
  for (let i = 1; i <= 10; i++) {
    const res = await fetch(`${server.base}/api/auth/password-reset`, {
      method: 'POST',
      headers: { 'Content-Type': 'application/json', Connection: 'close', 'X-Forwarded-For': `10.99.${processes}.${i}` },
      body: JSON.stringify({ email: `reset-${tag}-${i}@bench.test` }),
    });
    resetPids.add(pidOf(res));
    if (res.status >= 300) throw new Error(`password reset: ${res.status}`);
  }
  const started = Date.now();
  while (inbox.length - before < 10 && Date.now() - started < 60_000) await sleep(200);
  await sleep(3000); // a doubled message would arrive now
  const received = inbox.slice(before).flatMap((m) => m.to);
  const each = Array.from({ length: 10 }, (_, i) => received.filter((to) => to.includes(`reset-${tag}-${i + 1}@bench.test`)).length);
  soft(
    each.every((n) => n === 1) && received.length === 10,
    `e-mail queue: 10 resets asked through ${resetPids.size} process(es), ${received.length} e-mails delivered, one per address (${each.join(' ')})`,
  );

  // Draft versions: two saves naming the same version at once, each on its own connection.
  const squads = (await coach.call('GET', '/api/squads')).body.squads;
  const r = await coach.call('POST', '/api/rounds', { json: { squadId: squads[3 + processes].id, name: `Version race ${tag}`, screenedOn: '2026-11-21' } });
  if (r.status !== 201) throw new Error(`round: ${r.status}`);
  const ids = r.body.athletes.slice(0, 20).map((a) => a.assessmentId);
  let exactlyOne = 0;
  let across = 0;
  for (const id of ids) {
    const save = () =>
      fetch(`${server.base}/api/assessments/${id}`, {
        method: 'PUT',
        headers: { Cookie: coach.cookie, 'Content-Type': 'application/json', Connection: 'close' },
        body: JSON.stringify({ draftVersion: 0, draft: { body: {}, tasks: {} } }),
      }).then((res) => ({ status: res.status, pid: pidOf(res) }));
    const both = await Promise.all([save(), save()]);
    const statuses = both.map((b) => b.status).sort();
    if (statuses[0] === 200 && statuses[1] === 409) exactlyOne += 1;
    if (both[0].pid !== both[1].pid) across += 1;
  }
  const [v] = await db.query('select count(*)::int as n from assessments where id = any($1) and draft_version = 1', [ids]);
  soft(
    exactlyOne === 20 && v.n === 20 && (processes === 1 || across > 0),
    `draft versions: 20 races of two saves naming one version (${across} split over two processes): each one 200 and one 409 (${exactlyOne}), every draft at version 1 (${v.n})`,
  );
  return out;
}

try {
  await seedClub();
  const inbox = [];
  const smtpPort = await freePort();
  await startSmtp(smtpPort, inbox);
  const env = { DATABASE_URL: db.url, LOCAL_UPLOADS_DIR: path.join(work, 'uploads'), SMTP_URL: `smtp://127.0.0.1:${smtpPort}`, MAIL_RETRY_DELAY_SECONDS: '1' };
  // Both servers run side by side and each route is driven on one, then on the other, so that a
  // change in the machine's load (it is shared) falls on both alike.
  const sides = [await prepare(await startBenchServer(1, env), '1 process', 'one')];
  if (PROCESSES > 1) sides.push(await prepare(await startBenchServer(PROCESSES, env), `${PROCESSES} processes`, 'many'));
  log(`--- ${CONNECTIONS} connections, ${DURATION} s per route and server; load average ${loadNow()} ---`);
  const results = sides.map(() => []);
  const peakBare = [];
  for (let r = 0; r < sides[0].routes.length; r++) {
    for (let i = 0; i < sides.length; i++) {
      const { name, requests } = sides[i].routes[r];
      results[i].push(await run(name, sides[i].server, { requests }));
      log(`   ${sides[i].label}, ${name}: ${results[i][r].rps.toFixed(0)} req/s (load average ${loadNow()})`);
      if (r === 0) peakBare[i] = await sides[i].server.peakMemory();
    }
  }
  for (let i = 0; i < sides.length; i++) {
    process.stdout.write(`\n${sides[i].label}:\n\n${table(results[i], results[i][0], peakBare[i], await sides[i].server.peakMemory())}\n\n`);
    await sides[i].verify(results[i]);
    const errors = results[i].reduce((n, x) => n + x.errors, 0);
    soft(errors === 0, `${sides[i].label}: zero errors (${JSON.stringify(results[i].map((x) => [x.name, x.statuses, x.detail]))})`);
  }
  const singleChecks = await crossChecks(sides[0].server, inbox, 'one', 1);
  await sides[0].server.stop();
  if (PROCESSES > 1) {
    const multiChecks = await crossChecks(sides[1].server, inbox, 'many', PROCESSES);
    soft(
      multiChecks.limitedAt === singleChecks.limitedAt,
      `rate limits: refused at the same attempt with ${PROCESSES} processes as with one (${multiChecks.limitedAt} and ${singleChecks.limitedAt})`,
    );
    await sides[1].server.stop();
    const [single, multi] = results;
    process.stdout.write(`\nthroughput with ${PROCESSES} processes against 1 (same run, routes interleaved):\n`);
    for (let i = 0; i < single.length; i++) {
      const [m, s] = [multi[i].cpu, single[i].cpu];
      process.stdout.write(
        `  ${multi[i].name}: ${multi[i].rps.toFixed(0)} vs ${single[i].rps.toFixed(0)} req/s (x${(multi[i].rps / single[i].rps).toFixed(2)}), p95 ${Math.round(multi[i].p95)} vs ${Math.round(single[i].p95)} ms; ` +
          `CPU ms/req server ${m.serverPerRequest.toFixed(2)} vs ${s.serverPerRequest.toFixed(2)}, PostgreSQL ${m.postgresPerRequest.toFixed(2)} vs ${s.postgresPerRequest.toFixed(2)}; ` +
          `machine busy ${m.cores.machine.toFixed(2)} vs ${s.cores.machine.toFixed(2)} cores\n`,
      );
    }
  }
  log(`machine: ${os.cpus().length} cores, ${(os.totalmem() / 2 ** 30).toFixed(1)} GB; load average at the start ${loadAtStart}, at the end ${loadNow()}`);
  if (failures.length > 0) throw new Error(`${failures.length} check(s) failed:\n${failures.join('\n')}`);
} catch (error) {
  console.error(error instanceof Error ? error.message : error);
  status = 1;
} finally {
  for (const c of children) c.kill('SIGKILL');
  db.cleanup();
  fs.rmSync(work, { recursive: true, force: true });
}
process.exit(status);
