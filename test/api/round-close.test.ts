import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { AssessmentDetail, RoundDetail } from '@/features/screening/contract';
import { makeAthlete, makeClub, makeSquad, makeTestApp, makeUser, signedInAgent } from '../fixtures/builders';
import { memoryStorage } from '../fixtures/photos';
import { valgusSquat } from '../fixtures/screening';
import { createTestDb, type TestDb } from '../fixtures/test-db';

// Closing a round ends its screening (drafts, photos and submissions refused with 409, reading stays);
// only a head coach reopens it. The round's athletes carry their flags, most severe first.

let testDb: TestDb;
let app: ReturnType<typeof makeTestApp>['app'];
type Agent = Awaited<ReturnType<typeof signedInAgent>>;
let tester: Agent;
let coach: Agent;
let admin: Agent;
let outsider: Agent;
let roundId: string;
let screened: string;
let other: string;
let clubId: string;

beforeAll(async () => {
  testDb = await createTestDb();
  ({ app } = makeTestApp(testDb.db, { storage: memoryStorage() }));
  const db = testDb.db;
  const club = await makeClub(db, 'Riverside');
  const hill = await makeClub(db, 'Hillside');
  clubId = club.id;
  const squad = await makeSquad(db, club.id);
  await makeUser(db, { email: 'tester@riverside.test', clubId: club.id, role: 'tester' });
  await makeUser(db, { email: 'coach@riverside.test', displayName: 'Cora Head', clubId: club.id, role: 'head_coach' });
  await makeUser(db, { email: 'admin@riverside.test', clubId: club.id, role: 'admin' });
  await makeUser(db, { email: 'coach@hillside.test', clubId: hill.id, role: 'head_coach' });
  const ava = await makeAthlete(db, { clubId: club.id, squadId: squad.id, firstName: 'Ava', lastName: 'Brook' });
  await makeAthlete(db, { clubId: club.id, squadId: squad.id, firstName: 'Ben', lastName: 'Cole', sex: 'male' });
  tester = await signedInAgent(app, 'tester@riverside.test');
  coach = await signedInAgent(app, 'coach@riverside.test');
  admin = await signedInAgent(app, 'admin@riverside.test');
  outsider = await signedInAgent(app, 'coach@hillside.test');
  const round = (await tester.post('/api/rounds').send({ squadId: squad.id, name: 'Close me', screenedOn: '2026-09-14' })).body as RoundDetail;
  roundId = round.round.id;
  screened = round.athletes.find((a) => a.athleteId === ava.id)!.assessmentId;
  other = round.athletes.find((a) => a.athleteId !== ava.id)!.assessmentId;
  // valgusSquat's right FPPA (about 29.5 deg) is a concern; a ticked knee-to-wall heel lift and a short
  // distance add lower-severity flags.
  const res = await tester.put(`/api/assessments/${screened}`).send({
    draftVersion: 0,
    draft: { body: {}, tasks: { 'two-leg-squat': valgusSquat(), 'single-leg-stance-left': { criteria: ['stance-trunk-shift'] } } },
  });
  expect(res.status).toBe(200);
  expect((await tester.post(`/api/assessments/${screened}/submit`)).status).toBe(200);
});

afterAll(async () => {
  await testDb.drop();
});

describe('round athletes list their flags by severity', () => {
  it('puts concerns before watches, with titles and sides', async () => {
    const detail = (await tester.get(`/api/rounds/${roundId}`)).body as RoundDetail;
    const ava = detail.athletes.find((a) => a.assessmentId === screened)!;
    expect(ava.flags.length).toBe(ava.flagCount);
    expect(ava.flags.length).toBeGreaterThanOrEqual(2);
    const severities = ava.flags.map((f) => f.severity);
    expect(severities[0]).toBe('concern');
    expect(severities).toEqual([...severities].sort((a, b) => (a === b ? 0 : a === 'concern' ? -1 : 1)));
    expect(ava.flags[0]).toMatchObject({ side: 'right', title: expect.any(String) });
    expect(detail.athletes.find((a) => a.assessmentId === other)!.flags).toEqual([]);
  });
});

