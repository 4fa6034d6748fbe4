// Every write route of the API, read from the app's own router table, fuzzed with generated bad input:
// malformed ids in the path, a malformed X-Club-Id header, bodies of the wrong shape, and valid bodies
// with one field made hostile (wrong type, missing, huge, NUL, non-finite or out-of-range numbers,
// malformed UUIDs, impossible dates). Each must be a 4xx in the usual error shape, never a 5xx, and
// write nothing (row counts of every table before and after).
//
// Seeded: FUZZ_SEED=<n> repeats a run (fast-check prints the seed and the failing input).
import fc from 'fast-check';
import { sql } from 'drizzle-orm';
import type supertest from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Db } from '@/db/client';
import type { Role } from '@/db/schema';
import { can, rolesFor } from '@/features/access/permissions';
import type { RoundDetail } from '@/features/screening/contract';
import { makeAthlete, makeClub, makeSquad, makeTestApp, makeUser, signedInAgent, TEST_PASSWORD } from '../fixtures/builders';
import { fieldPaths, getAt, hostileValuesFor, MALFORMED_IDS, REMOVE, setAt, toJson } from '../fixtures/hostile';
import { createTestDb, type TestDb } from '../fixtures/test-db';
import { writeRoutes, type WriteRoute } from '../fixtures/write-routes';

const SEED = Number(process.env.FUZZ_SEED ?? 20261202);
const RUNS = Number(process.env.FUZZ_RUNS ?? 25);

let testDb: TestDb;
let app: ReturnType<typeof makeTestApp>['app'];
let admin: supertest.Agent;
/** One signed-in caller per role: each route is fuzzed as the admin when the admin holds its action, else as a role that does. */
const agents: Partial<Record<Role, supertest.Agent>> = {};
/**
 * The route table, read once at load from an app that never touches its database (building the app
 * runs no query), so each route gets its own test below.
 */
const routes: WriteRoute[] = writeRoutes(makeTestApp({} as Db).app);
/** A real id for each path segment a parameter follows (`/athletes/:id` → an athlete of the club). */
let ids: Record<string, string>;
let world: { clubId: string; squadId: string; athleteId: string; assessmentId: string; roundId: string; guardianId: string };

const ADMIN_EMAIL = 'admin@fuzz.test';

beforeAll(async () => {
  testDb = await createTestDb();
  // Sign-in limits out of the way: failed sign-ins are part of the fuzz and would otherwise end in 429.
  ({ app } = makeTestApp(testDb.db, {
    config: {
      authLimits: {
        signInPerAccount: { windowMs: 60_000, max: 1e6 },
        signInPerAddress: { windowMs: 60_000, max: 1e6 },
        resetPerEmail: { windowMs: 60_000, max: 1e6 },
        linksPerAddress: { windowMs: 60_000, max: 1e6 },
      },
    },
  }));
  const db = testDb.db;
  const club = await makeClub(db, 'Fuzz Club');
  const squad = await makeSquad(db, club.id, 'Under-15');
  const admin_ = await makeUser(db, { email: ADMIN_EMAIL, clubId: club.id, role: 'admin' });
  const guardian = await makeUser(db, { email: 'parent@fuzz.test', clubId: club.id, role: 'parent' });
  const athlete = await makeAthlete(db, { clubId: club.id, squadId: squad.id, guardianUserId: guardian.id });
  void admin_;
  admin = await signedInAgent(app, ADMIN_EMAIL);
  agents.admin = admin;
  agents.parent = await signedInAgent(app, 'parent@fuzz.test');
  for (const role of ['head_coach', 'tester', 'physio'] as const) {
    await makeUser(db, { email: `${role}@fuzz.test`, clubId: club.id, role });
    agents[role] = await signedInAgent(app, `${role}@fuzz.test`);
  }
  const round = (await admin.post('/api/rounds').send({ squadId: squad.id, name: 'Fuzz round', screenedOn: '2026-09-14' })).body as RoundDetail;
  const assessmentId = round.athletes[0]!.assessmentId;
  world = { clubId: club.id, squadId: squad.id, athleteId: athlete.id, assessmentId, roundId: round.round.id, guardianId: guardian.id };
  ids = {
    clubs: club.id,
    squads: squad.id,
    athletes: athlete.id,
    rounds: round.round.id,
    assessments: assessmentId,
    guardians: guardian.id,
  };
});

afterAll(async () => {
  await testDb?.drop();
});

