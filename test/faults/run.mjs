// `npm run test:faults`: faults against real server processes and a real PostgreSQL.
//  1. PostgreSQL stopped during a load of draft saves and submits: fast 503s with a clear message,
//     /api/health says so, service resumes by itself (same process), no lost or half-written screen.
//  2. The SMTP server stopped: the e-mail waits in the queue and goes out once when it returns.
//  3. SIGTERM during uploads and draft saves: no new connections, in-flight requests finish within a
//     few seconds, no orphan photo files, no lost acknowledged write.
// Exits non-zero on the first failed check. Runs in about a minute.
import { spawn } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import readline from 'node:readline';
import sharp from 'sharp';
import { check, client, draftBody, freePort, log, openRounds, screeningConsistency, sleep, startDatabase, startServer, storedFiles } from './harness.mjs';

const ROOT = path.resolve(path.dirname(new URL(import.meta.url).pathname), '../..');
const work = fs.mkdtempSync(path.join(os.tmpdir(), 'squadline-faults-'));
const db = await startDatabase('squadline-faults-', 'squadline_faults');
const children = new Set();
let status = 0;

/** The fake SMTP in its own process, on a fixed port so it can come back where the server expects it. */
function startSmtp(port, inbox) {
  const proc = spawn(path.join(ROOT, 'node_modules', '.bin', 'tsx'), ['test/faults/smtp.ts', String(port)], {
    cwd: ROOT,
    stdio: ['ignore', 'pipe', 'inherit'],
  });
  children.add(proc);
  return new Promise((resolve, reject) => {
    readline.createInterface({ input: proc.stdout }).on('line', (line) => {
      const msg = JSON.parse(line);
      if (msg.listening) resolve(proc);
      if (msg.message) inbox.push(msg.message);
    });
    proc.on('exit', (code) => {
      children.delete(proc);
      if (code !== 0) reject(new Error(`fake SMTP exited with ${code}`));
    });
  });
}

/** /api/health as a load balancer calls it: no session. */
async function health_(base) {
  try {
    const res = await fetch(`${base}/api/health`, { signal: AbortSignal.timeout(5000) });
    return { status: res.status, body: await res.json() };
  } catch (error) {
    return { status: 0, body: null, error: String(error) };
  }
}

async function stopProcess(proc) {
  if (proc.exitCode !== null) return;
  const exited = new Promise((r) => proc.on('exit', r));
  proc.kill('SIGTERM');
  await exited;
}

