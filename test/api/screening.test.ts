import { eq } from 'drizzle-orm';
import supertest from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { assessmentResults, assessments, athletes } from '@/db/schema';
import type { AssessmentDetail, AthleteAssessmentItem, ResultView, RoundDetail } from '@/features/screening/contract';
import {
  EngineInputError,
  evaluateAssessment,
  EXERCISES,
  loadingContextOf,
  plannedFromLibrary,
  type AssessmentResult,
  type Prescription,
} from '@/features/screening/engine';
import { setsText } from '@/features/screening/labels';
import { makeAthlete, makeClub, makeSquad, makeTestApp, makeUser, signedInAgent } from '../fixtures/builders';
import { memoryStorage, phonePhotoWithExif } from '../fixtures/photos';
import { makeDraft, screeningAppWith, sessionCookie, valgusSquat } from '../fixtures/screening';
import { createTestDb, type TestDb } from '../fixtures/test-db';

let testDb: TestDb;
let app: ReturnType<typeof makeTestApp>['app'];
const storage = memoryStorage();
const ids = {} as Record<'club' | 'squad' | 'otherSquad' | 'ava' | 'zed' | 'mia', string>;
type Agent = Awaited<ReturnType<typeof signedInAgent>>;
let tester: Agent;

beforeAll(async () => {
  testDb = await createTestDb();
  ({ app } = makeTestApp(testDb.db, { storage }));
  const db = testDb.db;
  const club = await makeClub(db, 'Riverside');
  const other = await makeClub(db, 'Hillside');
  ids.club = club.id;
  const squad = await makeSquad(db, club.id, 'Under-13');
  ids.squad = squad.id;
  ids.otherSquad = (await makeSquad(db, other.id, 'Juniors')).id;
  await makeUser(db, { email: 'tester@riverside.test', clubId: club.id, role: 'tester', displayName: 'Tess Tester' });
  await makeUser(db, { email: 'coach@riverside.test', clubId: club.id, role: 'head_coach', displayName: 'Cody Coach' });
  await makeUser(db, { email: 'physio@riverside.test', clubId: club.id, role: 'physio' });
  const parent = await makeUser(db, { email: 'parent@riverside.test', clubId: club.id, role: 'parent' });
  await makeUser(db, { email: 'tester@hillside.test', clubId: other.id, role: 'tester' });
  ids.ava = (await makeAthlete(db, { clubId: club.id, squadId: squad.id, firstName: 'Ava', lastName: 'Brook', guardianUserId: parent.id })).id;
  ids.zed = (await makeAthlete(db, { clubId: club.id, squadId: squad.id, firstName: 'Zed', lastName: 'Adams', sex: 'male', photoConsent: false })).id;
  ids.mia = (await makeAthlete(db, { clubId: club.id, squadId: squad.id, firstName: 'Mia', lastName: 'Clark' })).id;
  await makeAthlete(db, { clubId: club.id, squadId: squad.id, firstName: 'Gone', lastName: 'Aaron', archivedAt: new Date() });
  await makeAthlete(db, { clubId: other.id, squadId: ids.otherSquad, firstName: 'Hil', lastName: 'Side' });
  tester = await signedInAgent(app, 'tester@riverside.test');
});

afterAll(async () => {
  await testDb.drop();
});

async function openRound(name = 'Pre-season', screenedOn = '2026-09-14'): Promise<RoundDetail> {
  const res = await tester.post('/api/rounds').send({ squadId: ids.squad, name, screenedOn });
  expect(res.status).toBe(201);
  return res.body;
}

const assessmentOf = (round: RoundDetail, athleteId: string) => round.athletes.find((a) => a.athleteId === athleteId)!.assessmentId;

/** The draft version the server holds now: what a tester who just looked at it names in a submit. */
async function versionOf(id: string): Promise<number> {
  return ((await tester.get(`/api/assessments/${id}`)).body as AssessmentDetail).draftVersion;
}

async function saveDraft(id: string, draftVersion: number, draft = makeDraft()) {
  const res = await tester.put(`/api/assessments/${id}`).send({ draftVersion, draft });
  expect(res.status).toBe(200);
  return res.body as { draftVersion: number; status: string };
}

