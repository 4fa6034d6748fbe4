import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { athletes } from '@/db/schema';
import { isLoadedStrength } from '@/features/care/strength-block';
import type { PlannedExercise } from '@/features/screening/engine';
import type { TrainingSheet } from '@/features/training/sheet';
import { makeAthlete, makeClub, makeSquad, makeTestApp, makeUser, signedInAgent } from '../fixtures/builders';
import { makeSubmittedScreen, painDraft } from '../fixtures/care';
import { createTestDb, type TestDb } from '../fixtures/test-db';

// A squad's training sheet (GET /api/squads/:id/training-sheet): each current member's plan in force on
// their newest screen, grouped by exercise. What each athlete's line must say is read back from the
// stored results and adjustments through the result API, so the test checks the sheet against the
// same records the result screen shows, not against numbers written here.

/** A day counted from today (YYYY-MM-DD): recording refuses days over a season old, so nothing here is a fixed date. */
const day = (offset: number) => new Date(Date.now() + offset * 24 * 3600 * 1000).toISOString().slice(0, 10);
const EARLIER = day(-90);
const LATER = day(-20);

let testDb: TestDb;
let app: ReturnType<typeof makeTestApp>['app'];
const ids: Record<string, string> = {};
type Agent = Awaited<ReturnType<typeof signedInAgent>>;
const as: Record<'coach' | 'tester' | 'physio' | 'parent', Agent> = {} as never;

beforeAll(async () => {
  testDb = await createTestDb();
  ({ app } = makeTestApp(testDb.db));
  const db = testDb.db;
  const club = await makeClub(db, 'Millrace');
  ids.club = club.id;
  ids.squad = (await makeSquad(db, club.id, 'Under-14')).id;
  ids.other = (await makeSquad(db, club.id, 'Under-16')).id;
  await makeUser(db, { email: 'coach@millrace.test', clubId: club.id, role: 'head_coach', displayName: 'Cole Coach' });
  ids.tester = (await makeUser(db, { email: 'tester@millrace.test', clubId: club.id, role: 'tester', displayName: 'Tess Tester' })).id;
  await makeUser(db, { email: 'physio@millrace.test', clubId: club.id, role: 'physio', displayName: 'Phil Physio' });
  const parent = await makeUser(db, { email: 'parent@millrace.test', clubId: club.id, role: 'parent', displayName: 'Ana Parent' });
  const athlete = async (key: string, firstName: string, lastName: string, squadId = ids.squad!) =>
    (ids[key] = (await makeAthlete(db, { clubId: club.id, squadId, firstName, lastName, guardianUserId: parent.id })).id);
  await athlete('ana', 'Ana', 'Ames');
  await athlete('ben', 'Ben', 'Berg');
  await athlete('cat', 'Cat', 'Cole');
  await athlete('dee', 'Dee', 'Dunn');
  await athlete('eli', 'Eli', 'Eade');
  await athlete('fin', 'Fin', 'Ford', ids.other);
  await db.update(athletes).set({ archivedAt: new Date() }).where(eq(athletes.id, ids.eli!));
  as.coach = await signedInAgent(app, 'coach@millrace.test');
  as.tester = await signedInAgent(app, 'tester@millrace.test');
  as.physio = await signedInAgent(app, 'physio@millrace.test');
  as.parent = await signedInAgent(app, 'parent@millrace.test');

  const screen = (athleteId: string, screenedOn: string, draft?: ReturnType<typeof painDraft>) =>
    makeSubmittedScreen(db, { clubId: ids.club!, squadId: ids.squad!, athleteId, userId: ids.tester!, screenedOn, draft });
  // Ana: an older screen, then a newer one whose plan the tester cut to its first exercise, re-dosed.
  await screen(ids.ana!, EARLIER);
  ids.anaScreen = (await screen(ids.ana!, LATER)).assessmentId;
  // Ben: pain reported at his screen, no clearance yet.
  ids.benScreen = (await screen(ids.ben!, LATER, painDraft())).assessmentId;
  // Dee: a screen, then referred on by the physiotherapist.
  ids.deeScreen = (await screen(ids.dee!, LATER)).assessmentId;
  // Fin is in the other squad: not on this sheet.
  await makeSubmittedScreen(db, { clubId: ids.club!, squadId: ids.other!, athleteId: ids.fin!, userId: ids.tester!, screenedOn: LATER });
});