/** Known valid bodies: a field made hostile in one of these must be named in the answer's `fields`. */
function validBody(route: WriteRoute): unknown | undefined {
  const key = `${route.method.toUpperCase()} ${route.path}`;
  const bodies: Record<string, unknown> = {
    'POST /api/auth/sign-in': { email: ADMIN_EMAIL, password: TEST_PASSWORD },
    'POST /api/auth/invitations/accept': { token: 'a'.repeat(40), displayName: 'New Person', password: 'long-enough-password' },
    'POST /api/auth/password-reset': { email: 'nobody@fuzz.test' },
    'POST /api/auth/password-reset/complete': { token: 'a'.repeat(40), password: 'long-enough-password' },
    'POST /api/clubs/:clubId/invitations': { email: 'new.person@fuzz.test', role: 'tester' },
    'POST /api/squads': { name: 'Under-17' },
    'PATCH /api/squads/:id': { name: 'Under-15 mixed' },
    'POST /api/athletes': {
      firstName: 'Noa',
      lastName: 'Lindqvist',
      dateOfBirth: '2014-03-09',
      sex: 'female',
      racketHand: 'right',
      takeOffLeg: 'left',
      squadId: world.squadId,
    },
    'PATCH /api/athletes/:id': { firstName: 'Noa', dateOfBirth: '2013-05-14', sex: 'male', racketHand: 'left', takeOffLeg: 'right', squadId: world.squadId },
    'POST /api/athletes/:id/consents': { kind: 'photos', granted: true, decidedOn: '2026-09-01' },
    'POST /api/athletes/:id/consents/own': { kind: 'photos', granted: false },
    'POST /api/athletes/:id/notes': { text: 'Worked on landing softly today.', visibility: 'team' },
    'PUT /api/athletes/:id/clearance': { status: 'modified', detail: 'No deep loaded squats for two weeks.' },
    'POST /api/athletes/:id/guardians': { email: 'second.parent@fuzz.test' },
    'POST /api/rounds': { squadId: world.squadId, name: 'Mid-season', screenedOn: '2026-09-14' },
    'POST /api/squads/:id/training-sessions': { heldOn: new Date().toISOString().slice(0, 10), athleteIds: [world.athleteId], note: 'Band work.' },
    'PUT /api/assessments/:id': {
      draftVersion: 0,
      draft: {
        body: { statureCm: 152, sittingHeightCm: 79, massKg: 41 },
        tasks: { 'two-leg-squat': { criteria: [], notes: 'fine' } },
        oneRepMaxKg: 30,
        step: 'two-leg-squat',
      },
    },
  };
  return bodies[key];
}

function pathFor(route: WriteRoute, override?: { param: string; value: string }): string {
  return route.path.replace(/:(\w+)/g, (_m, name: string, offset: number) => {
    if (override?.param === name) return encodeURIComponent(override.value);
    const before = route.path.slice(0, offset).split('/').filter(Boolean).pop() ?? '';
    return ids[before] ?? '0f8fad5b-d9cb-469f-a165-70867728950e';
  });
}

/**
 * Rows of every table but one: `rate_limits` counts sign-in attempts and link requests, so a refused sign-in
 * writes there by design (that is the rate limit working).
 */
async function rowCounts(): Promise<Record<string, number>> {
  const tables = await testDb.db.execute<{ name: string }>(
    sql`select table_name as name from information_schema.tables where table_schema = 'public' and table_type = 'BASE TABLE' and table_name <> 'rate_limits' order by 1`,
  );
  const counts: Record<string, number> = {};
  for (const { name } of tables.rows) {
    const r = await testDb.db.execute<{ n: number }>(sql`select count(*)::int as n from ${sql.identifier(name)}`);
    counts[name] = r.rows[0]!.n;
  }
  return counts;
}

/** The caller a route is fuzzed as: past its access check, so that its input handling is what answers. */
function roleFor(route: WriteRoute): Role {
  return !route.action || can('admin', route.action) ? 'admin' : rolesFor(route.action)[0]!;
}
const callerFor = (route: WriteRoute): supertest.Agent => agents[roleFor(route)]!;

function send(route: WriteRoute, path: string, body: unknown, headers: Record<string, string> = {}) {
  const req = callerFor(route)[route.method](path).set('Content-Type', 'application/json');
  for (const [k, v] of Object.entries(headers)) req.set(k, v);
  return req.send(body === undefined ? '' : toJson(body));
}

type Res = { status: number; body: { error?: { code?: unknown; message?: unknown; fields?: unknown } } };