describe('a whole screening: round, draft, photo, submit, result, re-submit', () => {
  it('keeps every version and shows the newest', async () => {
    // Open the round: one not-started assessment per athlete on the roster, by last name.
    const round = await openRound();
    expect(round.round).toMatchObject({
      squadId: ids.squad,
      squadName: 'Under-13',
      name: 'Pre-season',
      screenedOn: '2026-09-14',
      counts: { not_started: 3, in_progress: 0, submitted: 0 },
    });
    expect(round.athletes.map((a) => a.lastName)).toEqual(['Adams', 'Brook', 'Clark']);
    expect(round.athletes.map((a) => [a.status, a.photoConsent, a.flagCount])).toEqual([
      ['not_started', false, null],
      ['not_started', true, null],
      ['not_started', true, null],
    ]);
    const id = assessmentOf(round, ids.ava);

    const fresh = await tester.get(`/api/assessments/${id}`);
    expect(fresh.status).toBe(200);
    expect(fresh.body).toMatchObject({
      status: 'not_started',
      draftVersion: 0,
      draft: { body: {}, tasks: {} },
      photos: [],
      result: null,
      athlete: { id: ids.ava, firstName: 'Ava', photoConsent: true },
    });

    // Draft: body first, then the squat with its photo and landmarks.
    expect(await saveDraft(id, 0, { body: { statureCm: 152 }, tasks: {}, step: 'body' })).toEqual({ draftVersion: 1, status: 'in_progress' });
    const photo = await tester
      .post(`/api/assessments/${id}/photos`)
      .field('task', 'two-leg-squat')
      .field('view', 'front')
      .attach('photo', await phonePhotoWithExif(), { filename: 'IMG_0001.jpg', contentType: 'image/jpeg' });
    expect(photo.status).toBe(201);
    expect(photo.body).toMatchObject({ taskId: 'two-leg-squat', view: 'front', width: 1600, height: 800, url: `/api/photos/${photo.body.id}?size=full` });
    expect(await saveDraft(id, 1)).toEqual({ draftVersion: 2, status: 'in_progress' });

    // Submit: the engine runs on the saved draft.
    const submitted = await tester.post(`/api/assessments/${id}/submit`).send({ draftVersion: await versionOf(id) });
    expect(submitted.status).toBe(200);
    const first = submitted.body as ResultView;
    expect(first).toMatchObject({ version: 1, engineVersion: expect.any(String), createdByName: 'Tess Tester', adjustment: null, history: [] });
    const patterns = first.result.flags.map((f) => `${f.pattern}/${f.side}`);
    expect(patterns).toContain('dynamic-knee-valgus/right');
    expect(patterns).toContain('limited-ankle-dorsiflexion/right');
    expect(first.result.plan.rescreenDate).toBe('2026-10-26');
    // The skipped drop landing was not sent to the engine.
    const [stored] = await testDb.db.select().from(assessmentResults).where(eq(assessmentResults.assessmentId, id));
    expect(Object.keys(stored!.input.tasks).sort()).toEqual(['knee-to-wall-left', 'knee-to-wall-right', 'two-leg-squat']);
    expect(stored!.input.athlete.ageYears).toBeCloseTo(13.34, 1); // born 2013-05-14, screened 2026-09-14

    const detail = (await tester.get(`/api/assessments/${id}`)).body as AssessmentDetail;
    expect(detail.status).toBe('submitted');
    expect(detail.result?.id).toBe(first.id);
    expect(detail.photos.map((p) => p.id)).toEqual([photo.body.id]);

    const afterSubmit = (await tester.get(`/api/rounds/${round.round.id}`)).body as RoundDetail;
    expect(afterSubmit.round.counts).toEqual({ not_started: 2, in_progress: 0, submitted: 1 });
    expect(afterSubmit.athletes.find((a) => a.athleteId === ids.ava)!.flagCount).toBe(first.result.flags.length);

    // An edit re-opens it; the result stays until it is submitted again.
    const cleaner = makeDraft({
      tasks: { 'two-leg-squat': valgusSquat({ criteria: [], landmarks: undefined }), 'knee-to-wall-left': { criteria: [], distanceCm: 11 } },
    });
    expect(await saveDraft(id, 2, cleaner)).toEqual({ draftVersion: 3, status: 'in_progress' });
    const reopened = (await tester.get(`/api/assessments/${id}`)).body as AssessmentDetail;
    expect(reopened.status).toBe('in_progress');
    expect(reopened.result?.version).toBe(1);

    const again = await tester.post(`/api/assessments/${id}/submit`).send({ draftVersion: await versionOf(id) });
    expect(again.status).toBe(200);
    expect(again.body).toMatchObject({ version: 2, history: [{ id: first.id, version: 1 }] });
    expect((again.body as ResultView).result.flags.some((f) => f.pattern === 'dynamic-knee-valgus')).toBe(false);
    const rows = await testDb.db.select().from(assessmentResults).where(eq(assessmentResults.assessmentId, id));
    expect(rows.map((r) => [r.version, r.isCurrent]).sort()).toEqual([
      [1, false],
      [2, true],
    ]);

    // The athlete's history lists it with the current flags.
    const history = await tester.get(`/api/athletes/${ids.ava}/assessments`);
    expect(history.status).toBe(200);
    const item = (history.body.assessments as AthleteAssessmentItem[]).find((a) => a.assessmentId === id)!;
    expect(item).toMatchObject({ roundName: 'Pre-season', status: 'submitted', result: { version: 2, flags: (again.body as ResultView).result.flags } });
  });

  it('records a plan adjustment as the tester, beside the engine plan', async () => {
    const round = await openRound('Plan check', '2026-09-20');
    const id = assessmentOf(round, ids.mia);
    await saveDraft(id, 0);
    const result = (await tester.post(`/api/assessments/${id}/submit`).send({ draftVersion: await versionOf(id) })).body as ResultView;
    const [keep] = result.result.plan.exercises;
    const extra = EXERCISES.find((e) => !result.result.plan.exercises.some((p) => p.id === e.id))!;
    // An exercise added from the library takes the limits the engine applied to this athlete.
    const added = plannedFromLibrary(extra, loadingContextOf(result.result), 2);
    const exercises = [
      { ...keep!, prescription: { ...keep!.prescription, sets: { min: 3, max: 3 } } },
      { id: extra.id, prescription: added.prescription },
    ];
    const res = await tester
      .put(`/api/assessments/${id}/plan`)
      .send({ exercises, note: 'Only two this block', basedOn: { resultVersion: result.version, adjustedAt: null } });
    expect(res.status).toBe(200);
    const view = res.body as ResultView;
    expect(view.adjustment).toMatchObject({ note: 'Only two this block', createdByName: 'Tess Tester' });
    expect(view.adjustment!.exercises.map((e) => [e.id, e.order, e.prescription.sets.min])).toEqual([
      [keep!.id, 1, 3],
      [extra.id, 2, added.prescription.sets.min],
    ]);
    // The words come from the library, not from the request.
    expect(view.adjustment!.exercises[1]!.name).toBe(extra.name);
    expect(view.result.plan).toEqual(result.result.plan);

    const bad = await tester
      .put(`/api/assessments/${id}/plan`)
      .send({ exercises: [{ id: 'made-up', prescription: {} }], basedOn: { resultVersion: 1, adjustedAt: view.adjustment!.createdAt } });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.fields)).toEqual(expect.arrayContaining(['exercises[0].id']));
    const none = await tester.put(`/api/assessments/${id}/plan`).send({ exercises: [], basedOn: { resultVersion: 1, adjustedAt: view.adjustment!.createdAt } });
    expect(none.status).toBe(400);

    // Tempo, the load's words and the "what changed" lines are the server's, whatever the request says;
    // the change line is worked out from the engine's plan.
    const basedOn = { resultVersion: 1, adjustedAt: view.adjustment!.createdAt };
    const load = keep!.prescription.load;
    const fewer = keep!.prescription.sets.max === 1 ? { min: 2, max: 2 } : { min: 1, max: 1 };
    const forged = {
      ...keep!,
      prescription: {
        ...keep!.prescription,
        sets: fewer,
        tempo: 'as fast as you can',
        load: load.kind === 'bodyweight' ? { ...load, note: 'hold 30 kg dumbbells' } : load,
      },
      adjustments: ['Approved by the physiotherapist.'],
    };
    const words = await tester.put(`/api/assessments/${id}/plan`).send({ exercises: [forged], basedOn });
    expect(words.status, JSON.stringify(words.body)).toBe(200);
    const stored = (words.body as ResultView).adjustment!.exercises[0]!;
    expect(stored.prescription.tempo).toBe(keep!.prescription.tempo);
    expect(stored.prescription.load).toEqual(keep!.prescription.load);
    expect(stored.adjustments).toEqual([...keep!.adjustments, `Changed by the tester: ${setsText(fewer)} instead of ${setsText(keep!.prescription.sets)}.`]);
  });

  it('refuses a submit into a round planned for a later day (409), keeping the draft', async () => {
    const ahead = new Date(Date.now() + 30 * 24 * 3600 * 1000).toISOString().slice(0, 10);
    const round = await openRound('Planned ahead', ahead);
    const id = assessmentOf(round, ids.mia);
    await saveDraft(id, 0);
    const res = await tester.post(`/api/assessments/${id}/submit`).send({ draftVersion: await versionOf(id) });
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('round_not_yet');
    expect(res.body.error.message).toMatch(/its screens can be submitted from that day\. The draft is kept/);
    const detail = (await tester.get(`/api/assessments/${id}`)).body;
    expect(detail).toMatchObject({ status: 'in_progress', result: null });
    expect(detail.draft.tasks['two-leg-squat']).toBeDefined();
    // Tomorrow is allowed: a phone's day may already be tomorrow in UTC terms.
    const tomorrow = new Date(Date.now() + 24 * 3600 * 1000).toISOString().slice(0, 10);
    const next = await openRound('Tomorrow', tomorrow);
    const nid = assessmentOf(next, ids.mia);
    await saveDraft(nid, 0);
    expect((await tester.post(`/api/assessments/${nid}/submit`).send({ draftVersion: await versionOf(nid) })).status).toBe(200);
  });

  it('refuses a kg range whose "from" is above its "to", and a load of another kind than the plan\'s', async () => {
    const round = await openRound('Kg order', '2026-09-21');
    const id = assessmentOf(round, ids.mia);
    await saveDraft(id, 0, makeDraft({ oneRepMaxKg: 40 }));
    const result = (await tester.post(`/api/assessments/${id}/submit`).send({ draftVersion: await versionOf(id) })).body as ResultView;
    const basedOn = { resultVersion: result.version, adjustedAt: null };
    const loaded = result.result.plan.exercises.find((e) => e.prescription.load.kind === 'percent-1rm' && e.prescription.load.kg);
    expect(loaded, 'the fixture plans a loaded exercise with a 1RM').toBeDefined();
    const load = loaded!.prescription.load as Extract<Prescription['load'], { kind: 'percent-1rm' }>;
    const reversed = {
      ...loaded!,
      prescription: { ...loaded!.prescription, load: { ...load, kg: { ...load.kg!, min: load.kg!.max + 10, max: load.kg!.min } } },
    };
    const res = await tester.put(`/api/assessments/${id}/plan`).send({ exercises: [reversed], basedOn });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields)).toEqual(['exercises[0].prescription.load']);
    const body = { ...loaded!, prescription: { ...loaded!.prescription, load: { kind: 'bodyweight' } } };
    const other = await tester.put(`/api/assessments/${id}/plan`).send({ exercises: [body], basedOn });
    expect(other.status).toBe(400);
    expect(other.body.error.fields['exercises[0].prescription.load']).toMatch(/the load stays a share of 1RM/);
    // Nothing was saved.
    expect((await tester.get(`/api/assessments/${id}`)).body.result.adjustment).toBeNull();
  });

  it('enforces the youth limits on an adjusted plan: past a limit only a head coach or physiotherapist, with a reason, kept in the history', async () => {
    const round = await openRound('Limits check', '2026-09-22');
    const id = assessmentOf(round, ids.ava);
    await saveDraft(id, 0);
    const result = (await tester.post(`/api/assessments/${id}/submit`).send({ draftVersion: await versionOf(id) })).body as ResultView;
    const basedOn = { resultVersion: result.version, adjustedAt: null };
    // Every plan carries the stop-on-pain rule.
    expect(result.result.plan.cautions[0]?.id).toBe('stop-on-pain');
    const body = result.result.plan.exercises.find((e) => e.prescription.load.kind !== 'percent-1rm')!;
    // Four sets is past the youth limit of 3 sets (Faigenbaum et al. 2009) at every stage for a bodyweight or band exercise.
    const fourSets = [{ ...body, prescription: { ...body.prescription, sets: { min: 4, max: 4 } } }];

    const refused = await tester.put(`/api/assessments/${id}/plan`).send({ exercises: fourSets, basedOn });
    expect(refused.status).toBe(400);
    expect(refused.body.error.fields['exercises[0].prescription.sets']).toMatch(/more than the 3 allowed.*head coach or physiotherapist/);

    const override = { exerciseId: body.id, limit: 'sets', reason: 'Physio asked for extra sets this block' };
    const notAllowed = await tester.put(`/api/assessments/${id}/plan`).send({ exercises: fourSets, overrides: [override], basedOn });
    expect(notAllowed.status).toBe(403);

    const noReason = await signedInAgent(app, 'coach@riverside.test');
    const blank = await noReason.put(`/api/assessments/${id}/plan`).send({ exercises: fourSets, overrides: [{ ...override, reason: ' ' }], basedOn });
    expect(blank.status).toBe(400);

    const coach = noReason;
    const kept = await coach.put(`/api/assessments/${id}/plan`).send({ exercises: fourSets, overrides: [override], note: 'Extra sets', basedOn });
    expect(kept.status).toBe(200);
    const view = kept.body as ResultView;
    expect(view.adjustment!.overrides).toEqual([
      { exerciseId: body.id, limit: 'sets', reason: override.reason, role: 'head_coach', message: expect.stringMatching(/4 sets is more than the 3 allowed/) },
    ]);

    // The physiotherapist may adjust plans, and go back within the limits; the history keeps both.
    const physio = await signedInAgent(app, 'physio@riverside.test');
    const back = await physio
      .put(`/api/assessments/${id}/plan`)
      .send({ exercises: [body], note: 'Back to the proposal', basedOn: { resultVersion: result.version, adjustedAt: view.adjustment!.createdAt } });
    expect(back.status).toBe(200);
    const latest = back.body as ResultView;
    expect(latest.adjustment!.overrides).toEqual([]);
    expect(latest.adjustmentHistory.map((a) => a.note)).toEqual(['Back to the proposal', 'Extra sets']);
    expect(latest.adjustmentHistory[1]!.overrides[0]!.reason).toBe(override.reason);
    // The engine's proposal is never changed.
    expect(latest.result.plan).toEqual(result.result.plan);
  });

  it('refuses a plan edit against a plan changed since it was opened (409 with the current plan)', async () => {
    const round = await openRound('Two editors', '2026-09-23');
    const id = assessmentOf(round, ids.mia);
    await saveDraft(id, 0);
    const result = (await tester.post(`/api/assessments/${id}/submit`).send({ draftVersion: 1 })).body as ResultView;
    const [first] = result.result.plan.exercises;
    const seen = { resultVersion: result.version, adjustedAt: null };
    const edit = (note: string, basedOn: { resultVersion: number; adjustedAt: string | null }) =>
      tester.put(`/api/assessments/${id}/plan`).send({ exercises: [{ id: first!.id, prescription: first!.prescription }], note, basedOn });
    const a = await edit('First phone', seen);
    expect(a.status).toBe(200);
    // The second phone still shows the engine's plan: its edit would silently replace the first.
    const b = await edit('Second phone', seen);
    expect(b.status).toBe(409);
    expect(b.body.error.code).toBe('plan_conflict');
    expect((b.body.current as ResultView).adjustment).toMatchObject({ note: 'First phone' });
    // Having seen the current plan, it may edit it.
    const c = await edit('Second phone, after looking', { resultVersion: 1, adjustedAt: (a.body as ResultView).adjustment!.createdAt });
    expect(c.status).toBe(200);
    // A re-submission makes a new result version: an edit of the old one is stale too.
    await saveDraft(id, 1);
    await tester.post(`/api/assessments/${id}/submit`).send({ draftVersion: 2 });
    expect((await edit('Old result', { resultVersion: 1, adjustedAt: (c.body as ResultView).adjustment!.createdAt })).status).toBe(409);
  });

  it('refuses to submit a draft other than the one reviewed (409 with the current draft)', async () => {
    const round = await openRound('Two phones', '2026-09-24');
    const id = assessmentOf(round, ids.mia);
    await saveDraft(id, 0);
    await saveDraft(id, 1, makeDraft({ step: 'review' })); // another phone saved after this one looked
    const stale = await tester.post(`/api/assessments/${id}/submit`).send({ draftVersion: 1 });
    expect(stale.status).toBe(409);
    expect(stale.body).toMatchObject({ error: { code: 'draft_conflict' }, current: { draftVersion: 2, status: 'in_progress' } });
    expect((await tester.get(`/api/assessments/${id}`)).body.result).toBeNull();
    expect((await tester.post(`/api/assessments/${id}/submit`).send({ draftVersion: 2 })).status).toBe(200);
  });

  it('refuses a plan adjustment before there is a result', async () => {
    const round = await openRound('No result yet', '2026-09-21');
    const res = await tester
      .put(`/api/assessments/${assessmentOf(round, ids.mia)}/plan`)
      .send({ exercises: [{ id: EXERCISES[0]!.id, prescription: EXERCISES[0]!.prescription }], basedOn: { resultVersion: 1, adjustedAt: null } });
    expect(res.status).toBe(409);
  });

  it('lists rounds newest first, for one squad or the whole club', async () => {
    await openRound('Older', '2026-03-02');
    const res = await tester.get(`/api/rounds?squadId=${ids.squad}`);
    expect(res.status).toBe(200);
    const dates = (res.body.rounds as { screenedOn: string }[]).map((r) => r.screenedOn);
    expect(dates).toEqual([...dates].sort().reverse());
    expect(dates.at(-1)).toBe('2026-03-02');
    expect((await tester.get('/api/rounds')).body.rounds).toHaveLength(dates.length);
  });
});

