// Consent to take part: no screen is saved, uploaded, measured or submitted for an athlete whose family
// has not agreed to screening and corrective exercises (withdrawn, or no decision on record), and such an
// athlete is on no exercise of the training sheet. What was saved before stays. All rules here are ours
// (`our choice`): a minor is not screened on an assumption.
import { and, eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { assessments, auditEvents, consents } from '@/db/schema';
import type { AssessmentDetail, RoundDetail } from '@/features/screening/contract';
import type { TrainingSheet } from '@/features/training/sheet';
import { makeAthlete, makeClub, makeSquad, makeTestApp, makeUser, signedInAgent } from '../fixtures/builders';
import { memoryStorage, phonePhotoWithExif } from '../fixtures/photos';
import { makeRosterCsv } from '../fixtures/roster';
import { makeDraft, valgusSquat } from '../fixtures/screening';
import { createTestDb, type TestDb } from '../fixtures/test-db';

let testDb: TestDb;
let app: ReturnType<typeof makeTestApp>['app'];
type Agent = Awaited<ReturnType<typeof signedInAgent>>;
const as = {} as Record<'tester' | 'coach' | 'parent', Agent>;
const ids = {} as Record<'club' | 'squad' | 'nia' | 'omar', string>;
let round: RoundDetail;
const today = () => new Date().toISOString().slice(0, 10);
const assessmentOf = (athleteId: string) => round.athletes.find((a) => a.athleteId === athleteId)!.assessmentId;

beforeAll(async () => {
  testDb = await createTestDb();
  ({ app } = makeTestApp(testDb.db, { storage: memoryStorage() }));
  const db = testDb.db;
  const club = await makeClub(db, 'Riverside');
  ids.club = club.id;
  ids.squad = (await makeSquad(db, club.id, 'Under-13')).id;
  await makeUser(db, { email: 'tester@riverside.test', clubId: club.id, role: 'tester' });
  await makeUser(db, { email: 'coach@riverside.test', clubId: club.id, role: 'head_coach', displayName: 'Cole Coach' });
  const parent = await makeUser(db, { email: 'parent@riverside.test', clubId: club.id, role: 'parent', displayName: 'Pia Parent' });
  // Nia: no decision about taking part on record. Omar: the family agreed (and withdraws below).
  ids.nia = (await makeAthlete(db, { clubId: club.id, squadId: ids.squad, firstName: 'Nia', lastName: 'Abel', screeningConsent: null })).id;
  ids.omar = (await makeAthlete(db, { clubId: club.id, squadId: ids.squad, firstName: 'Omar', lastName: 'Bell', sex: 'male', guardianUserId: parent.id })).id;
  as.tester = await signedInAgent(app, 'tester@riverside.test');
  as.coach = await signedInAgent(app, 'coach@riverside.test');
  as.parent = await signedInAgent(app, 'parent@riverside.test');
  const res = await as.tester.post('/api/rounds').send({ squadId: ids.squad, name: 'Pre-season', screenedOn: today() });
  expect(res.status).toBe(201);
  round = res.body;
});

afterAll(async () => {
  await testDb.drop();
});

async function draftRow(assessmentId: string) {
  const [row] = await testDb.db.select().from(assessments).where(eq(assessments.id, assessmentId));
  return row!;
}

describe('an athlete with no decision about taking part on record', () => {
  it('is in the round, marked, and nothing of the screen is saved, uploaded or submitted', async () => {
    expect(round.athletes.map((a) => [a.firstName, a.screeningConsent])).toEqual([
      ['Nia', false],
      ['Omar', true],
    ]);
    const id = assessmentOf(ids.nia);
    const detail = (await as.tester.get(`/api/assessments/${id}`)).body as AssessmentDetail;
    expect(detail.athlete.screeningConsent).toBe(false);

    const save = await as.tester.put(`/api/assessments/${id}`).send({ draftVersion: 0, draft: makeDraft({ tasks: { 'two-leg-squat': valgusSquat() } }) });
    expect(save.status).toBe(403);
    expect(save.body.error.code).toBe('no_screening_consent');
    expect(save.body.error.message).toMatch(/Nia Abel's family has not agreed to screening/);
    const photo = await as.tester
      .post(`/api/assessments/${id}/photos`)
      .field('task', 'two-leg-squat')
      .field('view', 'front')
      .attach('photo', await phonePhotoWithExif(), { filename: 'IMG_0001.jpg', contentType: 'image/jpeg' });
    expect(photo.status).toBe(403);
    expect(photo.body.error.code).toBe('no_screening_consent');
    const submit = await as.tester.post(`/api/assessments/${id}/submit`).send({});
    expect(submit.status).toBe(403);
    expect(submit.body.error.code).toBe('no_screening_consent');

    const row = await draftRow(id);
    expect([row.status, row.draftVersion]).toEqual(['not_started', 0]);
    // Not counted as work left in the round: one to start (Omar), not two.
    const listed = (await as.tester.get('/api/rounds')).body.rounds.find((r: { id: string }) => r.id === round.round.id);
    expect(listed.counts).toEqual({ not_started: 1, in_progress: 0, submitted: 0 });
  });

  it('can be screened once a head coach records the family’s yes', async () => {
    const yes = await as.coach.post(`/api/athletes/${ids.nia}/consents`).send({ kind: 'screening', granted: true, decidedOn: today() });
    expect(yes.status).toBe(201);
    expect(yes.body.athlete.consents.screening).toEqual({ granted: true, decidedOn: today() });
    const id = assessmentOf(ids.nia);
    const save = await as.tester.put(`/api/assessments/${id}`).send({ draftVersion: 0, draft: makeDraft() });
    expect(save.status).toBe(200);
    expect(save.body.draftVersion).toBe(1);
  });
});

describe('a family that withdraws from taking part', () => {
  let photoId: string;
  let resultVersion: number;

  it('before: Omar is screened with a photo and is on the training sheet', async () => {
    const id = assessmentOf(ids.omar);
    expect(
      (await as.tester.put(`/api/assessments/${id}`).send({ draftVersion: 0, draft: makeDraft({ tasks: { 'two-leg-squat': valgusSquat() } }) })).status,
    ).toBe(200);
    const photo = await as.tester
      .post(`/api/assessments/${id}/photos`)
      .field('task', 'two-leg-squat')
      .field('view', 'front')
      .attach('photo', await phonePhotoWithExif(), { filename: 'IMG_0002.jpg', contentType: 'image/jpeg' });
    expect(photo.status).toBe(201);
    photoId = photo.body.id;
    const submitted = await as.tester.post(`/api/assessments/${id}/submit`).send({});
    expect(submitted.status).toBe(200);
    resultVersion = submitted.body.version;
    const sheet = (await as.coach.get(`/api/squads/${ids.squad}/training-sheet`)).body as TrainingSheet;
    expect(sheet.athletes.find((a) => a.id === ids.omar)?.state).toBe('plan');
    expect(sheet.exercises.some((e) => e.entries.some((x) => x.athleteId === ids.omar))).toBe(true);
  });

  it('the parent stops it in the app: recorded as theirs, dated today and audited', async () => {
    const res = await as.parent.post(`/api/athletes/${ids.omar}/consents/own`).send({ kind: 'screening', granted: false });
    expect(res.status).toBe(200);
    expect(res.body.changed).toBe(true);
    expect(res.body.athlete.consents.screening).toEqual({ granted: false, decidedOn: today() });
    const trail = await testDb.db
      .select()
      .from(auditEvents)
      .where(and(eq(auditEvents.athleteId, ids.omar), eq(auditEvents.subjectKind, 'consent')));
    expect(trail.map((t) => [t.action, t.detail])).toEqual([['withdraw', { kind: 'screening', granted: false, via: 'family page' }]]);
    // The family page says it first.
    const family = await as.parent.get(`/api/athletes/${ids.omar}/summary`);
    expect(family.status).toBe(200);
    expect(family.body.takingPart).toEqual({ granted: false, decidedOn: today() });
  });

  it('after: the result stays as it was; nothing new is saved, measured or submitted; the sheet leaves Omar off', async () => {
    const id = assessmentOf(ids.omar);
    const before = await draftRow(id);
    const result = await as.tester.get(`/api/assessments/${id}`);
    expect(result.status).toBe(200);
    expect(result.body.result.version).toBe(resultVersion);

    const save = await as.tester.put(`/api/assessments/${id}`).send({ draftVersion: before.draftVersion, draft: makeDraft() });
    expect(save.status).toBe(403);
    expect(save.body.error.code).toBe('no_screening_consent');
    expect((await as.tester.post(`/api/assessments/${id}/submit`).send({})).status).toBe(403);
    const measured = await as.tester.put(`/api/measuring/photos/${photoId}/landmarks`).send({ landmarks: {} });
    expect(measured.status).toBe(403);
    expect(measured.body.error.code).toBe('no_screening_consent');
    const queue = await as.tester.get('/api/measuring/queue');
    expect(JSON.stringify(queue.body)).not.toContain(photoId);

    const after = await draftRow(id);
    expect([after.status, after.draftVersion]).toEqual(['submitted', before.draftVersion]);
    expect((await as.tester.get(`/api/assessments/${id}`)).body.result.version).toBe(resultVersion);

    const sheet = (await as.coach.get(`/api/squads/${ids.squad}/training-sheet`)).body as TrainingSheet;
    expect(sheet.athletes.find((a) => a.id === ids.omar)).toMatchObject({ state: 'consent-refused', exerciseCount: 0, rescreenDue: false });
    expect(sheet.exercises.some((e) => e.entries.some((x) => x.athleteId === ids.omar))).toBe(false);
    // Nobody is recorded as doing corrective exercises the family said no to; nothing of the session saved.
    const session = await as.coach.post(`/api/squads/${ids.squad}/training-sessions`).send({ heldOn: today(), athleteIds: [ids.nia, ids.omar], note: '' });
    expect(session.status).toBe(400);
    expect(session.body.error.fields.athleteIds).toMatch(/for Omar Bell: leave them out/);
    expect((await as.coach.get(`/api/squads/${ids.squad}/training-sessions`)).body.sessions).toEqual([]);
    expect((await as.coach.post(`/api/squads/${ids.squad}/training-sessions`).send({ heldOn: today(), athleteIds: [ids.nia], note: '' })).status).toBe(201);
    const trends = await as.coach.get(`/api/squads/${ids.squad}/trends`);
    expect(trends.body.athletes.find((a: { id: string }) => a.id === ids.omar)).toMatchObject({
      takingPart: false,
      screeningRefused: true,
      rescreenDue: false,
    });
    expect(trends.body.athletes.find((a: { id: string }) => a.id === ids.nia)).toMatchObject({ takingPart: true, screeningRefused: false });
    const again = (await as.tester.get(`/api/rounds/${round.round.id}`)).body as RoundDetail;
    expect(again.athletes.find((a) => a.athleteId === ids.omar)?.screeningConsent).toBe(false);
  });
});

describe('the roster import’s optional screening_consent column', () => {
  const upload = (csv: string, commit = false) =>
    as.coach
      .post(`/api/athletes/import${commit ? '?commit=true' : ''}`)
      .attach('file', Buffer.from(csv, 'utf8'), { filename: 'roster.csv', contentType: 'text/csv' });
  const screeningRows = async (athleteId: string) =>
    (await testDb.db.select().from(consents).where(eq(consents.athleteId, athleteId))).filter((c) => c.kind === 'screening');

  it('records yes or no where given and nothing where the cell is empty, saying so before anything is written', async () => {
    const csv = makeRosterCsv([
      { first_name: 'Rua', last_name: 'Cole', screening_consent: 'yes' },
      { first_name: 'Sol', last_name: 'Cole', screening_consent: '' },
      { first_name: 'Nia', last_name: 'Abel', date_of_birth: '2013-05-14', screening_consent: 'no' },
    ]);
    const dry = await upload(csv);
    expect(dry.status).toBe(200);
    const rows = dry.body.rows as { action: string; changes: string[] }[];
    expect(rows.map((r) => r.action)).toEqual(['create', 'create', 'update']);
    expect(rows[0]!.changes).toContain('screening and exercises consent: yes');
    expect(rows[1]!.changes).toContain('screening and exercises consent: not recorded (not screened until it is)');
    expect(rows[2]!.changes).toContain('screening and exercises consent: yes → no');
    const done = await upload(csv, true);
    expect(done.status).toBe(201);
    const list = (await as.coach.get('/api/athletes')).body.athletes as { id: string; firstName: string; consents: { screening: unknown } }[];
    const of = (name: string) => list.find((a) => a.firstName === name)!;
    expect(of('Rua').consents.screening).toEqual({ granted: true, decidedOn: today() });
    expect(of('Sol').consents.screening).toBeNull();
    expect(await screeningRows(of('Sol').id)).toEqual([]);
    expect(of('Nia').consents.screening).toEqual({ granted: false, decidedOn: today() });
  });

  it('leaves the decision in force when the column is left out of the file', async () => {
    const header = 'first_name,last_name,date_of_birth,sex,racket_hand,take_off_leg,squad,photo_consent,email_summaries_consent';
    const csv = `${header}\nRua,Cole,${(await as.coach.get('/api/athletes')).body.athletes.find((a: { firstName: string }) => a.firstName === 'Rua').dateOfBirth},F,R,L,Under-13,yes,no\n`;
    const dry = await upload(csv);
    expect(dry.status).toBe(200);
    expect(dry.body.rows[0]).toMatchObject({ action: 'update', changes: [] });
  });
});

// The day a family gave their answers on paper is the day on record (our choice): an import in December
// of forms signed in September must not date them December, and a form older than a decision the family
// made since (a withdrawal in the app, say) must not undo it.
describe('the roster import’s optional consents_decided_on column', () => {
  const upload = (csv: string, commit = false) =>
    as.coach
      .post(`/api/athletes/import${commit ? '?commit=true' : ''}`)
      .attach('file', Buffer.from(csv, 'utf8'), { filename: 'roster.csv', contentType: 'text/csv' });
  const daysAgo = (n: number) => new Date(Date.now() - n * 24 * 3600 * 1000).toISOString().slice(0, 10);
  const athleteNamed = async (firstName: string) =>
    ((await as.coach.get('/api/athletes')).body.athletes as { id: string; firstName: string; dateOfBirth: string; consents: Record<string, unknown> }[]).find(
      (a) => a.firstName === firstName,
    )!;

  it('dates every answer of a new athlete’s line by the file’s day, in the report, the record and the trail', async () => {
    const signed = daysAgo(40);
    const csv = makeRosterCsv([
      { first_name: 'Tove', last_name: 'Dane', photo_consent: 'yes', email_summaries_consent: 'no', screening_consent: 'yes', consents_decided_on: signed },
    ]);
    const dry = await upload(csv);
    expect(dry.status).toBe(200);
    expect(dry.body.rows[0].changes).toContain(`consent answers dated ${signed} (from the file)`);
    expect((await upload(csv, true)).status).toBe(201);
    const tove = await athleteNamed('Tove');
    expect(tove.consents).toEqual({
      screening: { granted: true, decidedOn: signed },
      photos: { granted: true, decidedOn: signed },
      emailSummaries: { granted: false, decidedOn: signed },
    });
    const trail = await testDb.db
      .select()
      .from(auditEvents)
      .where(and(eq(auditEvents.athleteId, tove.id), eq(auditEvents.subjectKind, 'consent')));
    expect(trail.map((e) => (e.detail as { decidedOn: string }).decidedOn)).toEqual([signed, signed, signed]);
  });

  it('dates them today when the cell is empty, and says so', async () => {
    const csv = makeRosterCsv([{ first_name: 'Ulla', last_name: 'Dane', consents_decided_on: '' }]);
    const dry = await upload(csv);
    expect(dry.body.rows[0].changes).toContain('consent answers dated today (no date in the file)');
    expect((await upload(csv, true)).status).toBe(201);
    expect((await athleteNamed('Ulla')).consents.photos).toEqual({ granted: true, decidedOn: today() });
  });

  it('refuses a day in the future, before the date of birth or not in the calendar, and writes nothing', async () => {
    const csv = makeRosterCsv([
      { first_name: 'Vera', last_name: 'Dane', consents_decided_on: daysAgo(-5) },
      { first_name: 'Wim', last_name: 'Dane', date_of_birth: '2014-06-01', consents_decided_on: '2014-05-31' },
      { first_name: 'Xan', last_name: 'Dane', consents_decided_on: '2026-02-30' },
    ]);
    const res = await upload(csv, true);
    expect(res.status).toBe(400);
    expect(res.body.rows.map((r: { errors: Record<string, string> }) => r.errors.consents_decided_on)).toEqual([
      'The decision cannot be dated in the future.',
      'The decisions are dated before the date of birth.',
      'This day does not exist in the calendar.',
    ]);
    expect(await athleteNamed('Vera')).toBeUndefined();
  });

  it('refuses an answer dated before a different decision on record, and takes it dated after', async () => {
    // The family withdrew photo consent ten days ago; a form signed forty days ago says yes.
    expect((await upload(makeRosterCsv([{ first_name: 'Yara', last_name: 'Dane', consents_decided_on: daysAgo(60) }]), true)).status).toBe(201);
    const yara = await athleteNamed('Yara');
    const withdrawn = daysAgo(10);
    expect((await as.coach.post(`/api/athletes/${yara.id}/consents`).send({ kind: 'photos', granted: false, decidedOn: withdrawn })).status).toBe(201);
    const line = { first_name: 'Yara', last_name: 'Dane', date_of_birth: yara.dateOfBirth, photo_consent: 'yes' };
    const old = await upload(makeRosterCsv([{ ...line, consents_decided_on: daysAgo(40) }]), true);
    expect(old.status).toBe(400);
    expect(old.body.rows[0].errors.consents_decided_on).toBe(
      `A later decision is on record for the photo consent (no, decided ${withdrawn}), after ${daysAgo(40)}: it stands. Write the answer on record in this line, or, if the family has decided again since, the day they did.`,
    );
    expect((await athleteNamed('Yara')).consents.photos).toEqual({ granted: false, decidedOn: withdrawn });
    // The same answer as the one on record, on an old form, changes nothing and is no error.
    const same = await upload(makeRosterCsv([{ ...line, photo_consent: 'no', consents_decided_on: daysAgo(40) }]));
    expect(same.body.rows[0]).toMatchObject({ ok: true, changes: [] });
    // The same "yes" with no date in the file (an old spreadsheet imported again): a "no" is not undone
    // without the day the family agreed again.
    const undated = await upload(makeRosterCsv([{ ...line, consents_decided_on: '' }]), true);
    expect(undated.status).toBe(400);
    expect(undated.body.rows[0].errors.consents_decided_on).toBe(
      `The family's “no” to the photo consent (decided ${withdrawn}) would become a yes. Write the day they agreed again, after ${withdrawn}, in this column, or keep “no” in the line; a yes can also be recorded on the athlete's page.`,
    );
    expect((await athleteNamed('Yara')).consents.photos).toEqual({ granted: false, decidedOn: withdrawn });
    const since = daysAgo(2);
    const again = await upload(makeRosterCsv([{ ...line, consents_decided_on: since }]), true);
    expect(again.status).toBe(201);
    expect((await athleteNamed('Yara')).consents.photos).toEqual({ granted: true, decidedOn: since });
  });
});