/** The usual error shape, a 4xx, and for a 400 a map of fields with a message each. */
function expectClearRefusal(res: Res, what: string) {
  const info = `${what} → ${res.status} ${JSON.stringify(res.body).slice(0, 300)}`;
  expect(res.status, info).toBeGreaterThanOrEqual(400);
  expect(res.status, info).toBeLessThan(500);
  expect(typeof res.body.error?.code, info).toBe('string');
  expect(typeof res.body.error?.message, info).toBe('string');
  expect((res.body.error!.message as string).length, info).toBeGreaterThan(0);
  if (res.status === 400 && res.body.error?.code === 'invalid_input') {
    const fields = res.body.error.fields as Record<string, unknown>;
    expect(fields && typeof fields === 'object', info).toBe(true);
    expect(Object.keys(fields).length, info).toBeGreaterThan(0);
    for (const m of Object.values(fields)) expect(typeof m === 'string' && m.length > 0, info).toBe(true);
  }
}

const label = (r: WriteRoute) => `${r.method.toUpperCase()} ${r.path}`;

describe('the route table', () => {
  it('finds the write routes, their body schemas and the upload routes', () => {
    const names = routes.map(label);
    expect(names).toEqual(expect.arrayContaining(['POST /api/rounds', 'PUT /api/assessments/:id', 'POST /api/assessments/:id/photos', 'POST /api/athletes']));
    expect(routes.find((r) => label(r) === 'PUT /api/assessments/:id')!.bodySchema).not.toBeNull();
    expect(routes.find((r) => label(r) === 'POST /api/assessments/:id/photos')!.multipart).toBe(true);
  });

  it('sends each guarded route as a role holding its action, so that its input handling answers, not a 403', () => {
    for (const r of routes) if (r.action) expect(can(roleFor(r), r.action), label(r)).toBe(true);
    // Routes the admin does not hold are fuzzed too: a parent's own consent, a physiotherapist's clearance.
    expect(roleFor(routes.find((r) => label(r) === 'POST /api/athletes/:id/consents/own')!)).toBe('parent');
    expect(routes.filter((r) => roleFor(r) === 'physio').length).toBeGreaterThan(0);
  });
});

// Sign-out takes no id, no club header and no body: none of the cases below applies to it.
const fuzzed = routes.filter((r) => r.params.length > 0 || r.bodySchema !== null || label(r) !== 'POST /api/auth/sign-out');