describe('draft saving', () => {
  it('refuses a stale draftVersion with 409 and the server draft to merge', async () => {
    const round = await openRound('Two phones', '2026-09-15');
    const id = assessmentOf(round, ids.mia);
    await saveDraft(id, 0, makeDraft({ step: 'phone-a' }));
    const stale = await tester.put(`/api/assessments/${id}`).send({ draftVersion: 0, draft: makeDraft({ step: 'phone-b' }) });
    expect(stale.status).toBe(409);
    expect(stale.body.error).toMatchObject({ code: 'draft_conflict', message: expect.stringMatching(/another device/) });
    expect(stale.body.current).toMatchObject({ draftVersion: 1, status: 'in_progress', draft: { step: 'phone-a' } });
    const [row] = await testDb.db.select().from(assessments).where(eq(assessments.id, id));
    expect(row!.draft.step).toBe('phone-a');
  });

  it.each([
    ['an unknown task', { tasks: { 'back-squat': { criteria: [] } } }, 'draft.tasks.back-squat'],
    ['a criterion of another task', { tasks: { 'two-leg-squat': { criteria: ['sls-balance'] } } }, 'draft.tasks.two-leg-squat.criteria'],
    [
      'a photo view the task lacks',
      { tasks: { 'drop-landing': { criteria: [], landmarks: { side: { 'near-hip': { x: 1, y: 1 } } } } } },
      'draft.tasks.drop-landing.landmarks.side',
    ],
    [
      'a landmark of the other view',
      { tasks: { 'two-leg-squat': { criteria: [], landmarks: { front: { 'near-hip': { x: 1, y: 1 } } } } } },
      'draft.tasks.two-leg-squat.landmarks.front.near-hip',
    ],
    ['a distance on a task without one', { tasks: { 'two-leg-squat': { criteria: [], distanceCm: 5 } } }, 'draft.tasks.two-leg-squat.distanceCm'],
    ['a distance out of range', { tasks: { 'knee-to-wall-left': { criteria: [], distanceCm: 80 } } }, 'draft.tasks.knee-to-wall-left.distanceCm'],
    [
      'a negative point',
      { tasks: { 'two-leg-squat': { criteria: [], landmarks: { front: { 'left-hip': { x: -4, y: 1 } } } } } },
      'draft.tasks.two-leg-squat.landmarks.front',
    ],
    ['a height typed in metres', { body: { statureCm: 1.52 }, tasks: {} }, 'draft.body.statureCm'],
  ])('answers 400 with the field for %s', async (_name, draft, field) => {
    const round = await openRound(`Bad ${_name}`, '2026-09-16');
    const id = assessmentOf(round, ids.mia);
    const res = await tester.put(`/api/assessments/${id}`).send({ draftVersion: 0, draft: { body: {}, ...draft } });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('invalid_input');
    expect(Object.keys(res.body.error.fields)).toContain(field);
    const [row] = await testDb.db.select().from(assessments).where(eq(assessments.id, id));
    expect(row!.draftVersion).toBe(0);
  });
});

