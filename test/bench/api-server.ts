// The server side of `npm run bench:api`: migrates an empty database, seeds one club of 2,000 athletes
// in 50 squads of 40 with 8 rounds each (16,000 submitted screens evaluated by the real engine) and a
// year of corrective sessions twice a week with who took part (about 170,000 rows), then
// serves the real app plus a bare `SELECT 1` route mounted here only, never in production.
// Prints one line `READY {json}` with what the load generator needs.
import express from 'express';
import fs from 'node:fs';
import { Session } from 'node:inspector/promises';
import os from 'node:os';
import path from 'node:path';
import pino from 'pino';
import { sql } from 'drizzle-orm';
import { connect, runMigrations } from '@/db/client';
import { assessmentResults, assessments, athletes, clubs, memberships, rounds, squads, users } from '@/db/schema';
import { evaluateAssessment } from '@/features/screening/engine';
import { mulberry32, randomAssessment } from '@/features/screening/engine/random-assessment';
import { createApp } from '@/server/app';
import { hashPassword } from '@/server/auth/password';
import { createLocalStorage } from '@/server/storage/local-storage';

const ATHLETES = 2000;
const SQUAD_SIZE = 40;
const ROUNDS = 8;
const PASSWORD = 'bench-password-123';

async function insertInChunks<T>(rows: T[], size: number, insert: (chunk: T[]) => Promise<unknown>) {
  for (let i = 0; i < rows.length; i += size) await insert(rows.slice(i, i + size));
}

async function seed(db: ReturnType<typeof connect>['db']) {
  const rand = mulberry32(20261202);
  const [club] = await db.insert(clubs).values({ name: 'Benchmark Racket Club' }).returning();
  const clubId = club!.id;
  const [coach] = await db
    .insert(users)
    .values({ email: 'coach@bench.test', displayName: 'Bench Coach', passwordHash: await hashPassword(PASSWORD) })
    .returning();
  await db.insert(memberships).values({ userId: coach!.id, clubId, role: 'head_coach' });

  const squadRows = await db
    .insert(squads)
    .values(Array.from({ length: ATHLETES / SQUAD_SIZE }, (_, i) => ({ clubId, name: `Squad ${i + 1}` })))
    .returning({ id: squads.id });
  const athleteValues = Array.from({ length: ATHLETES }, (_, i) => ({
    clubId,
    squadId: squadRows[Math.floor(i / SQUAD_SIZE)]!.id,
    firstName: `Athlete${i}`,
    lastName: `Bench${String(i).padStart(4, '0')}`,
    dateOfBirth: `${2011 + (i % 5)}-0${1 + (i % 9)}-1${i % 10}`,
    sex: (i % 2 ? 'male' : 'female') as 'male' | 'female',
    racketHand: 'right' as const,
    takeOffLeg: 'left' as const,
  }));
  const athleteRows: { id: string; squadId: string | null }[] = [];
  await insertInChunks(athleteValues, 1000, async (chunk) => {
    athleteRows.push(...(await db.insert(athletes).values(chunk).returning({ id: athletes.id, squadId: athletes.squadId })));
  });

  const roundRows = await db
    .insert(rounds)
    .values(
      squadRows.flatMap((s) =>
        Array.from({ length: ROUNDS }, (_, r) => ({
          clubId,
          squadId: s.id,
          name: `Round ${r + 1}`,
          screenedOn: new Date(Date.UTC(2025, 0, 6) + r * 6 * 7 * 86_400_000).toISOString().slice(0, 10),
        })),
      ),
    )
    .returning({ id: rounds.id, squadId: rounds.squadId, screenedOn: rounds.screenedOn });

  let done = 0;
  for (const squad of squadRows) {
    const squadRounds = roundRows.filter((r) => r.squadId === squad.id);
    const members = athleteRows.filter((a) => a.squadId === squad.id);
    const aValues = squadRounds.flatMap((r) =>
      members.map((a) => ({ clubId, roundId: r.id, athleteId: a.id, status: 'submitted' as const, submittedAt: new Date(`${r.screenedOn}T17:00:00Z`) })),
    );
    const created = await db
      .insert(assessments)
      .values(aValues)
      .returning({ id: assessments.id, athleteId: assessments.athleteId, roundId: assessments.roundId });
    const results = created.map((a) => {
      const on = squadRounds.find((r) => r.id === a.roundId)!.screenedOn;
      const input = randomAssessment(rand);
      input.options = { ...input.options, today: on, rescreenWeeks: 6 };
      const result = evaluateAssessment(input);
      return { clubId, assessmentId: a.id, athleteId: a.athleteId, version: 1, isCurrent: true, engineVersion: result.engineVersion, input, result };
    });
    await insertInChunks(results, 80, (chunk) => db.insert(assessmentResults).values(chunk));
    done += created.length;
    if (done % 4000 === 0) process.stderr.write(`[bench] seeded ${done} screens\n`);
  }
  // Corrective sessions twice a week (Tuesday, Thursday) through the year of rounds and after the last
  // one, each athlete taking part in about 85 % (our invention): what the trends table and the history
  // count since and between screens.
  await db.execute(sql`
    insert into training_sessions (club_id, squad_id, held_on)
    select ${clubId}, s.id, d::date from squads s
    cross join generate_series('2025-01-07'::date, '2025-12-18'::date, interval '1 day') d
    where s.club_id = ${clubId} and extract(isodow from d) in (2, 4)`);
  await db.execute(sql`
    insert into training_attendance (session_id, athlete_id, club_id)
    select ts.id, a.id, ${clubId} from training_sessions ts
    join athletes a on a.squad_id = ts.squad_id
    where ts.club_id = ${clubId} and abs(hashtext(ts.id::text || a.id::text)) % 100 < 85`);
  return { squadId: squadRows[0]!.id, athleteId: members0(athleteRows, squadRows[0]!.id) };
}