try {
  const smtpPort = await freePort();
  const inbox = [];
  let smtp = await startSmtp(smtpPort, inbox);
  const uploads = path.join(work, 'uploads');
  const env = {
    DATABASE_URL: db.url,
    LOCAL_UPLOADS_DIR: uploads,
    SMTP_URL: `smtp://127.0.0.1:${smtpPort}`,
    MAIL_RETRY_DELAY_SECONDS: '1',
  };
  const server = await startServer(env);
  children.add(server.proc);

  // ------------------------------------------------------------------------------------------------
  log('1. PostgreSQL stopped during a load of draft saves and submits');
  const tester = await client(server.base, 'tester@squadline.test');
  const ids = await openRounds(tester, 'Fault run', 8);
  const workers = ids.map((id) => ({ id, version: 0, ok: 0, resyncs: 0, submits: 0, outage: [], other: [] }));
  let phase = 'before';
  let running = true;
  const work1 = workers.map(async (w, i) => {
    while (running) {
      const res = await tester.call('PUT', `/api/assessments/${w.id}`, { json: draftBody(w.version, `save ${w.ok}`), timeoutMs: 15_000 });
      if (res.status === 200) {
        w.version = res.body.draftVersion;
        w.ok += 1;
        // Half the workers submit every second save: a transaction the outage may cut in two.
        if (i % 2 === 0 && w.ok % 2 === 0) {
          const s = await tester.call('POST', `/api/assessments/${w.id}/submit`, { timeoutMs: 15_000 });
          if (s.status === 200) w.submits += 1;
          else if (s.status === 503) w.outage.push(s);
          else w.other.push({ phase, status: s.status, body: s.body });
        }
      } else if (res.status === 409 && res.body?.current) {
        // A save that committed but whose answer was lost with the connection: the client merges.
        w.version = res.body.current.draftVersion;
        w.resyncs += 1;
      } else if (res.status === 503) {
        w.outage.push(res);
        await sleep(100);
      } else {
        w.other.push({ phase, status: res.status, error: res.error, body: res.body });
        await sleep(100);
      }
    }
  });
  await sleep(2500);
  const okBefore = workers.reduce((n, w) => n + w.ok, 0);
  check(okBefore > 0, `draft saves succeed before the outage (${okBefore})`);
  phase = 'outage';
  log('   stopping PostgreSQL...');
  db.stop();
  await sleep(3000);
  const health = await health_(server.base);
  check(health.status === 503 && health.body?.db === 'down', `/api/health reports the database down (${health.status} ${JSON.stringify(health.body)})`);
  const during = await tester.call('GET', `/api/assessments/${ids[0]}`);
  check(during.status === 503, `a read during the outage answers 503 (${during.status})`);
  check(/cannot reach its database/.test(during.body?.error?.message ?? ''), `with a clear message: "${during.body?.error?.message}"`);
  check(during.ms < 2000, `and fast (${during.ms} ms)`);
  const outage = workers.flatMap((w) => w.outage);
  check(outage.length > 0, `writes during the outage were refused with 503 (${outage.length})`);
  const times = outage.map((r) => r.ms).sort((a, b) => a - b);
  const median = times[Math.floor(times.length / 2)];
  const slowest = times[times.length - 1];
  // Bounded by the pool's 5 s connection timeout; the margin is for a loaded 2-core machine.
  check(median < 2000 && slowest < 10_000, `refusals are fast: median ${median} ms, slowest ${slowest} ms`);
  log('   starting PostgreSQL again...');
  db.start();
  phase = 'after';
  const back = Date.now();
  for (;;) {
    const h = await health_(server.base);
    if (h.status === 200) break;
    if (Date.now() - back > 20_000) throw new Error('FAILED: service did not resume within 20 s of the database returning');
    await sleep(200);
  }
  log(`   service resumed ${Date.now() - back} ms after the database started`);
  const okAtReturn = workers.reduce((n, w) => n + w.ok, 0);
  await sleep(2500);
  running = false;
  await Promise.all(work1);
  const okAfter = workers.reduce((n, w) => n + w.ok, 0) - okAtReturn;
  check(okAfter > 0, `draft saves succeed again without a restart (${okAfter} after the return)`);
  check(server.proc.exitCode === null, `the same server process kept running (pid ${server.proc.pid})`);
  const unexpected = workers.flatMap((w) => w.other);
  check(unexpected.length === 0, `no answer other than 200, 409-with-current or 503 (${JSON.stringify(unexpected.slice(0, 3))})`);
  for (const w of workers) {
    const [row] = await db.query('select draft_version as v from assessments where id = $1', [w.id]);
    // Every acknowledged save is in the database; at most the saves whose answer was lost (each seen
    // again as a 409 and merged) were applied without the client hearing of it.
    if (!(row.v === w.version && row.v >= w.ok && row.v <= w.ok + w.resyncs)) {
      throw new Error(`FAILED: assessment ${w.id}: database version ${row.v}, client ${w.version}, ${w.ok} saves acknowledged, ${w.resyncs} resyncs`);
    }
  }
  log(`ok: no acknowledged save lost (${workers.reduce((n, w) => n + w.ok, 0)} saves, ${workers.reduce((n, w) => n + w.resyncs, 0)} answers lost and merged)`);
  const submits = workers.reduce((n, w) => n + w.submits, 0);
  const consistency = await screeningConsistency(db);
  check(
    Object.values(consistency).every((n) => n === 0),
    `no half-written screen after ${submits} submits: ${JSON.stringify(consistency)}`,
  );

  // ------------------------------------------------------------------------------------------------
  log('2. The SMTP server stopped: the e-mail waits in the queue and goes out once');
  await stopProcess(smtp);
  const before = inbox.length;
  const reset = await fetch(`${server.base}/api/auth/password-reset`, {
    method: 'POST',
    headers: { 'Content-Type': 'application/json' },
    body: JSON.stringify({ email: 'parent@squadline.test' }),
  });
  check(reset.status === 200 || reset.status === 202, `the reset request is accepted while SMTP is down (${reset.status})`);
  await sleep(4000);
  const [queued] = await db.query(`select count(*)::int as n from pgboss.job where name = 'mail' and state in ('created', 'retry', 'active')`);
  check(queued.n >= 1, `the e-mail waits in the queue (${queued.n} job(s) waiting, after failed attempts)`);
  smtp = await startSmtp(smtpPort, inbox);
  const waitStart = Date.now();
  while (!inbox.slice(before).some((m) => m.to.includes('parent@squadline.test')) && Date.now() - waitStart < 60_000) await sleep(200);
  const delivered = Date.now() - waitStart;
  await sleep(4000); // long enough for a duplicate to show up if the queue sent twice
  const resets = inbox.slice(before).filter((m) => m.to.includes('parent@squadline.test') && /Reset your Squadline password/.test(m.subject));
  check(resets.length === 1, `it went out exactly once when SMTP returned (${resets.length} received, ${delivered} ms after)`);

  // ------------------------------------------------------------------------------------------------
  log('3. SIGTERM during uploads and draft saves');
  const photo = await sharp({ create: { width: 2000, height: 2600, channels: 3, background: '#6a8fb5' } })
    .composite([{ input: Buffer.from('<svg width="2000" height="2600"><circle cx="1000" cy="900" r="400" fill="#223"/></svg>') }])
    .jpeg({ quality: 92 })
    .toBuffer();
  const ids3 = await openRounds(tester, 'Shutdown run', 6);
  const saved = ids3.map((id) => ({ id, version: 0, ok: 0, resyncs: 0 }));
  const uploaded = [];
  const failures = [];
  let sending = true;
  const loops = [
    ...saved.slice(0, 3).map(async (w) => {
      while (sending) {
        const res = await tester.call('PUT', `/api/assessments/${w.id}`, { json: draftBody(w.version) });
        if (res.status === 200) {
          w.version = res.body.draftVersion;
          w.ok += 1;
        } else {
          failures.push(res.status === 0 ? res.error : res.status);
          if (res.status === 0) break;
        }
      }
    }),
    ...saved.slice(3).map(async (w) => {
      while (sending) {
        const form = new FormData();
        form.append('task', 'two-leg-squat');
        form.append('view', 'front');
        form.append('photo', new Blob([photo], { type: 'image/jpeg' }), 'squat.jpg');
        const res = await tester.call('POST', `/api/assessments/${w.id}/photos`, { form });
        if (res.status === 201) uploaded.push(res.body.id);
        else {
          failures.push(res.status === 0 ? res.error : res.status);
          if (res.status === 0) break;
        }
      }
    }),
  ];
  const runningSince = Date.now();
  while (!(uploaded.length > 0 && saved.some((w) => w.ok > 0)) && Date.now() - runningSince < 20_000) await sleep(100);
  await sleep(300); // the next uploads are now in flight
  check(
    uploaded.length > 0 && saved.some((w) => w.ok > 0),
    `uploads (${uploaded.length}) and saves (${saved.reduce((n, w) => n + w.ok, 0)}) are running (failures so far: ${JSON.stringify(failures.slice(0, 3))})`,
  );
  const sigtermAt = Date.now();
  server.proc.kill('SIGTERM');
  // A busy machine may take a moment to deliver the signal: within two seconds, a new request must be
  // refused (the listener is closed) or answered 503 "shutting down" (it came in on a connection that
  // was already open, which the server then closes). Either way nothing new is served.
  let refusal = '';
  while (!refusal && Date.now() - sigtermAt < 2000) {
    try {
      const res = await fetch(`${server.base}/api/health`, { signal: AbortSignal.timeout(1000), headers: { connection: 'close' } });
      const body = await res.json().catch(() => ({}));
      if (res.status === 503 && body.shuttingDown) refusal = '503 shutting down';
      else await sleep(50);
    } catch {
      refusal = 'connection refused';
    }
  }
  check(Boolean(refusal), `a new request is not served once SIGTERM arrived (${refusal || 'still served after 2 s'})`);
  const exit = await server.exited;
  sending = false;
  await Promise.all(loops);
  children.delete(server.proc);
  check(exit.code === 0, `the server exited cleanly (code ${exit.code}, signal ${exit.signal})`);
  check(exit.at - sigtermAt < 8000, `within a few seconds of SIGTERM (${exit.at - sigtermAt} ms)`);
  log(`   in flight at the end: ${failures.length} request(s) answered with ${JSON.stringify([...new Set(failures)])}`);
  const rows = await db.query('select id, storage_key as "storageKey", thumb_key as "thumbKey" from photos where assessment_id = any($1)', [ids3]);
  // The local store keeps a hidden `.<name>.meta.json` beside each file: it belongs to that file.
  const files = new Set(storedFiles(uploads).map((f) => f.replace(/(^|\/)\.([^/]+)\.meta\.json$/, '$1$2')));
  const rowFiles = new Set(rows.flatMap((r) => [r.storageKey, r.thumbKey]));
  check(
    rows.every((r) => files.has(r.storageKey) && files.has(r.thumbKey)),
    `every stored photo row has both its files (${rows.length} photos)`,
  );
  const orphans = [...files].filter((f) => ids3.some((id) => f.includes(id)) && !rowFiles.has(f));
  check(orphans.length === 0, `no orphan files (${orphans.slice(0, 3).join(', ')})`);
  check(
    uploaded.every((id) => rows.some((r) => r.id === id)),
    `every acknowledged upload is stored (${uploaded.length})`,
  );
  for (const w of saved.slice(0, 3)) {
    const [row] = await db.query('select draft_version as v from assessments where id = $1', [w.id]);
    if (!(row.v >= w.ok && row.v <= w.ok + 1)) throw new Error(`FAILED: draft ${w.id}: database ${row.v}, ${w.ok} saves acknowledged`);
  }
  log('ok: every acknowledged draft save is stored');
  await stopProcess(smtp);
  log('All fault checks held.');
} catch (error) {
  console.error(error instanceof Error ? error.message : error);
  status = 1;
} finally {
  for (const c of children) c.kill('SIGKILL');
  db.cleanup();
  fs.rmSync(work, { recursive: true, force: true });
}
process.exit(status);