describe('closing and reopening a round', () => {
  it('lets a tester close it; then drafts, photos and submissions are refused with 409 and reading stays', async () => {
    const res = await tester.post(`/api/rounds/${roundId}/close`);
    expect(res.status).toBe(200);
    expect(res.body.round.closedAt).toEqual(expect.any(String));

    const draft = await tester.put(`/api/assessments/${other}`).send({ draftVersion: 0, draft: { body: {}, tasks: { 'drop-landing': { criteria: [] } } } });
    expect(draft.status).toBe(409);
    expect(draft.body.error.code).toBe('round_closed');
    const photo = await tester
      .post(`/api/assessments/${other}/photos`)
      .field('task', 'two-leg-squat')
      .field('view', 'front')
      .attach(
        'photo',
        await sharp({ create: { width: 40, height: 40, channels: 3, background: '#888' } })
          .jpeg()
          .toBuffer(),
        'p.jpg',
      );
    expect(photo.status).toBe(409);
    expect((await tester.post(`/api/assessments/${screened}/submit`)).status).toBe(409);

    const read = (await tester.get(`/api/assessments/${screened}`)).body as AssessmentDetail;
    expect(read.roundClosedAt).toEqual(expect.any(String));
    expect(read.result!.version).toBe(1);
  });

  it('lets only a head coach of the club reopen it', async () => {
    expect((await tester.post(`/api/rounds/${roundId}/reopen`)).status).toBe(403);
    expect((await admin.post(`/api/rounds/${roundId}/reopen`)).status).toBe(403);
    expect((await outsider.post(`/api/rounds/${roundId}/reopen`)).status).toBe(403);
    const res = await coach.post(`/api/rounds/${roundId}/reopen`);
    expect(res.status).toBe(200);
    expect(res.body.round).toMatchObject({ closedAt: null, closedByName: null });
    const draft = await tester.put(`/api/assessments/${other}`).send({ draftVersion: 0, draft: { body: {}, tasks: { 'drop-landing': { criteria: [] } } } });
    expect(draft.status).toBe(200);
  });

  it('names who closed it', async () => {
    await coach.post(`/api/rounds/${roundId}/close`);
    const res = (await tester.get(`/api/rounds/${roundId}`)).body as RoundDetail;
    expect(res.round.closedByName).toBe('Cora Head');
    expect((await tester.post('/api/rounds/00000000-0000-0000-0000-000000000000/close')).status).toBe(404);
  });
});

// our choice: a child who joins the squad after a round began is brought into it on request, not by
// itself (the tester sees who and decides); a closed round takes nobody.
describe('athletes who joined the squad after the round began', () => {
  it('are named by an open round, brought in with a not-started screen each, and refused by a closed one', async () => {
    const db = testDb.db;
    const squad = await makeSquad(db, clubId, 'Under-15');
    const first = await makeAthlete(db, { clubId, squadId: squad.id, firstName: 'Cai', lastName: 'Dunn' });
    const round = (await tester.post('/api/rounds').send({ squadId: squad.id, name: 'Winter', screenedOn: '2026-12-01' })).body as RoundDetail;
    expect(round.newcomers).toEqual([]);
    const otto = await makeAthlete(db, { clubId, squadId: squad.id, firstName: 'Otto', lastName: 'Lind', sex: 'male' });
    const ines = await makeAthlete(db, { clubId, squadId: squad.id, firstName: 'Ines', lastName: 'Varga' });
    const gone = await makeAthlete(db, { clubId, squadId: squad.id, firstName: 'Gil', lastName: 'Amos' });
    expect((await admin.post(`/api/athletes/${gone.id}/archive`)).status).toBe(200);

    const before = (await tester.get(`/api/rounds/${round.round.id}`)).body as RoundDetail;
    expect(before.athletes.map((a) => a.athleteId)).toEqual([first.id]);
    // Name order; the archived athlete is not asked for.
    expect(before.newcomers!.map((a) => `${a.firstName} ${a.lastName}`)).toEqual(['Otto Lind', 'Ines Varga']);

    expect((await outsider.post(`/api/rounds/${round.round.id}/newcomers`)).status).toBe(403);
    const added = await tester.post(`/api/rounds/${round.round.id}/newcomers`);
    expect(added.status).toBe(200);
    const after = added.body as RoundDetail;
    expect(after.newcomers).toEqual([]);
    expect(after.athletes.map((a) => [a.firstName, a.status])).toEqual([
      ['Cai', 'not_started'],
      ['Otto', 'not_started'],
      ['Ines', 'not_started'],
    ]);
    expect(after.round.counts).toMatchObject({ not_started: 3 });
    // Asked again: nothing doubles.
    expect(((await tester.post(`/api/rounds/${round.round.id}/newcomers`)).body as RoundDetail).athletes).toHaveLength(3);
    expect(after.athletes.find((a) => a.athleteId === otto.id)).toBeDefined();
    expect(after.athletes.find((a) => a.athleteId === ines.id)).toBeDefined();

    await makeAthlete(db, { clubId, squadId: squad.id, firstName: 'Lou', lastName: 'Late' });
    expect((await tester.post(`/api/rounds/${round.round.id}/close`)).status).toBe(200);
    const closed = (await tester.get(`/api/rounds/${round.round.id}`)).body as RoundDetail;
    expect(closed.newcomers).toEqual([]);
    const refused = await tester.post(`/api/rounds/${round.round.id}/newcomers`);
    expect(refused.status).toBe(409);
    expect(refused.body.error.message).toBe('This round is closed: reopen it before adding athletes.');
    expect(((await tester.get(`/api/rounds/${round.round.id}`)).body as RoundDetail).athletes).toHaveLength(3);
  });
});