/** The ids `seed` returned, when an earlier run seeded this database. */
async function seededIds(db: ReturnType<typeof connect>['db']) {
  const first = await db.execute<{ squadId: string; athleteId: string }>(sql`
    select s.id as "squadId", (select a.id from athletes a where a.squad_id = s.id order by a.created_at, a.last_name limit 1) as "athleteId"
    from squads s join clubs c on c.id = s.club_id
    where c.name = 'Benchmark Racket Club' and s.name = 'Squad 1'`);
  const row = first.rows[0];
  return row?.athleteId ? row : null;
}

function members0(rows: { id: string; squadId: string | null }[], squadId: string) {
  return rows.find((a) => a.squadId === squadId)!.id;
}

async function main() {
  const url = process.env.DATABASE_URL;
  if (!url) throw new Error('DATABASE_URL is not set.');
  const handle = connect(url, Number(process.env.POOL_SIZE ?? 10));
  await runMigrations(handle.db);
  const t0 = performance.now();
  // A kept database (`bench:api -- --keep DIR`) is seeded once; later runs find the same ids again.
  const ids = (await seededIds(handle.db)) ?? (await seed(handle.db));
  // Steady state, as autovacuum leaves a live database: statistics and the visibility map (index-only scans).
  await handle.pool.query('vacuum analyze');
  process.stderr.write(`[bench] ready in ${((performance.now() - t0) / 1000).toFixed(1)} s\n`);

  const app = createApp({
    db: handle.db,
    storage: createLocalStorage(fs.mkdtempSync(path.join(os.tmpdir(), 'squadline-bench-'))),
    outbox: { enqueue: async () => {}, stop: async () => {} },
    mailbox: null,
    logger: pino({ level: 'silent' }),
    config: { publicUrl: 'http://127.0.0.1', secureCookies: false },
  });
  // The baseline: the same process, the same pool, the same JSON reply, no session, no guard.
  const outer = express();
  // Answers sent, counted here so the load generator can divide CPU time by the requests the server
  // actually finished in a window (a slow route is still answering the warm-up's requests when a run starts).
  let finished = 0;
  outer.use((_req, res, next) => {
    res.on('finish', () => (finished += 1));
    next();
  });
  outer.get('/bench/finished', (_req, res) => {
    res.json({ finished });
  });
  // `bench:api -- --cpu-prof DIR`: a V8 CPU profile of each measured run (profiling costs CPU itself,
  // so figures of a profiled run are not comparable with plain ones).
  const profileDir = process.env.BENCH_CPU_PROF_DIR;
  if (profileDir) {
    const inspector = new Session();
    inspector.connect();
    await inspector.post('Profiler.enable');
    outer.post('/bench/profile/start', async (_req, res) => {
      await inspector.post('Profiler.start');
      res.json({ profiling: true });
    });
    outer.post('/bench/profile/stop', async (req, res) => {
      const { profile } = await inspector.post('Profiler.stop');
      fs.mkdirSync(profileDir, { recursive: true });
      const file = path.join(profileDir, `${String(req.query.name ?? 'run').replace(/[^\w-]/g, '_')}.cpuprofile`);
      fs.writeFileSync(file, JSON.stringify(profile));
      res.json({ file });
    });
  }
  outer.get('/bench/select-1', async (_req, res) => {
    const r = await handle.pool.query('select 1 as one');
    res.json({ one: r.rows[0].one });
  });
  outer.use(app);
  const server = outer.listen(0, '127.0.0.1', async () => {
    const port = (server.address() as { port: number }).port;
    const res = await fetch(`http://127.0.0.1:${port}/api/auth/sign-in`, {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: JSON.stringify({ email: 'coach@bench.test', password: PASSWORD }),
    });
    const cookie = (res.headers.get('set-cookie') ?? '').split(';')[0];
    process.stdout.write(`READY ${JSON.stringify({ port, cookie, ...ids })}\n`);
  });
  process.on('SIGTERM', () => {
    server.close();
    void handle.close().then(() => process.exit(0));
  });
}

main().catch((error: unknown) => {
  process.stderr.write(`${error instanceof Error ? error.stack : String(error)}\n`);
  process.exit(1);
});