describe('submitting', () => {
  it('needs at least one task that was done', async () => {
    const round = await openRound('Empty', '2026-09-17');
    const id = assessmentOf(round, ids.mia);
    await saveDraft(id, 0, { body: { statureCm: 150 }, tasks: { 'drop-landing': { criteria: [], skipped: true } } });
    const res = await tester.post(`/api/assessments/${id}/submit`).send({ draftVersion: await versionOf(id) });
    expect(res.status).toBe(400);
    expect(res.body.error.message).toMatch(/nothing to submit/i);
  });

  // Our choice: a child who says something hurts before the screen is not screened that day.
  it('refuses a screen with “something hurts today” ticked, keeping the draft, and submits once it is unticked', async () => {
    const round = await openRound('Hurts today', '2026-09-17');
    const id = assessmentOf(round, ids.mia);
    await saveDraft(id, 0, { body: {}, hurtsToday: true, tasks: { 'two-leg-squat': { criteria: [] } } });
    const refused = await tester.post(`/api/assessments/${id}/submit`).send({ draftVersion: await versionOf(id) });
    expect(refused.status).toBe(400);
    expect(refused.body.error.fields).toEqual({ 'draft.hurtsToday': 'Something hurts today: no screen today.' });
    const [kept] = await testDb.db.select().from(assessments).where(eq(assessments.id, id));
    expect(kept!.status).not.toBe('submitted');
    expect((kept!.draft as { hurtsToday?: boolean }).hurtsToday).toBe(true);
    await saveDraft(id, await versionOf(id), { body: {}, hurtsToday: null, tasks: { 'two-leg-squat': { criteria: [] } } });
    expect((await tester.post(`/api/assessments/${id}/submit`).send({ draftVersion: await versionOf(id) })).status).toBe(200);
  });

  it('refuses a “something hurts today” that is not true or false', async () => {
    const round = await openRound('Hurts today, bad', '2026-09-18');
    const id = assessmentOf(round, ids.mia);
    const res = await tester.put(`/api/assessments/${id}`).send({ draftVersion: 0, draft: { body: {}, tasks: {}, hurtsToday: 'yes' } });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields)).toContain('draft.hurtsToday');
  });

  it("answers 400 with the engine's message and the draft field for impossible landmarks", async () => {
    const round = await openRound('Mirrored', '2026-09-17');
    const id = assessmentOf(round, ids.mia);
    const mirrored = valgusSquat();
    mirrored.landmarks!.front!['right-hip'] = { x: 700, y: 700 }; // right hip placed on the image's right
    await saveDraft(id, 0, makeDraft({ tasks: { 'two-leg-squat': mirrored } }));
    const res = await tester.post(`/api/assessments/${id}/submit`).send({ draftVersion: await versionOf(id) });
    expect(res.status).toBe(400);
    expect(res.body.error.message).toMatch(/image's left/);
    expect(res.body.error.fields).toHaveProperty(['draft.tasks.two-leg-squat.landmarks.front.right-hip']);
    expect((await tester.get(`/api/assessments/${id}`)).body.status).toBe('in_progress');
  });
});