afterAll(async () => {
  await testDb.drop();
});

async function sheet(agent: Agent, squadId = ids.squad!) {
  const res = await agent.get(`/api/squads/${squadId}/training-sheet`);
  expect(res.status, JSON.stringify(res.body)).toBe(200);
  return res.body as TrainingSheet;
}

async function planOf(assessmentId: string): Promise<{ version: number; adjustedAt: string | null; exercises: PlannedExercise[] }> {
  const res = await as.coach.get(`/api/assessments/${assessmentId}`);
  const r = res.body.result;
  return { version: r.version, adjustedAt: r.adjustment?.createdAt ?? null, exercises: r.adjustment?.exercises ?? r.result.plan.exercises };
}

/** Each exercise's entry for one athlete, from the sheet: exercise id → [sets, held]. */
function linesOf(s: TrainingSheet, athleteId: string) {
  const out: Record<string, { sets: unknown; held: boolean; physioChanges: boolean }> = {};
  for (const e of s.exercises) {
    for (const x of e.entries) if (x.athleteId === athleteId) out[e.id] = { sets: x.prescription.sets, held: x.held, physioChanges: x.physioChanges };
  }
  return out;
}

describe('GET /api/squads/:id/training-sheet', () => {
  it("lists the squad's current members only, in name order, with who has no screen yet", async () => {
    const s = await sheet(as.coach);
    expect(s.squad).toEqual({ id: ids.squad, name: 'Under-14' });
    expect(s.athletes.map((a) => [a.name, a.state])).toEqual([
      ['Ana Ames', 'plan'],
      ['Ben Berg', 'plan'],
      ['Cat Cole', 'no-screen'],
      ['Dee Dunn', 'plan'],
    ]);
    expect(s.athletes.find((a) => a.id === ids.ana)).toMatchObject({ assessmentId: ids.anaScreen, screenedOn: LATER, source: 'engine' });
  });

  it("follows a tester's adjustment of the newest screen's plan, with its doses", async () => {
    const before = await planOf(ids.anaScreen!);
    const first = before.exercises[0]!;
    const redosed = { ...first, prescription: { ...first.prescription, sets: { min: first.prescription.sets.min, max: first.prescription.sets.min } } };
    const put = await as.tester
      .put(`/api/assessments/${ids.anaScreen}/plan`)
      .send({ exercises: [redosed], note: 'One exercise while exams are on.', overrides: [], basedOn: { resultVersion: before.version, adjustedAt: null } });
    expect(put.status, JSON.stringify(put.body)).toBe(200);

    const after = await planOf(ids.anaScreen!);
    const s = await sheet(as.tester);
    expect(linesOf(s, ids.ana!)).toEqual(
      Object.fromEntries(after.exercises.map((e) => [e.id, { sets: e.prescription.sets, held: false, physioChanges: false }])),
    );
    expect(Object.keys(linesOf(s, ids.ana!))).toEqual([first.id]);
    expect(s.athletes.find((a) => a.id === ids.ana)).toMatchObject({ source: 'adjusted', adjustedByName: 'Tess Tester', exerciseCount: 1 });
  });

  it('says why loaded and landing work waits: pain not cleared (the engine already left it out) and referred on (held, still listed)', async () => {
    const set = await as.physio.put(`/api/athletes/${ids.dee}/clearance`).send({ status: 'referred', detail: 'Sports medicine clinic' });
    expect(set.status, JSON.stringify(set.body)).toBe(200);
    const s = await sheet(as.physio);

    const ben = s.athletes.find((a) => a.id === ids.ben)!;
    expect(ben.hold).toMatch(/on hold until a physiotherapist has seen the athlete/);
    const benPlan = await planOf(ids.benScreen!);
    expect(Object.keys(linesOf(s, ids.ben!)).sort()).toEqual(benPlan.exercises.map((e) => e.id).sort());

    const dee = s.athletes.find((a) => a.id === ids.dee)!;
    expect(dee.hold).toMatch(/referred on/);
    const deePlan = await planOf(ids.deeScreen!);
    // Held: loaded strength work and landing work; the rest is done as planned.
    const loaded = deePlan.exercises.filter(isLoadedStrength).map((e) => e.id);
    const landing = deePlan.exercises.filter((e) => e.isJump).map((e) => e.id);
    expect(loaded.length).toBeGreaterThan(0);
    expect(landing.length).toBeGreaterThan(0);
    const lines = linesOf(s, ids.dee!);
    expect(Object.keys(lines).sort()).toEqual(deePlan.exercises.map((e) => e.id).sort());
    for (const e of deePlan.exercises) expect(lines[e.id]!.held, e.id).toBe(loaded.includes(e.id) || landing.includes(e.id));
    expect(deePlan.exercises.some((e) => !loaded.includes(e.id) && !landing.includes(e.id))).toBe(true);
    // No pain was reported at Dee's screen: the referral made no new result version.
    expect((await as.coach.get(`/api/assessments/${ids.deeScreen}`)).body.result.version).toBe(1);

    // "Train with changes": nothing held, the physiotherapist's words beside Dee and her lines marked.
    await as.physio.put(`/api/athletes/${ids.dee}/clearance`).send({ status: 'modified', detail: 'No drop landings for three weeks.' }).expect(200);
    const changed = await sheet(as.coach);
    const deeNow = changed.athletes.find((a) => a.id === ids.dee)!;
    expect([deeNow.hold, deeNow.physioChanges]).toEqual([null, 'No drop landings for three weeks.']);
    for (const line of Object.values(linesOf(changed, ids.dee!))) expect([line.held, line.physioChanges]).toEqual([false, true]);
    expect(Object.values(linesOf(changed, ids.ben!)).every((line) => !line.physioChanges)).toBe(true);
    await as.physio.put(`/api/athletes/${ids.dee}/clearance`).send({ status: 'referred', detail: 'Sports medicine clinic' }).expect(200);
  });

  it('groups every line once under its exercise, in session order', async () => {
    const s = await sheet(as.coach);
    const phases = ['mobility', 'activation', 'control', 'landing', 'strength'];
    const order = s.exercises.map((e) => phases.indexOf(e.phase));
    expect(order).toEqual([...order].sort((a, b) => a - b));
    const perAthlete = new Map<string, number>();
    for (const e of s.exercises) for (const x of e.entries) perAthlete.set(x.athleteId, (perAthlete.get(x.athleteId) ?? 0) + 1);
    for (const a of s.athletes) expect(perAthlete.get(a.id) ?? 0, a.name).toBe(a.exerciseCount);
  });

  it('is for the club staff: parents are refused, an unknown squad is a 404', async () => {
    expect((await as.parent.get(`/api/squads/${ids.squad}/training-sheet`)).status).toBe(403);
    expect((await as.coach.get('/api/squads/8b2f8a9e-3f4f-4c55-9d0e-0c1b2a3d4e5f/training-sheet')).status).toBe(404);
    expect((await as.coach.get('/api/squads/not-a-squad/training-sheet')).status).toBe(404);
  });

  it("keeps the squad's recorded sessions from parents", async () => {
    expect((await as.parent.get(`/api/squads/${ids.squad}/training-sessions`)).status).toBe(403);
  });
});