describe.each(fuzzed.map((r) => [label(r), r] as const))('%s under bad input', (_name, route) => {
  // Each test checks that nothing at all was written: row counts of every table before and after.
  let before: Record<string, number>;
  beforeAll(async () => {
    before = await rowCounts();
  });
  afterAll(async () => {
    expect(await rowCounts()).toEqual(before);
  });

  if (route.params.length > 0)
    it('answers malformed ids in the path with a clear 4xx', async () => {
      await fc.assert(
        fc.asyncProperty(
          fc.constantFrom(...route.params),
          fc.oneof(
            fc.constantFrom(...MALFORMED_IDS),
            fc.string({ unit: 'binary', maxLength: 60 }).filter((s) => s.length > 0),
          ),
          async (param, value) => {
            const res = await send(route, pathFor(route, { param, value }), validBody(route) ?? {});
            // An id that is not a UUID names nothing: 404 (or 400 where the path cannot even be routed).
            expectClearRefusal(res, `${label(route)} with :${param}=${JSON.stringify(value)}`);
          },
        ),
        { seed: SEED, numRuns: RUNS },
      );
    });

  // sign-out takes no input at all; it only ends the session.
  if (label(route) !== 'POST /api/auth/sign-out')
    it('answers a malformed X-Club-Id header with a clear 4xx', async () => {
      // Printable header values only: Node refuses to even send control characters.
      const headerValue = fc.oneof(
        fc.constantFrom(...MALFORMED_IDS.filter((v) => /^[\x20-\x7e]+$/.test(v))),
        fc.string({ unit: fc.constantFrom(..."abcdef0123456789-{}' ;%.".split('')), minLength: 1, maxLength: 80 }),
      );
      // With a body the route refuses or an id it cannot find, so no valid request slips through.
      const path = route.params.length > 0 && !route.bodySchema ? pathFor(route, { param: route.params[0]!, value: 'not-a-uuid' }) : pathFor(route);
      await fc.assert(
        fc.asyncProperty(headerValue, async (value) => {
          const res = await send(route, path, route.bodySchema ? { unexpected: true } : {}, { 'X-Club-Id': value });
          expectClearRefusal(res, `${label(route)} with X-Club-Id ${JSON.stringify(value)}`);
        }),
        { seed: SEED, numRuns: Math.ceil(RUNS / 2) },
      );
    });

  if (route.bodySchema !== null)
    it('answers bodies of the wrong shape with a clear 4xx', async () => {
      const wrongShape = fc.oneof(
        fc.array(fc.jsonValue(), { maxLength: 5 }),
        fc.dictionary(fc.string({ maxLength: 12 }), fc.jsonValue(), { maxKeys: 6 }),
        fc.constant({}),
      );
      await fc.assert(
        fc.asyncProperty(wrongShape, async (body) => {
          const res = await send(route, pathFor(route), body);
          expectClearRefusal(res, `${label(route)} with body ${JSON.stringify(body).slice(0, 200)}`);
        }),
        { seed: SEED, numRuns: RUNS },
      );
    });

  if (route.bodySchema !== null)
    it('answers a valid body with one hostile field with 400 naming that field', async () => {
      const base = validBody(route);
      const fields = fieldPaths(route.bodySchema!.describe() as never);
      const cases = fields.flatMap((f) => [
        ...hostileValuesFor(f.desc, getAt(base, f.path)).map((value) => ({ path: f.path, value })),
        ...(f.required ? [{ path: f.path, value: REMOVE as unknown }] : []),
      ]);
      expect(cases.length).toBeGreaterThan(0);
      await fc.assert(
        // Cases are drawn by index so a failure report stays readable (some values are 200,000 characters).
        fc.asyncProperty(fc.nat({ max: cases.length - 1 }), async (i) => {
          const { path, value } = cases[i]!;
          const body = setAt(base ?? {}, path, value);
          const res = await send(route, pathFor(route), body);
          const what = `${label(route)} with ${path.join('.')} = ${value === REMOVE ? '(missing)' : JSON.stringify(value)?.slice(0, 80)}`;
          expectClearRefusal(res, what);
          // With a known valid body, the refusal must point at the field that was made hostile (the sign-in
          // and link routes may answer 401/404 for a well-formed but wrong value instead).
          if (base !== undefined && !(route.path.includes('/auth/') && res.status !== 400)) {
            expect(res.status, what).toBe(400);
            const keys = Object.keys((res.body.error?.fields ?? {}) as object);
            const dotted = path.join('.');
            expect(
              keys.some(
                (k) =>
                  k === dotted || k.startsWith(`${dotted}.`) || k.startsWith(`${dotted}[`) || dotted.startsWith(`${k}.`) || (path.length === 1 && k === '_'),
              ),
              `${what}: fields ${keys.join(', ')}`,
            ).toBe(true);
          }
        }),
        // Every hostile case of a small schema (about twice over), a sample of a large one.
        { seed: SEED, numRuns: Math.min(cases.length * 2, RUNS * 4) },
      );
    });
});

describe('after the fuzzing', () => {
  it('still answers with the session it started with (nothing above signed the fuzzer out)', async () => {
    const res = await admin.get('/api/me');
    expect(res.status).toBe(200);
  });
});

describe('the known 500s, now 4xx', () => {
  it('a draft version beyond the database integer range', async () => {
    const res = await admin.put(`/api/assessments/${world.assessmentId}`).send({ draftVersion: 2 ** 31, draft: { body: {}, tasks: {} } });
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toHaveProperty('draftVersion');
  });

  it('a non-finite landmark coordinate (1e999 parses to Infinity)', async () => {
    const body = `{"draftVersion":0,"draft":{"body":{},"tasks":{"two-leg-squat":{"criteria":[],"landmarks":{"front":{"left-knee":{"x":1e999,"y":10}}}}}}}`;
    const res = await admin.put(`/api/assessments/${world.assessmentId}`).set('Content-Type', 'application/json').send(body);
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields).join(' ')).toMatch(/draft\.tasks\.two-leg-squat\.landmarks/);
  });

  it('a malformed multipart body on the photo upload', async () => {
    const res = await admin
      .post(`/api/assessments/${world.assessmentId}/photos`)
      .set('Content-Type', 'multipart/form-data; boundary=XYZ')
      .send('--XYZ\r\nContent-Disposition: form-data; name="photo"; filename="a.jpg"\r\n\r\nnot finished');
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('invalid_input');
  });

  it('a multipart body without a boundary', async () => {
    const res = await admin.post(`/api/assessments/${world.assessmentId}/photos`).set('Content-Type', 'multipart/form-data').send('whatever');
    expect(res.status).toBe(400);
  });

  it('a NUL character in a name', async () => {
    const res = await admin.post('/api/squads').send({ name: 'Under\u000015' });
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toHaveProperty('name');
  });

  it('the draft still holds what was saved before all this', async () => {
    const res = await admin.get(`/api/assessments/${world.assessmentId}`);
    expect(res.status).toBe(200);
    expect(res.body.draftVersion).toBe(0);
  });
});
