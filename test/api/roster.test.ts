import { count, eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { athletes, auditEvents, consents, guardianLinks } from '@/db/schema';
import { ROSTER_HEADER_LINE } from '@/features/athletes/schemas';
import { makeAthlete, makeClub, makeSquad, makeTestApp, makeUser, signedInAgent } from '../fixtures/builders';
import { bornYearsAgo, makeRosterCsv } from '../fixtures/roster';
import { createTestDb, type TestDb } from '../fixtures/test-db';

let testDb: TestDb;
let app: ReturnType<typeof makeTestApp>['app'];
const ids: Record<string, string> = {};

type Agent = Awaited<ReturnType<typeof signedInAgent>>;
const as: Record<'admin' | 'coach' | 'tester' | 'physio' | 'parent' | 'otherAdmin', Agent> = {} as never;

const newAthlete = (overrides: Record<string, unknown> = {}) => ({
  firstName: 'Lotte',
  lastName: 'Varga',
  dateOfBirth: bornYearsAgo(11),
  sex: 'female',
  racketHand: 'left',
  takeOffLeg: 'right',
  squadId: ids.u13,
  ...overrides,
});

async function athleteCount(clubId: string) {
  const [row] = await testDb.db.select({ n: count() }).from(athletes).where(eq(athletes.clubId, clubId));
  return row!.n;
}

beforeAll(async () => {
  testDb = await createTestDb();
  ({ app } = makeTestApp(testDb.db));
  const db = testDb.db;
  const club = await makeClub(db, 'Riverside');
  const other = await makeClub(db, 'Hillside');
  ids.club = club.id;
  ids.other = other.id;
  ids.u13 = (await makeSquad(db, club.id, 'Under-13')).id;
  ids.u15 = (await makeSquad(db, club.id, 'Under-15')).id;
  ids.hillsideSquad = (await makeSquad(db, other.id, 'Juniors')).id;
  await makeUser(db, { email: 'admin@riverside.test', clubId: club.id, role: 'admin', displayName: 'Ada Admin' });
  await makeUser(db, { email: 'coach@riverside.test', clubId: club.id, role: 'head_coach', displayName: 'Cole Coach' });
  await makeUser(db, { email: 'tester@riverside.test', clubId: club.id, role: 'tester' });
  await makeUser(db, { email: 'physio@riverside.test', clubId: club.id, role: 'physio' });
  const parent = await makeUser(db, { email: 'parent@riverside.test', clubId: club.id, role: 'parent', displayName: 'Pia Parent' });
  ids.secondParent = (await makeUser(db, { email: 'second.parent@riverside.test', clubId: club.id, role: 'parent', displayName: 'Sol Parent' })).id;
  await makeUser(db, { email: 'admin@hillside.test', clubId: other.id, role: 'admin' });
  ids.child = (await makeAthlete(db, { clubId: club.id, squadId: ids.u13, firstName: 'Kit', lastName: 'Parentson', guardianUserId: parent.id })).id;
  ids.hillsideAthlete = (await makeAthlete(db, { clubId: other.id, squadId: ids.hillsideSquad })).id;

  as.admin = await signedInAgent(app, 'admin@riverside.test');
  as.coach = await signedInAgent(app, 'coach@riverside.test');
  as.tester = await signedInAgent(app, 'tester@riverside.test');
  as.physio = await signedInAgent(app, 'physio@riverside.test');
  as.parent = await signedInAgent(app, 'parent@riverside.test');
  as.otherAdmin = await signedInAgent(app, 'admin@hillside.test');
});

afterAll(async () => {
  await testDb.drop();
});

describe('squads', () => {
  it('are created and renamed by a head coach; names are unique in the club', async () => {
    const created = await as.coach.post('/api/squads').send({ name: '  Development  ' });
    expect(created.status).toBe(201);
    expect(created.body.squad).toEqual({ id: expect.any(String), name: 'Development', archived: false });

    const twin = await as.admin.post('/api/squads').send({ name: 'development' });
    expect(twin.status).toBe(409);
    expect(twin.body.error.fields.name).toMatch(/already has a squad/);

    const renamed = await as.coach.patch(`/api/squads/${created.body.squad.id}`).send({ name: 'Development group' });
    expect(renamed.status).toBe(200);
    expect(renamed.body.squad.name).toBe('Development group');

    const empty = await as.coach.post('/api/squads').send({ name: ' ' });
    expect(empty.status).toBe(400);
    expect(empty.body.error.fields.name).toBe('Name the squad.');
  });

  it('are archived only when no athlete is left in them', async () => {
    const full = await as.admin.post(`/api/squads/${ids.u13}/archive`);
    expect(full.status).toBe(409);
    expect(full.body.error.message).toMatch(/still has \d+ athlete/);

    const { body } = await as.admin.post('/api/squads').send({ name: 'Summer camp' });
    const archived = await as.admin.post(`/api/squads/${body.squad.id}/archive`);
    expect(archived.status).toBe(200);
    expect(archived.body.squad.archived).toBe(true);
    const list = await as.admin.get('/api/squads');
    expect(list.body.squads.map((s: { name: string }) => s.name)).not.toContain('Summer camp');
    // An archived squad cannot receive athletes.
    const into = await as.admin.post('/api/athletes').send(newAthlete({ firstName: 'Into', squadId: body.squad.id }));
    expect(into.status).toBe(400);
    expect(into.body.error.fields.squadId).toBeDefined();
  });

  it.each([
    ['tester', 'post', '/api/squads'],
    ['physio', 'post', '/api/squads'],
    ['parent', 'post', '/api/squads'],
  ] as const)('refuses a %s creating a squad', async (who, _method, url) => {
    expect((await as[who].post(url).send({ name: `By ${who}` })).status).toBe(403);
  });

  it('refuses another club renaming or archiving a squad', async () => {
    expect((await as.otherAdmin.patch(`/api/squads/${ids.u13}`).send({ name: 'Taken over' })).status).toBe(403);
    expect((await as.otherAdmin.post(`/api/squads/${ids.u13}/archive`)).status).toBe(403);
    expect((await as.otherAdmin.post('/api/squads').set('X-Club-Id', ids.club!).send({ name: 'Sneaky' })).status).toBe(403);
  });
});

describe('athletes: create, edit, move, archive', () => {
  it('creates an athlete with every field, as a head coach', async () => {
    const res = await as.coach.post('/api/athletes').send(newAthlete({ firstName: ' Lotte ' }));
    expect(res.status).toBe(201);
    expect(res.body.athlete).toMatchObject({
      firstName: 'Lotte',
      lastName: 'Varga',
      sex: 'female',
      racketHand: 'left',
      takeOffLeg: 'right',
      squadId: ids.u13,
      squadName: 'Under-13',
      archived: false,
      guardians: [],
      consents: { photos: null, emailSummaries: null },
    });
    ids.lotte = res.body.athlete.id;
    const trail = await as.admin.get(`/api/audit?athleteId=${ids.lotte}&subject=athlete`);
    expect(trail.body.events.map((e: { action: string; actorName: string; detail: unknown }) => [e.action, e.actorName, e.detail])).toEqual([
      ['create', 'Cole Coach', { via: 'form' }],
    ]);
  });

  it.each([
    ['a 4-year-old', bornYearsAgo(4), /age of 4 today; athletes here are 6 to 19/],
    ['a 25-year-old', bornYearsAgo(25), /age of 25 today/],
    ['a day that does not exist', '2014-02-30', /does not exist/],
    ['a day/month/year date', '09/03/2014', /YYYY-MM-DD/],
    ['a future date', '2999-01-01', /in the future/],
  ])('refuses %s as date of birth, beside the field', async (_what, dateOfBirth, message) => {
    const res = await as.admin.post('/api/athletes').send(newAthlete({ firstName: 'Dot', dateOfBirth }));
    expect(res.status).toBe(400);
    expect(res.body.error.fields.dateOfBirth).toMatch(message);
  });

  it('names every missing field', async () => {
    const res = await as.admin.post('/api/athletes').send({});
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields).sort()).toEqual(['dateOfBirth', 'firstName', 'lastName', 'racketHand', 'sex', 'squadId', 'takeOffLeg'].sort());
  });

  it('refuses a squad of another club', async () => {
    const res = await as.admin.post('/api/athletes').send(newAthlete({ firstName: 'Cross', squadId: ids.hillsideSquad }));
    expect(res.status).toBe(400);
    expect(res.body.error.fields.squadId).toMatch(/club’s squads/);
  });

  it('refuses the same name and date of birth twice', async () => {
    const res = await as.admin.post('/api/athletes').send(newAthlete({ firstName: 'LOTTE', lastName: 'varga ' }));
    expect(res.status).toBe(409);
    expect(res.body.error.message).toMatch(/already in the club/);
  });

  it('edits fields and moves the athlete to another squad of the club', async () => {
    const edit = await as.admin.patch(`/api/athletes/${ids.lotte}`).send({ lastName: 'Varga-Holm', racketHand: 'right' });
    expect(edit.status).toBe(200);
    expect(edit.body.athlete).toMatchObject({ lastName: 'Varga-Holm', racketHand: 'right', takeOffLeg: 'right' });

    const move = await as.coach.patch(`/api/athletes/${ids.lotte}`).send({ squadId: ids.u15 });
    expect(move.status).toBe(200);
    expect(move.body.athlete).toMatchObject({ squadId: ids.u15, squadName: 'Under-15' });

    const away = await as.coach.patch(`/api/athletes/${ids.lotte}`).send({ squadId: ids.hillsideSquad });
    expect(away.status).toBe(400);
    const nothing = await as.coach.patch(`/api/athletes/${ids.lotte}`).send({});
    expect(nothing.status).toBe(400);
  });

  it('archives without deleting, hides from the roster, refuses edits, and restores', async () => {
    const archived = await as.coach.post(`/api/athletes/${ids.lotte}/archive`);
    expect(archived.status).toBe(200);
    expect(archived.body.athlete.archived).toBe(true);
    const [row] = await testDb.db.select().from(athletes).where(eq(athletes.id, ids.lotte!));
    expect(row?.archivedAt).toBeInstanceOf(Date);

    const list = await as.coach.get('/api/athletes');
    expect(list.body.athletes.map((a: { id: string }) => a.id)).not.toContain(ids.lotte);
    const all = await as.coach.get('/api/athletes?archived=include');
    expect(all.body.athletes.find((a: { id: string }) => a.id === ids.lotte)?.archived).toBe(true);

    const edit = await as.coach.patch(`/api/athletes/${ids.lotte}`).send({ firstName: 'Lola' });
    expect(edit.status).toBe(409);
    // A new athlete with the same identity is refused, pointing at the archived one.
    const again = await as.coach.post('/api/athletes').send(newAthlete({ lastName: 'Varga-Holm' }));
    expect(again.status).toBe(409);
    expect(again.body.error.message).toMatch(/restore them instead/);

    const restored = await as.coach.post(`/api/athletes/${ids.lotte}/restore`);
    expect(restored.status).toBe(200);
    expect(restored.body.athlete).toMatchObject({ archived: false, squadId: ids.u15 });
  });

  it('has no delete route for athletes', async () => {
    const res = await as.admin.delete(`/api/athletes/${ids.lotte}`);
    expect(res.status).toBe(404);
    expect(await athleteCount(ids.club!)).toBeGreaterThan(0);
  });

  it.each(['tester', 'physio', 'parent'] as const)('refuses every roster change from a %s', async (who) => {
    const agent = as[who];
    expect((await agent.post('/api/athletes').send(newAthlete({ firstName: `By${who}` }))).status).toBe(403);
    expect((await agent.patch(`/api/athletes/${ids.child}`).send({ firstName: 'Renamed' })).status).toBe(403);
    expect((await agent.post(`/api/athletes/${ids.child}/archive`)).status).toBe(403);
    expect((await agent.post(`/api/athletes/${ids.child}/restore`)).status).toBe(403);
    expect((await agent.post(`/api/athletes/${ids.child}/consents`).send({ kind: 'photos', granted: false, decidedOn: '2026-01-05' })).status).toBe(403);
    expect((await agent.post(`/api/athletes/${ids.child}/guardians`).send({ email: 'second.parent@riverside.test' })).status).toBe(403);
    expect((await agent.post('/api/athletes/import').attach('file', Buffer.from(makeRosterCsv([{}])), 'roster.csv')).status).toBe(403);
    const [row] = await testDb.db.select().from(athletes).where(eq(athletes.id, ids.child!));
    expect(row).toMatchObject({ firstName: 'Kit', archivedAt: null });
  });

  it('refuses an admin of another club', async () => {
    expect((await as.otherAdmin.get(`/api/athletes/${ids.child}`)).status).toBe(403);
    expect((await as.otherAdmin.patch(`/api/athletes/${ids.child}`).send({ firstName: 'Stolen' })).status).toBe(403);
    expect((await as.otherAdmin.post(`/api/athletes/${ids.child}/archive`)).status).toBe(403);
    expect((await as.otherAdmin.get(`/api/athletes/${ids.child}/consents`)).status).toBe(403);
    expect(
      (
        await as.otherAdmin
          .post('/api/athletes')
          .set('X-Club-Id', ids.club!)
          .send(newAthlete({ firstName: 'Stray' }))
      ).status,
    ).toBe(403);
  });

  it('answers 404 for an unknown athlete', async () => {
    expect((await as.admin.patch('/api/athletes/00000000-0000-4000-8000-000000000000').send({ firstName: 'X' })).status).toBe(404);
    expect((await as.admin.post('/api/athletes/not-an-id/archive')).status).toBe(404);
  });
});