describe('a submission that fails halfway leaves no partial result', () => {
  let id: string;
  let cookie: string;
  let firstResultId: string;

  beforeAll(async () => {
    const round = await openRound('Atomic', '2026-09-18');
    id = assessmentOf(round, ids.mia);
    await saveDraft(id, 0);
    firstResultId = ((await tester.post(`/api/assessments/${id}/submit`).send({ draftVersion: await versionOf(id) })).body as ResultView).id;
    await saveDraft(id, 1, makeDraft({ step: 'edited' })); // back to in progress, result 1 still current
    cookie = await sessionCookie(app, 'tester@riverside.test');
  });

  async function expectUnchanged() {
    const rows = await testDb.db.select().from(assessmentResults).where(eq(assessmentResults.assessmentId, id));
    expect(rows.map((r) => [r.id, r.version, r.isCurrent])).toEqual([[firstResultId, 1, true]]);
    const [row] = await testDb.db.select().from(assessments).where(eq(assessments.id, id));
    expect(row!.status).toBe('in_progress');
  }

  it('when PostgreSQL rejects the result JSON (after earlier versions were retired in the same transaction)', async () => {
    // jsonb refuses \u0000: the insert fails after the update that made version 1 non-current.
    const poisoned = (input: Parameters<typeof evaluateAssessment>[0]): AssessmentResult => {
      const result = evaluateAssessment(input);
      return { ...result, plan: { ...result.plan, cautions: [...result.plan.cautions, { id: 'x', text: 'nul \u0000 byte', source: null }] } };
    };
    const res = await supertest(screeningAppWith(testDb.db, storage, poisoned))
      .post(`/api/assessments/${id}/submit`)
      .set('Cookie', cookie)
      .send({ draftVersion: await versionOf(id) });
    expect(res.status).toBe(500);
    expect(res.body.error.code).toBe('server_error');
    await expectUnchanged();
  });

  it('when the engine throws', async () => {
    const broken = () => {
      throw new Error('engine bug');
    };
    const res = await supertest(screeningAppWith(testDb.db, storage, broken))
      .post(`/api/assessments/${id}/submit`)
      .set('Cookie', cookie)
      .send({ draftVersion: await versionOf(id) });
    expect(res.status).toBe(500);
    await expectUnchanged();
  });

  it('when the engine refuses the input', async () => {
    const refusing = () => {
      throw new EngineInputError('athlete.statureCm', 'must be between 80 and 230 cm, got 5');
    };
    const res = await supertest(screeningAppWith(testDb.db, storage, refusing))
      .post(`/api/assessments/${id}/submit`)
      .set('Cookie', cookie)
      .send({ draftVersion: await versionOf(id) });
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toEqual({ 'draft.body.statureCm': 'must be between 80 and 230 cm, got 5' });
    await expectUnchanged();
  });

  it('and the real engine then submits fine', async () => {
    const res = await supertest(screeningAppWith(testDb.db, storage, evaluateAssessment))
      .post(`/api/assessments/${id}/submit`)
      .set('Cookie', cookie)
      .send({ draftVersion: await versionOf(id) });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ version: 2, history: [{ id: firstResultId }] });
  });
});