describe('recording who took part in a session', () => {
  const record = (agent: Agent, body: object, squadId = ids.squad!) => agent.post(`/api/squads/${squadId}/training-sessions`).send(body);
  const listed = async () =>
    (await as.coach.get(`/api/squads/${ids.squad}/training-sessions`)).body.sessions as {
      heldOn: string;
      athleteIds: string[];
      note: string;
      recordedByName: string;
    }[];

  it('records a day, and recording the same day again replaces who took part', async () => {
    const first = await record(as.tester, { heldOn: day(0), athleteIds: [ids.ana, ids.ben], note: 'Bands and balance.' });
    expect(first.status, JSON.stringify(first.body)).toBe(201);
    expect(first.body.session).toMatchObject({
      heldOn: day(0),
      note: 'Bands and balance.',
      recordedByName: 'Tess Tester',
      athleteIds: [ids.ana, ids.ben].sort(),
    });

    const again = await record(as.coach, { heldOn: day(0), athleteIds: [ids.ana], note: 'Ben left early.' });
    expect(again.status).toBe(200);
    expect(again.body.session.id).toBe(first.body.session.id);
    const sessions = await listed();
    expect(sessions).toHaveLength(1);
    expect(sessions[0]).toMatchObject({ heldOn: day(0), athleteIds: [ids.ana], note: 'Ben left early.', recordedByName: 'Cole Coach' });
  });

  it('refuses athletes of another squad, archived ones, a future day and an empty list, and keeps what was recorded', async () => {
    const before = await listed();
    for (const [body, field] of [
      [{ heldOn: day(-1), athleteIds: [ids.ana, ids.fin] }, 'athleteIds'],
      [{ heldOn: day(-1), athleteIds: [ids.eli] }, 'athleteIds'],
      [{ heldOn: day(3), athleteIds: [ids.ana] }, 'heldOn'],
      [{ heldOn: day(-400), athleteIds: [ids.ana] }, 'heldOn'],
      [{ heldOn: '2026-02-30', athleteIds: [ids.ana] }, 'heldOn'],
      [{ heldOn: day(-1), athleteIds: [] }, 'athleteIds'],
    ] as const) {
      const res = await record(as.coach, body);
      expect(res.status, JSON.stringify(body)).toBe(400);
      expect(Object.keys(res.body.error.fields ?? {}), JSON.stringify(res.body)).toContain(field);
    }
    expect(await listed()).toEqual(before);
    expect((await record(as.parent, { heldOn: day(0), athleteIds: [ids.ana] })).status).toBe(403);
  });

  it("counts the sessions an athlete took part in between their last two screens in the athlete's progress", async () => {
    // Ana's screens: 90 and 20 days ago. Three sessions of her squad between them, two with her; those
    // on the screens' own days count for neither; another squad's session does not count.
    for (const [heldOn, who] of [
      [EARLIER, [ids.ana, ids.ben]],
      [day(-60), [ids.ana, ids.ben]],
      [day(-55), [ids.ben]],
      [day(-50), [ids.ana]],
      [LATER, [ids.ana, ids.ben]],
    ] as const) {
      const res = await record(as.coach, { heldOn, athleteIds: who });
      expect([200, 201], JSON.stringify(res.body)).toContain(res.status);
    }
    expect((await record(as.coach, { heldOn: day(-40), athleteIds: [ids.fin] }, ids.other)).status).toBe(201);
    const ana = await as.coach.get(`/api/athletes/${ids.ana}/progress`);
    expect(ana.status).toBe(200);
    expect(ana.body.sessionsBetween).toEqual({ attended: 2, held: 3 });
    // Since her newest screen (LATER, its own day not counted) up to today: today's session only, with her.
    expect(ana.body.sessionsSinceLatest).toEqual({ attended: 1, held: 1 });
    // Ben was in the same sessions but has one screen (LATER): nothing to compare; since it, today's
    // session, without him.
    const ben = await as.coach.get(`/api/athletes/${ids.ben}/progress`);
    expect(ben.body.comparison).toBeNull();
    expect(ben.body.sessionsBetween).toBeNull();
    expect(ben.body.sessionsSinceLatest).toEqual({ attended: 0, held: 1 });
    // Cat was never screened: nothing to count from.
    expect((await as.coach.get(`/api/athletes/${ids.cat}/progress`)).body.sessionsSinceLatest).toBeNull();
  });

  it("squad trends count each athlete's sessions since their newest screen, in the table and the CSV", async () => {
    // Recorded so far for this squad (tests above): EARLIER, -60, -55, -50, LATER (-20) and today [Ana].
    // Two more: -10 [Ben, Dee] and -5 [Ben, Cat]. Since the newest screens (all on LATER; a session on
    // the screen's own day does not count): -10, -5 and today, 3 held. Ana took part in today's only (1);
    // Ben in -10 and -5 (2); Dee in -10 (1); Cat was never screened (null). Hand-counted.
    expect((await record(as.coach, { heldOn: day(-10), athleteIds: [ids.ben, ids.dee] })).status).toBe(201);
    expect((await record(as.coach, { heldOn: day(-5), athleteIds: [ids.ben, ids.cat] })).status).toBe(201);
    const res = await as.coach.get(`/api/squads/${ids.squad}/trends`);
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    const since = Object.fromEntries((res.body.athletes as { id: string; sessionsSinceScreen: unknown }[]).map((a) => [a.id, a.sessionsSinceScreen]));
    // The same hold as the training sheet's: Ben reported pain and nobody has cleared him; Dee is referred on (a clearance, not waiting).
    const waiting = Object.fromEntries(
      (res.body.athletes as { id: string; awaitingClearance: boolean; clearance: string | null }[]).map((a) => [a.id, [a.awaitingClearance, a.clearance]]),
    );
    expect(waiting).toEqual({ [ids.ana!]: [false, null], [ids.ben!]: [true, null], [ids.cat!]: [false, null], [ids.dee!]: [false, 'referred'] });
    expect(since).toEqual({
      [ids.ana!]: { attended: 1, held: 3 },
      [ids.ben!]: { attended: 2, held: 3 },
      [ids.cat!]: null,
      [ids.dee!]: { attended: 1, held: 3 },
    });
    // Fin's squad recorded one session, before his screen: none since.
    const other = await as.coach.get(`/api/squads/${ids.other}/trends`);
    expect(other.body.athletes.map((a: { sessionsSinceScreen: unknown }) => a.sessionsSinceScreen)).toEqual([{ attended: 0, held: 0 }]);

    const csv = await as.coach.get(`/api/squads/${ids.squad}/trends?format=csv`);
    expect(csv.status).toBe(200);
    const lines = csv.text.trim().split(/\r?\n/);
    const header = lines[0]!.split(',');
    const column = (name: string) => header.indexOf(name);
    expect(column('sessions_since_screen_held')).toBe(column('sessions_since_screen_taken_part') + 1);
    const sessions = (line: string) => line.split(',').slice(column('sessions_since_screen_taken_part'), column('sessions_since_screen_held') + 1);
    expect(sessions(lines.find((l) => l.startsWith('Ames,Ana,'))!)).toEqual(['1', '3']);
    expect(sessions(lines.find((l) => l.startsWith('Cole,Cat,'))!)).toEqual(['', '']);
  });

  it("lists each squad's last session and how many took part with the squads (the homes' squad cards)", async () => {
    // Newest recorded above: today for this squad (Ana only, after the replacement), -40 for the other (Fin).
    const res = await as.tester.get('/api/squads');
    expect(res.status).toBe(200);
    const bySquad = Object.fromEntries((res.body.squads as { id: string; lastSession: unknown }[]).map((s) => [s.id, s.lastSession]));
    expect(bySquad[ids.squad!]).toEqual({ heldOn: day(0), attended: 1 });
    expect(bySquad[ids.other!]).toEqual({ heldOn: day(-40), attended: 1 });
    expect((await as.parent.get('/api/squads')).status).toBe(403);
  });
});