describe('consent decisions', () => {
  it('keeps every decision; the newest is in force and names who recorded it', async () => {
    const no = await as.coach.post(`/api/athletes/${ids.child}/consents`).send({ kind: 'photos', granted: false, decidedOn: '2026-10-02' });
    expect(no.status).toBe(201);
    expect(no.body.athlete.consents.photos).toEqual({ granted: false, decidedOn: '2026-10-02' });
    const yes = await as.admin.post(`/api/athletes/${ids.child}/consents`).send({ kind: 'photos', granted: true, decidedOn: '2026-11-20' });
    expect(yes.body.athlete.consents.photos).toEqual({ granted: true, decidedOn: '2026-11-20' });
    await as.admin.post(`/api/athletes/${ids.child}/consents`).send({ kind: 'email_summaries', granted: false, decidedOn: '2026-11-20' });

    const history = await as.physio.get(`/api/athletes/${ids.child}/consents`);
    expect(history.status).toBe(200);
    const photos = history.body.consents.filter((c: { kind: string }) => c.kind === 'photos');
    // The fixture's decision, then the coach's "no", then the admin's "yes": newest first.
    expect(photos.map((c: { granted: boolean; recordedBy: string | null }) => [c.granted, c.recordedBy])).toEqual([
      [true, 'Ada Admin'],
      [false, 'Cole Coach'],
      [true, null],
    ]);
    const rows = await testDb.db.select().from(consents).where(eq(consents.athleteId, ids.child!));
    // The fixture's photo and screening decisions, and the three recorded here.
    expect(rows).toHaveLength(5);
  });

  it('refuses a decision dated before the one in force, which would overturn a later choice of the family', async () => {
    const before = (await testDb.db.select().from(consents).where(eq(consents.athleteId, ids.child!))).length;
    // In force: the admin's "yes" decided 2026-11-20 (the test above).
    const res = await as.admin.post(`/api/athletes/${ids.child}/consents`).send({ kind: 'photos', granted: false, decidedOn: '2026-11-19' });
    expect(res.status).toBe(409);
    expect(res.body.error.fields.decidedOn).toMatch(/A later decision is on record \(yes, decided 20 November 2026\)/);
    expect(await testDb.db.select().from(consents).where(eq(consents.athleteId, ids.child!))).toHaveLength(before);
    // Nor can the family have decided before the child was born (our choice): a 400 naming the day.
    const unborn = await as.admin.post(`/api/athletes/${ids.child}/consents`).send({ kind: 'photos', granted: true, decidedOn: '2000-01-01' });
    expect(unborn.status).toBe(400);
    expect(unborn.body.error.fields.decidedOn).toMatch(/^The day of the decision \(1 January 2000\) is before .+'s date of birth/);
    expect(await testDb.db.select().from(consents).where(eq(consents.athleteId, ids.child!))).toHaveLength(before);
    // The same day as the one in force is a later decision of that day: recorded.
    const same = await as.admin.post(`/api/athletes/${ids.child}/consents`).send({ kind: 'photos', granted: true, decidedOn: '2026-11-20' });
    expect(same.status).toBe(201);
  });

  it('lets a parent read their child’s decisions, not change them', async () => {
    const res = await as.parent.get(`/api/athletes/${ids.child}/consents`);
    expect(res.status).toBe(200);
    expect(res.body.consents.length).toBeGreaterThan(0);
  });

  it.each([
    [{ kind: 'videos', granted: true, decidedOn: '2026-11-01' }, 'kind'],
    [{ kind: 'photos', decidedOn: '2026-11-01' }, 'granted'],
    [{ kind: 'photos', granted: true, decidedOn: '2999-11-01' }, 'decidedOn'],
    [{ kind: 'photos', granted: true }, 'decidedOn'],
  ])('refuses %j beside the field %s', async (body, field) => {
    const res = await as.admin.post(`/api/athletes/${ids.child}/consents`).send(body);
    expect(res.status).toBe(400);
    expect(res.body.error.fields[field]).toEqual(expect.any(String));
  });
});

describe('a parent’s own decision (POST /api/athletes/:id/consents/own)', () => {
  const today = () => new Date().toISOString().slice(0, 10);
  const photoRows = async () => (await testDb.db.select().from(consents).where(eq(consents.athleteId, ids.child!))).filter((c) => c.kind === 'photos');

  it('withdraws photo consent, dated today whatever date is sent, recorded and audited as the parent', async () => {
    const before = (await photoRows()).length;
    const res = await as.parent.post(`/api/athletes/${ids.child}/consents/own`).send({ kind: 'photos', granted: false, decidedOn: '2020-01-01' });
    expect(res.status).toBe(200);
    expect(res.body.changed).toBe(true);
    expect(res.body.athlete.consents.photos).toEqual({ granted: false, decidedOn: today() });
    expect(res.body.consents[0]).toMatchObject({ kind: 'photos', granted: false, decidedOn: today(), recordedBy: 'Pia Parent' });
    expect(await photoRows()).toHaveLength(before + 1);
    // Staff see it at once on the athlete.
    expect((await as.coach.get(`/api/athletes/${ids.child}`)).body.athlete.consents.photos.granted).toBe(false);
    const audit = await testDb.db.select().from(auditEvents).where(eq(auditEvents.athleteId, ids.child!));
    const entry = audit.find((a) => a.subjectKind === 'consent' && a.action === 'withdraw');
    expect(entry).toMatchObject({ clubId: ids.club, detail: { kind: 'photos', granted: false, via: 'family page' } });
    expect(entry!.subjectId).toBe(res.body.consents[0].id);
  });

  it('records nothing when the answer is the one in force (a double tap)', async () => {
    const before = (await photoRows()).length;
    const res = await as.parent.post(`/api/athletes/${ids.child}/consents/own`).send({ kind: 'photos', granted: false });
    expect(res.status).toBe(200);
    expect(res.body.changed).toBe(false);
    expect(await photoRows()).toHaveLength(before);
  });

  it('gives consent back, and records e-mail decisions the same way', async () => {
    const yes = await as.parent.post(`/api/athletes/${ids.child}/consents/own`).send({ kind: 'photos', granted: true });
    expect(yes.body.athlete.consents.photos).toEqual({ granted: true, decidedOn: today() });
    const mail = await as.parent.post(`/api/athletes/${ids.child}/consents/own`).send({ kind: 'email_summaries', granted: true });
    expect(mail.body.athlete.consents.emailSummaries).toEqual({ granted: true, decidedOn: today() });
    // And back to "no", as the earlier tests left it (the roster import below reads it).
    const noMail = await as.parent.post(`/api/athletes/${ids.child}/consents/own`).send({ kind: 'email_summaries', granted: false });
    expect(noMail.body.athlete.consents.emailSummaries).toEqual({ granted: false, decidedOn: today() });
    const audit = await testDb.db.select().from(auditEvents).where(eq(auditEvents.athleteId, ids.child!));
    const consentEntries = audit
      .filter((a) => a.subjectKind === 'consent' && (a.detail as { via?: string }).via === 'family page')
      .map((a) => [a.action, (a.detail as { kind: string }).kind]);
    expect(consentEntries.sort()).toEqual([
      ['set', 'email_summaries'],
      ['set', 'photos'],
      ['withdraw', 'email_summaries'],
      ['withdraw', 'photos'],
    ]);
  });

  it('is for the child’s own parents only: staff record decisions with their date, other families and clubs are refused', async () => {
    const before = (await photoRows()).length;
    expect((await as.coach.post(`/api/athletes/${ids.child}/consents/own`).send({ kind: 'photos', granted: false })).status).toBe(403);
    expect((await as.admin.post(`/api/athletes/${ids.child}/consents/own`).send({ kind: 'photos', granted: false })).status).toBe(403);
    const other = await signedInAgent(app, 'second.parent@riverside.test');
    expect((await other.post(`/api/athletes/${ids.child}/consents/own`).send({ kind: 'photos', granted: false })).status).toBe(403);
    expect([403, 404]).toContain((await as.otherAdmin.post(`/api/athletes/${ids.child}/consents/own`).send({ kind: 'photos', granted: false })).status);
    expect(await photoRows()).toHaveLength(before);
  });

  it.each([
    [{ kind: 'videos', granted: false }, 'kind'],
    [{ kind: { photos: true }, granted: false }, 'kind'],
    [{ kind: 'photos' }, 'granted'],
    [{ kind: 'photos', granted: 'maybe' }, 'granted'],
  ])('refuses %j beside the field %s and records nothing', async (body, field) => {
    const before = (await testDb.db.select().from(consents).where(eq(consents.athleteId, ids.child!))).length;
    const res = await as.parent.post(`/api/athletes/${ids.child}/consents/own`).send(body);
    expect(res.status).toBe(400);
    expect(res.body.error.fields[field]).toMatch(/^Choose /);
    expect(await testDb.db.select().from(consents).where(eq(consents.athleteId, ids.child!))).toHaveLength(before);
  });
});

describe('guardians', () => {
  it('links a parent member, who then sees the child; unlinking takes it away', async () => {
    const second = await signedInAgent(app, 'second.parent@riverside.test');
    expect((await second.get(`/api/athletes/${ids.child}`)).status).toBe(403);

    const linked = await as.coach.post(`/api/athletes/${ids.child}/guardians`).send({ email: ' Second.Parent@Riverside.test ' });
    expect(linked.status).toBe(201);
    expect(linked.body.athlete.guardians.map((g: { displayName: string }) => g.displayName)).toEqual(['Pia Parent', 'Sol Parent']);
    // Linked again: nothing changes, and the trail below holds one link, not two.
    const twice = await as.coach.post(`/api/athletes/${ids.child}/guardians`).send({ email: 'second.parent@riverside.test' });
    expect(twice.status).toBe(201);
    expect(twice.body.athlete.guardians).toHaveLength(2);
    // The list gives staff the number of parent accounts linked to each child (for the admin's home and
    // the "No parent linked" tag); a parent's list says nothing of the other adults.
    const countOf = (body: { athletes: { id: string; guardianCount?: number }[] }) => body.athletes.find((a) => a.id === ids.child)?.guardianCount;
    expect(countOf((await as.coach.get('/api/athletes')).body)).toBe(2);
    // People names the children each parent account is linked to (two parents of one name are told apart).
    const people = (await as.admin.get(`/api/clubs/${ids.club}/members`)).body.members as { displayName: string; role: string; children?: string[] }[];
    expect(people.find((m) => m.displayName === 'Sol Parent')?.children).toEqual(['Kit Parentson']);
    expect(people.find((m) => m.role === 'tester')?.children).toBeUndefined();
    expect(countOf((await as.tester.get('/api/athletes')).body)).toBe(2);
    const ownList = (await second.get('/api/athletes')).body;
    expect(ownList.athletes.map((a: { id: string }) => a.id)).toEqual([ids.child]);
    expect(countOf(ownList)).toBeUndefined();
    const seen = await second.get(`/api/athletes/${ids.child}`);
    expect(seen.status).toBe(200);
    // Parents do not see the other adults linked to the child.
    expect(seen.body.athlete.guardians).toBeUndefined();

    const unlinked = await as.coach.delete(`/api/athletes/${ids.child}/guardians/${ids.secondParent}`);
    expect(unlinked.status).toBe(200);
    expect(unlinked.body.athlete.guardians).toHaveLength(1);
    expect(countOf((await as.coach.get('/api/athletes')).body)).toBe(1);
    expect((await second.get(`/api/athletes/${ids.child}`)).status).toBe(403);
    expect((await as.coach.delete(`/api/athletes/${ids.child}/guardians/${ids.secondParent}`)).status).toBe(404);

    // Both are in the audit trail, by whom and which parent account; the refused second unlink is not.
    const trail = await as.admin.get(`/api/audit?athleteId=${ids.child}`);
    const links = (trail.body.events as { action: string; actorName: string; detail: Record<string, unknown> }[]).filter((e) =>
      e.action.startsWith('guardian.'),
    );
    expect(links.map((e) => [e.action, e.actorName, e.detail.guardian])).toEqual([
      ['guardian.unlink', 'Cole Coach', 'Sol Parent'],
      ['guardian.link', 'Cole Coach', 'Sol Parent'],
    ]);
  });

  it('asks for an invitation first when the e-mail is not a club member', async () => {
    const res = await as.admin.post(`/api/athletes/${ids.child}/guardians`).send({ email: 'stranger@example.test' });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('not_a_member');
    expect(res.body.error.fields.email).toMatch(/Invite them from People/);
  });

  it('links only parent accounts', async () => {
    const res = await as.admin.post(`/api/athletes/${ids.child}/guardians`).send({ email: 'tester@riverside.test' });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('not_a_parent');
    const links = await testDb.db.select().from(guardianLinks).where(eq(guardianLinks.athleteId, ids.child!));
    expect(links).toHaveLength(1);
  });
});

describe('CSV roster import', () => {
  const upload = (agent: Agent, csv: string | Buffer, commit?: boolean) => {
    const req = agent.post(`/api/athletes/import${commit === undefined ? '' : `?commit=${commit}`}`);
    return req.attach('file', Buffer.isBuffer(csv) ? csv : Buffer.from(csv, 'utf8'), { filename: 'roster.csv', contentType: 'text/csv' });
  };

  it('reports every line on a dry run and writes nothing', async () => {
    const before = await athleteCount(ids.club!);
    const csv = makeRosterCsv([
      { first_name: 'Ada', last_name: 'Brook' },
      { first_name: 'Ben', last_name: 'Brook', sex: 'male', racket_hand: 'left', take_off_leg: 'right', photo_consent: 'N' },
      { first_name: '', last_name: 'Brook', sex: 'x', date_of_birth: '2014/03/09', squad: 'Seniors', photo_consent: 'maybe' },
    ]);
    const res = await upload(as.coach, csv);
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ okCount: 2, errorCount: 1 });
    expect(res.body.rows[0]).toEqual({
      line: 2,
      ok: true,
      action: 'create',
      errors: {},
      values: expect.objectContaining({ first_name: 'Ada', sex: 'F' }),
      changes: expect.any(Array),
    });
    expect(res.body.rows[1].changes).toContain('photo consent: no');
    expect(res.body.rows[2]).toMatchObject({
      line: 4,
      ok: false,
      errors: {
        first_name: 'Enter the first name.',
        sex: expect.stringMatching(/F or M/),
        date_of_birth: expect.stringMatching(/YYYY-MM-DD/),
        squad: expect.stringMatching(/no squad called “Seniors”/),
        photo_consent: expect.stringMatching(/yes or no/),
      },
    });
    expect(await athleteCount(ids.club!)).toBe(before);
  });

  it('asks for a second look at a child older than the squad name says, without refusing the line', async () => {
    // Our choice: named only a full year past the squad's age (features/athletes/age-group.ts).
    const csv = makeRosterCsv([
      { first_name: 'Olly', last_name: 'Older', date_of_birth: bornYearsAgo(14), squad: 'Under-13' },
      { first_name: 'Tia', last_name: 'Thirteen', date_of_birth: bornYearsAgo(13), squad: 'Under-13' },
      { first_name: 'Una', last_name: 'Fourteen', date_of_birth: bornYearsAgo(14), squad: 'Under-15' },
    ]);
    const res = await upload(as.coach, csv);
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ okCount: 3, errorCount: 0 });
    expect(res.body.rows[0].checks).toEqual(['14 years old today, older than “Under-13” suggests: check the squad.']);
    expect(res.body.rows[1].checks).toBeUndefined();
    expect(res.body.rows[2].checks).toBeUndefined();
  });

  it('refuses to commit a file with errors and writes nothing', async () => {
    const before = await athleteCount(ids.club!);
    const csv = makeRosterCsv([
      { first_name: 'Cleo', last_name: 'Fenn' },
      { first_name: 'Dev', last_name: 'Fenn', date_of_birth: bornYearsAgo(3) },
    ]);
    const res = await upload(as.admin, csv, true);
    expect(res.status).toBe(400);
    expect(res.body.error).toMatchObject({ code: 'import_has_errors', message: '1 line needs attention; nothing was imported.' });
    expect(res.body).toMatchObject({ okCount: 1, errorCount: 1 });
    expect(res.body.rows[1].errors.date_of_birth).toMatch(/age of 3/);
    expect(await athleteCount(ids.club!)).toBe(before);
  });

  it('commits a clean file in one go: athletes, consents and guardian links', async () => {
    const before = await athleteCount(ids.club!);
    const csv = makeRosterCsv(
      [
        {
          first_name: 'Elin',
          last_name: 'Grove',
          sex: 'female',
          racket_hand: 'right',
          take_off_leg: 'left',
          squad: 'under-13',
          photo_consent: 'Y',
          email_summaries_consent: 'true',
          guardian_email: 'Second.Parent@riverside.test',
        },
        {
          first_name: 'Finn',
          last_name: 'Grove',
          sex: 'M',
          racket_hand: 'L',
          take_off_leg: 'R',
          squad: 'Under-15',
          photo_consent: 'no',
          email_summaries_consent: 'n',
        },
      ],
      ROSTER_HEADER_LINE.toUpperCase().replace('SQUAD', ' Squad '),
    );
    // The check says what each new line records before anything is written: the consents and the parent
    // account it links, by name.
    const checked = await upload(as.coach, csv);
    expect(checked.status).toBe(200);
    expect(checked.body.rows.map((r: { action: string; changes: string[] }) => [r.action, r.changes])).toEqual([
      [
        'create',
        [
          'screening and exercises consent: yes',
          'photo consent: yes',
          'e-mail summaries consent: yes',
          'consent answers dated today (no date in the file)',
          'parent account linked: Sol Parent (second.parent@riverside.test)',
        ],
      ],
      [
        'create',
        ['screening and exercises consent: yes', 'photo consent: no', 'e-mail summaries consent: no', 'consent answers dated today (no date in the file)'],
      ],
    ]);
    const res = await upload(as.coach, csv, true);
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ okCount: 2, errorCount: 0, created: 2 });
    expect(await athleteCount(ids.club!)).toBe(before + 2);

    const list = await as.coach.get('/api/athletes');
    const elin = list.body.athletes.find((a: { firstName: string }) => a.firstName === 'Elin');
    const finn = list.body.athletes.find((a: { firstName: string }) => a.firstName === 'Finn');
    expect(elin).toMatchObject({ squadName: 'Under-13', sex: 'female', consents: { photos: { granted: true }, emailSummaries: { granted: true } } });
    expect(finn).toMatchObject({
      squadName: 'Under-15',
      sex: 'male',
      racketHand: 'left',
      takeOffLeg: 'right',
      consents: { photos: { granted: false }, emailSummaries: { granted: false } },
    });
    const second = await signedInAgent(app, 'second.parent@riverside.test');
    expect((await second.get(`/api/athletes/${elin.id}`)).status).toBe(200);
    // The import's trail: Elin added, each consent with its answer, her parent account linked.
    const trail = await as.admin.get(`/api/audit?athleteId=${elin.id}`);
    const events = (trail.body.events as { subjectKind: string; action: string; actorName: string; detail: Record<string, unknown> }[]).map((e) => ({
      what: `${e.subjectKind}:${e.action}`,
      by: e.actorName,
      detail: e.detail,
    }));
    expect(events).toEqual(
      expect.arrayContaining([
        { what: 'athlete:create', by: 'Cole Coach', detail: { via: 'import' } },
        { what: 'consent:create', by: 'Cole Coach', detail: expect.objectContaining({ kind: 'photos', granted: true, via: 'import' }) },
        { what: 'consent:create', by: 'Cole Coach', detail: expect.objectContaining({ kind: 'email_summaries', granted: true, via: 'import' }) },
        { what: 'athlete:guardian.link', by: 'Cole Coach', detail: expect.objectContaining({ guardian: 'Sol Parent', via: 'import' }) },
      ]),
    );
    const history = await as.coach.get(`/api/athletes/${elin.id}/consents`);
    expect(history.body.consents.every((c: { recordedBy: string }) => c.recordedBy === 'Cole Coach')).toBe(true);
  });

  it('catches duplicates within the file; a child already in the club is an update, listed with its changes', async () => {
    const csv = makeRosterCsv([
      { first_name: 'Gus', last_name: 'Hale' },
      { first_name: 'gus ', last_name: 'HALE' },
      { first_name: 'Elin', last_name: 'Grove', email_summaries_consent: 'no', squad: 'Under-15' }, // imported by the previous test
      { first_name: 'Kit', last_name: 'Parentson', date_of_birth: '2013-05-14' }, // created by the fixture
    ]);
    const res = await upload(as.coach, csv);
    expect(res.status).toBe(200);
    expect(res.body.rows.map((r: { ok: boolean; action?: string }) => [r.ok, r.action ?? null])).toEqual([
      [true, 'create'],
      [false, null],
      [true, 'update'],
      [true, 'update'],
    ]);
    expect(res.body).toMatchObject({ okCount: 3, errorCount: 1, createCount: 1, updateCount: 2 });
    expect(res.body.rows[1].errors.row).toBe('Same name and date of birth as line 2.');
    expect(res.body.rows[2].changes).toEqual([
      'squad: Under-13 → Under-15',
      'e-mail summaries consent: yes → no',
      'consent answers dated today (no date in the file)',
    ]);
    // Kit's line matches what earlier tests left: an update that changes nothing.
    expect(res.body.rows[3].changes).toEqual([]);
    // The duplicate line keeps the whole file out.
    expect((await upload(as.coach, csv, true)).status).toBe(400);

    // A parent account the line names is a change only where it is not linked to the child yet: Kit's
    // own parent (linked by the fixture) is none, a second parent is listed by name.
    const kit = { first_name: 'Kit', last_name: 'Parentson', date_of_birth: '2013-05-14' };
    const ownParent = await upload(as.coach, makeRosterCsv([{ ...kit, guardian_email: 'parent@riverside.test' }]));
    expect(ownParent.body.rows[0]).toMatchObject({ action: 'update', changes: [] });
    const secondParent = await upload(as.coach, makeRosterCsv([{ ...kit, guardian_email: 'second.parent@riverside.test' }]));
    expect(secondParent.body.rows[0]).toMatchObject({ action: 'update', changes: ['parent account linked: Sol Parent (second.parent@riverside.test)'] });
  });

  it('updates athletes already in the club on commit: their record, a new consent decision, nothing duplicated', async () => {
    const before = await athleteCount(ids.club!);
    const csv = makeRosterCsv([
      { first_name: 'ELIN', last_name: 'grove', email_summaries_consent: 'no', squad: 'Under-15', racket_hand: 'L' },
      { first_name: 'Lena', last_name: 'Moss' },
    ]);
    const res = await upload(as.coach, csv, true);
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ created: 1, updated: 1, createCount: 1, updateCount: 1 });
    expect(await athleteCount(ids.club!)).toBe(before + 1);
    const list = await as.coach.get('/api/athletes');
    const elins = list.body.athletes.filter((a: { firstName: string }) => a.firstName === 'Elin');
    expect(elins).toHaveLength(1);
    expect(elins[0]).toMatchObject({ lastName: 'Grove', squadName: 'Under-15', racketHand: 'left', consents: { emailSummaries: { granted: false } } });
    const history = await as.coach.get(`/api/athletes/${elins[0].id}/consents`);
    // The earlier decision stays in the history; the new one is in force.
    expect(history.body.consents.filter((c: { kind: string }) => c.kind === 'email_summaries').map((c: { granted: boolean }) => c.granted)).toEqual([
      false,
      true,
    ]);
    // Importing the same file again changes nothing more and records no new decision.
    const again = await upload(
      as.coach,
      makeRosterCsv([{ first_name: 'Elin', last_name: 'Grove', email_summaries_consent: 'no', squad: 'Under-15', racket_hand: 'L' }]),
    );
    expect(again.body.rows[0]).toMatchObject({ action: 'update', changes: [] });
  });

  it('checks guardian e-mails against the club’s parent accounts', async () => {
    const csv = makeRosterCsv([
      // Checked even when another cell of the line is wrong, so one pass shows every problem.
      { first_name: 'Hana', sex: 'x', guardian_email: 'nobody@example.test' },
      { first_name: 'Ivo', guardian_email: 'physio@riverside.test' },
      { first_name: 'Jun', guardian_email: 'not-an-email' },
    ]);
    const res = await upload(as.coach, csv);
    expect(res.body.rows.map((r: { errors: { guardian_email?: string } }) => r.errors.guardian_email)).toEqual([
      expect.stringMatching(/invite them from People/),
      expect.stringMatching(/physiotherapist, not a parent/),
      'Enter a valid e-mail address.',
    ]);
    // Errors come in the order of the columns.
    expect(Object.keys(res.body.rows[0].errors)).toEqual(['sex', 'guardian_email']);
  });

  it.each([
    ['a missing column', 'first_name,last_name,date_of_birth,sex,racket_hand,take_off_leg,photo_consent,email_summaries_consent\n', /missing column: squad/],
    ['an unknown column', `${ROSTER_HEADER_LINE},shoe_size\nA,B\n`, /unknown column: shoe_size/],
    ['a header only', `${ROSTER_HEADER_LINE}\n`, /no athletes/],
    ['an empty file', ' ', /empty|CSV/],
    ['an unclosed quote', `${ROSTER_HEADER_LINE}\n"Ada,Brook\n`, /unclosed quote/],
  ])('refuses %s as a whole, with a clear message', async (_what, csv, message) => {
    const res = await upload(as.admin, csv);
    expect(res.status).toBe(400);
    expect(res.body.error.message).toMatch(message);
  });

  it('refuses a file that is not UTF-8 text, whatever its name', async () => {
    const png = Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0xff, 0xfe, 0x00, 0x00]);
    const res = await upload(as.admin, png);
    expect(res.status).toBe(400);
    expect(res.body.error.message).toMatch(/not a CSV text file/);
    const latin1 = Buffer.from(`${ROSTER_HEADER_LINE}\nJos\xe9,Brook,2014-01-01,M,R,L,Under-13,yes,no,\n`, 'latin1');
    expect((await upload(as.admin, latin1)).body.error.message).toMatch(/UTF-8/);
  });

  it('accepts a byte-order mark and Windows line ends', async () => {
    const csv = '\ufeff' + makeRosterCsv([{ first_name: 'Kaia', last_name: 'Lind' }]).replace(/\n/g, '\r\n');
    const res = await upload(as.admin, csv);
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ okCount: 1, errorCount: 0 });
  });

  it('refuses a file over 1 MB with 413', async () => {
    const big = makeRosterCsv([{}]) + 'x'.repeat(1024 * 1024 + 10);
    const res = await upload(as.admin, big);
    expect(res.status).toBe(413);
    expect(res.body.error.message).toMatch(/larger than 1 MB/);
  });

  it('asks for a file when none is sent, and for the right field', async () => {
    expect((await as.admin.post('/api/athletes/import').send({})).body.error.message).toBe('Choose a CSV file to import.');
    const wrongField = await as.admin.post('/api/athletes/import').attach('roster', Buffer.from(makeRosterCsv([{}])), 'roster.csv');
    expect(wrongField.status).toBe(400);
    expect(wrongField.body.error.message).toMatch(/“file” field/);
    expect((await upload(as.admin, makeRosterCsv([{}])).query({ commit: 'yes' })).status).toBe(400);
  });
});

describe('photo periods beside the consent history', () => {
  // our choice: a family reads "deleted 30 days later", not "after the club's waiting period".
  it("gives the club's photo periods with the history, to the parent too, and follows the club's settings", async () => {
    const read = async (agent: Agent) => (await agent.get(`/api/athletes/${ids.child}/consents`)).body.photoTerms;
    // The defaults until an admin saves the club's care settings.
    expect(await read(as.parent)).toEqual({ graceDays: 30, retentionMonths: 24 });
    const saved = await as.admin
      .put('/api/care-settings')
      .send({ autoReleaseDays: null, photoGraceDays: 14, photoRetentionMonths: 12, familyPhotos: false, testersReadTeamNotes: false });
    expect(saved.status).toBe(200);
    expect(await read(as.parent)).toEqual({ graceDays: 14, retentionMonths: 12 });
    expect(await read(as.coach)).toEqual({ graceDays: 14, retentionMonths: 12 });
  });
});