describe('who may do what', () => {
  let round: RoundDetail;
  let id: string;

  beforeAll(async () => {
    round = await openRound('Access', '2026-09-19');
    id = assessmentOf(round, ids.ava);
    await saveDraft(id, 0);
    expect((await tester.post(`/api/assessments/${id}/submit`).send({ draftVersion: await versionOf(id) })).status).toBe(200);
  });

  const reads = () => [
    ['GET', `/api/rounds/${round.round.id}`],
    ['GET', `/api/rounds?squadId=${ids.squad}`],
    ['GET', `/api/assessments/${id}`],
    ['GET', `/api/athletes/${ids.ava}/assessments`],
  ];
  const writes = () => [
    ['POST', '/api/rounds', { squadId: ids.squad, name: 'Sneaky', screenedOn: '2026-09-30' }],
    ['PUT', `/api/assessments/${id}`, { draftVersion: 1, draft: makeDraft() }],
    ['POST', `/api/assessments/${id}/submit`, { draftVersion: 1 }],
    [
      'PUT',
      `/api/assessments/${id}/plan`,
      { exercises: [{ id: EXERCISES[0]!.id, prescription: EXERCISES[0]!.prescription }], basedOn: { resultVersion: 1, adjustedAt: null } },
    ],
  ];

  async function call(agent: Agent, [method, url, body]: (string | object | undefined)[]) {
    const req = method === 'GET' ? agent.get(url as string) : method === 'PUT' ? agent.put(url as string) : agent.post(url as string);
    return body ? req.send(body) : req;
  }

  it('refuses a tester of another club everything (403)', async () => {
    const outsider = await signedInAgent(app, 'tester@hillside.test');
    for (const route of [...reads(), ...writes()]) {
      const res = await call(outsider, route);
      expect([route[1], res.status]).toEqual([route[1], 403]);
    }
    // Their own club's rounds do not include ours.
    expect((await outsider.get('/api/rounds')).body.rounds).toEqual([]);
  });

  it('refuses a parent everything, even about their own child (403)', async () => {
    const parent = await signedInAgent(app, 'parent@riverside.test');
    for (const route of [...reads(), ...writes(), ['GET', '/api/rounds']]) {
      const res = await call(parent, route);
      expect([route[1], res.status]).toEqual([route[1], 403]);
    }
  });

  it('lets a physio read and adjust a plan, but not screen', async () => {
    const physio = await signedInAgent(app, 'physio@riverside.test');
    for (const route of reads()) expect([route[1], (await call(physio, route)).status]).toEqual([route[1], 200]);
    const [plan, ...screening] = [...writes()].reverse();
    for (const route of screening) expect([route[1], (await call(physio, route)).status]).toEqual([route[1], 403]);
    // The physiotherapist may adjust the plan (and go past a limit with a reason, like a head coach).
    expect((await call(physio, plan!)).status).not.toBe(403);
  });

  it('lets a head coach open rounds and screen', async () => {
    const coach = await signedInAgent(app, 'coach@riverside.test');
    const res = await coach.post('/api/rounds').send({ squadId: ids.squad, name: 'Coach round', screenedOn: '2026-09-22' });
    expect(res.status).toBe(201);
  });

  it('answers 404 for a missing or malformed id', async () => {
    const missing = '00000000-0000-4000-8000-000000000000';
    for (const url of [
      `/api/rounds/${missing}`,
      '/api/rounds/nope',
      `/api/assessments/${missing}`,
      '/api/assessments/1',
      `/api/athletes/${missing}/assessments`,
      `/api/rounds?squadId=${missing}`,
    ]) {
      expect([url, (await tester.get(url)).status]).toEqual([url, 404]);
    }
    expect((await tester.post(`/api/assessments/${missing}/submit`)).status).toBe(404);
    expect((await tester.post('/api/rounds').send({ squadId: missing, name: 'Ghost squad', screenedOn: '2026-09-14' })).status).toBe(404);
  });

  it('refuses a round for a squad of another club and a date that does not exist', async () => {
    expect((await tester.post('/api/rounds').send({ squadId: ids.otherSquad, name: 'Theirs', screenedOn: '2026-09-14' })).status).toBe(403);
    const res = await tester.post('/api/rounds').send({ squadId: ids.squad, name: 'Leap', screenedOn: '2026-02-30' });
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toHaveProperty('screenedOn');
  });

  it('leaves archived athletes out of a new round but keeps their history', async () => {
    const [archived] = await testDb.db.update(athletes).set({ archivedAt: new Date() }).where(eq(athletes.id, ids.ava)).returning();
    try {
      const next = await openRound('After archive', '2026-10-01');
      expect(next.athletes.map((a) => a.athleteId)).not.toContain(ids.ava);
      const history = await tester.get(`/api/athletes/${ids.ava}/assessments`);
      expect(history.status).toBe(200);
      expect(history.body.assessments.length).toBeGreaterThan(0);
    } finally {
      await testDb.db.update(athletes).set({ archivedAt: null }).where(eq(athletes.id, archived!.id));
    }
  });
});
