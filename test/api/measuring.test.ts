import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { MeasureQueue } from '@/features/measuring/contract';
import type { AssessmentDetail, PhotoView, RoundDetail } from '@/features/screening/contract';
import { makeAthlete, makeClub, makeSquad, makeTestApp, makeUser, signedInAgent } from '../fixtures/builders';
import { memoryStorage } from '../fixtures/photos';
import { valgusSquat } from '../fixtures/screening';
import { createTestDb, type TestDb } from '../fixtures/test-db';

// The "to measure" list: photos taken courtside without landmarks, measured later at a desk. Placing the
// points of a submitted assessment's photo works its result out again as a new version.

let testDb: TestDb;
let app: ReturnType<typeof makeTestApp>['app'];
type Agent = Awaited<ReturnType<typeof signedInAgent>>;
let tester: Agent;
let physio: Agent;
let outsider: Agent;
let roundId: string;
let submittedId: string; // assessment submitted courtside with ticks only
let inProgressId: string;
let frontPhoto: PhotoView;
let inProgressPhoto: PhotoView;

const FRONT = valgusSquat().landmarks!.front!;

async function jpeg(width: number, height: number) {
  return sharp({ create: { width, height, channels: 3, background: '#7a8c99' } })
    .jpeg()
    .toBuffer();
}

async function upload(agent: Agent, assessmentId: string, task: string, view: string): Promise<PhotoView> {
  const res = await agent
    .post(`/api/assessments/${assessmentId}/photos`)
    .field('task', task)
    .field('view', view)
    .attach('photo', await jpeg(900, 1600), { filename: 'p.jpg', contentType: 'image/jpeg' });
  expect(res.status).toBe(201);
  return res.body as PhotoView;
}

async function saveDraft(agent: Agent, id: string, tasks: Record<string, unknown>) {
  const current = (await agent.get(`/api/assessments/${id}`)).body as AssessmentDetail;
  const res = await agent.put(`/api/assessments/${id}`).send({ draftVersion: current.draftVersion, draft: { body: {}, tasks } });
  expect(res.status).toBe(200);
}

beforeAll(async () => {
  testDb = await createTestDb();
  ({ app } = makeTestApp(testDb.db, { storage: memoryStorage() }));
  const db = testDb.db;
  const club = await makeClub(db, 'Riverside');
  const other = await makeClub(db, 'Hillside');
  const squad = await makeSquad(db, club.id);
  await makeUser(db, { email: 'tester@riverside.test', clubId: club.id, role: 'tester' });
  await makeUser(db, { email: 'physio@riverside.test', clubId: club.id, role: 'physio' });
  await makeUser(db, { email: 'tester@hillside.test', clubId: other.id, role: 'tester' });
  const ava = await makeAthlete(db, { clubId: club.id, squadId: squad.id, firstName: 'Ava', lastName: 'Brook' });
  const ben = await makeAthlete(db, { clubId: club.id, squadId: squad.id, firstName: 'Ben', lastName: 'Cole', sex: 'male' });
  await makeAthlete(db, { clubId: club.id, squadId: squad.id, firstName: 'Zed', lastName: 'Adams', photoConsent: false });
  tester = await signedInAgent(app, 'tester@riverside.test');
  physio = await signedInAgent(app, 'physio@riverside.test');
  outsider = await signedInAgent(app, 'tester@hillside.test');
  const round = (await tester.post('/api/rounds').send({ squadId: squad.id, name: 'Desk', screenedOn: '2026-09-14' })).body as RoundDetail;
  roundId = round.round.id;
  submittedId = round.athletes.find((a) => a.athleteId === ava.id)!.assessmentId;
  inProgressId = round.athletes.find((a) => a.athleteId === ben.id)!.assessmentId;

  // Courtside: ticks and photos, no points; Ava's screen is submitted as it is.
  frontPhoto = await upload(tester, submittedId, 'two-leg-squat', 'front');
  await upload(tester, submittedId, 'two-leg-squat', 'side');
  await saveDraft(tester, submittedId, { 'two-leg-squat': { criteria: ['squat-right-knee-in'] } });
  expect((await tester.post(`/api/assessments/${submittedId}/submit`)).status).toBe(200);
  inProgressPhoto = await upload(tester, inProgressId, 'drop-landing', 'front');
  await saveDraft(tester, inProgressId, { 'drop-landing': { criteria: [] } });
});

afterAll(async () => {
  await testDb.drop();
});

describe('GET /api/measuring/queue', () => {
  it('lists every photo still without its points, the battery order within an athlete', async () => {
    const res = await tester.get('/api/measuring/queue').query({ roundId });
    expect(res.status).toBe(200);
    const items = (res.body as MeasureQueue).items;
    expect(items.map((i) => `${i.athlete.firstName} ${i.taskId} ${i.view} ${i.placed}/${i.needed}`)).toEqual([
      'Ava two-leg-squat front 0/10',
      'Ava two-leg-squat side 0/4',
      'Ben drop-landing front 0/6',
    ]);
    expect(items[0]!.photo.url).toBe(`/api/photos/${frontPhoto.id}?size=full`);
    expect(items[0]!.assessmentStatus).toBe('submitted');
  });

  it('is for the roles that screen: a physio gets 403, another club 403, a malformed round 404', async () => {
    expect((await physio.get('/api/measuring/queue')).status).toBe(403);
    expect((await outsider.get('/api/measuring/queue').query({ roundId })).status).toBe(403);
    expect((await tester.get('/api/measuring/queue').query({ roundId: 'nope' })).status).toBe(404);
  });
});

describe('PUT /api/measuring/photos/:id/landmarks', () => {
  it('refuses points that do not belong to the photo or lie outside it, naming each, and changes nothing', async () => {
    const before = (await tester.get(`/api/assessments/${submittedId}`)).body as AssessmentDetail;
    const res = await tester
      .put(`/api/measuring/photos/${frontPhoto.id}/landmarks`)
      .send({ landmarks: { 'near-knee': { x: 10, y: 10 }, 'right-hip': { x: 5000, y: 10 } } });
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toEqual({
      'landmarks.near-knee': '"near-knee" is not a point of this photo.',
      'landmarks.right-hip': 'The point lies outside the photo.',
    });
    const after = (await tester.get(`/api/assessments/${submittedId}`)).body as AssessmentDetail;
    expect(after.draftVersion).toBe(before.draftVersion);
  });

  it('refuses a body that is not points (400) and other clubs or roles (403)', async () => {
    expect((await tester.put(`/api/measuring/photos/${frontPhoto.id}/landmarks`).send({ landmarks: { 'right-hip': { x: 'a' } } })).status).toBe(400);
    expect((await physio.put(`/api/measuring/photos/${frontPhoto.id}/landmarks`).send({ landmarks: {} })).status).toBe(403);
    expect((await outsider.put(`/api/measuring/photos/${frontPhoto.id}/landmarks`).send({ landmarks: {} })).status).toBe(403);
  });

  it('rolls back a mirrored labelling on a submitted assessment with 400 and the field', async () => {
    const before = (await tester.get(`/api/assessments/${submittedId}`)).body as AssessmentDetail;
    const mirrored = { ...FRONT, 'right-hip': FRONT['left-hip'], 'left-hip': FRONT['right-hip'] };
    const res = await tester.put(`/api/measuring/photos/${frontPhoto.id}/landmarks`).send({ landmarks: mirrored });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields)).toEqual(['draft.tasks.two-leg-squat.landmarks.front.right-hip']);
    const after = (await tester.get(`/api/assessments/${submittedId}`)).body as AssessmentDetail;
    expect(after.draftVersion).toBe(before.draftVersion);
    expect(after.result!.version).toBe(1);
  });

  it('works a submitted result out again as a new version, keeping the ticks and the earlier version', async () => {
    const before = (await tester.get(`/api/assessments/${submittedId}`)).body as AssessmentDetail;
    expect(before.result!.result.measurements.some((m) => m.metric === 'fppa')).toBe(false);
    const res = await tester.put(`/api/measuring/photos/${frontPhoto.id}/landmarks`).send({ landmarks: FRONT });
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ draftVersion: before.draftVersion + 1, status: 'submitted', resultVersion: 2 });
    const after = (await tester.get(`/api/assessments/${submittedId}`)).body as AssessmentDetail;
    expect(after.status).toBe('submitted');
    expect(after.draft.tasks['two-leg-squat']!.criteria).toEqual(['squat-right-knee-in']);
    expect(after.draft.tasks['two-leg-squat']!.landmarks!.front).toEqual(FRONT);
    expect(after.result!.version).toBe(2);
    expect(after.result!.history.map((h) => h.version)).toEqual([1]);
    // valgusSquat: right FPPA about 29.5 deg (worked out in test/fixtures/screening.ts), left 0.
    const right = after.result!.result.measurements.find((m) => m.id === 'two-leg-squat/fppa/right');
    expect(right?.value).toBeCloseTo(29.5, 0);
    // 6 of the 10 points: the photo stays on the list with what is placed.
    const items = ((await tester.get('/api/measuring/queue').query({ roundId })).body as MeasureQueue).items;
    expect(items.find((i) => i.photo.id === frontPhoto.id)).toMatchObject({ placed: 6, needed: 10, landmarks: FRONT });
  });

  it('saves the points of an assessment still in progress without submitting it', async () => {
    const landing = {
      'right-hip': { x: 400, y: 700 },
      'right-knee': { x: 420, y: 900 },
      'right-ankle': { x: 410, y: 1120 },
      'left-hip': { x: 560, y: 700 },
      'left-knee': { x: 555, y: 900 },
      'left-ankle': { x: 560, y: 1120 },
    };
    const res = await tester.put(`/api/measuring/photos/${inProgressPhoto.id}/landmarks`).send({ landmarks: landing });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ status: 'in_progress', resultVersion: null });
    const items = ((await tester.get('/api/measuring/queue').query({ roundId })).body as MeasureQueue).items;
    expect(items.some((i) => i.photo.id === inProgressPhoto.id)).toBe(false);
  });

  it('keeps where each point came from (suggested, moved, placed) through both saves, and refuses any other source', async () => {
    const bad = await tester
      .put(`/api/measuring/photos/${inProgressPhoto.id}/landmarks`)
      .send({ landmarks: { 'right-hip': { x: 400, y: 700, source: 'guessed' } } });
    expect(bad.status).toBe(400);
    const landing = {
      'right-hip': { x: 401, y: 702, source: 'suggested' },
      'right-knee': { x: 425, y: 905, source: 'moved' },
      'right-ankle': { x: 410, y: 1120, source: 'placed' },
      'left-hip': { x: 560, y: 700 },
    };
    expect((await tester.put(`/api/measuring/photos/${inProgressPhoto.id}/landmarks`).send({ landmarks: landing })).status).toBe(200);
    let detail = (await tester.get(`/api/assessments/${inProgressId}`)).body as AssessmentDetail;
    expect(detail.draft.tasks['drop-landing']!.landmarks!.front).toEqual(landing);

    // The courtside draft save keeps them too, and refuses an unknown source with the field named.
    const task = detail.draft.tasks['drop-landing']!;
    const refused = await tester.put(`/api/assessments/${inProgressId}`).send({
      draftVersion: detail.draftVersion,
      draft: { body: {}, tasks: { 'drop-landing': { ...task, landmarks: { front: { 'right-hip': { x: 1, y: 1, source: 'model' } } } } } },
    });
    expect(refused.status).toBe(400);
    expect(Object.keys(refused.body.error.fields)).toEqual(['draft.tasks.drop-landing.landmarks.front']);
    await saveDraft(tester, inProgressId, {
      'drop-landing': { ...task, landmarks: { front: { ...landing, 'left-knee': { x: 555, y: 900, source: 'suggested' } } } },
    });
    detail = (await tester.get(`/api/assessments/${inProgressId}`)).body as AssessmentDetail;
    expect(detail.draft.tasks['drop-landing']!.landmarks!.front!['left-knee']).toEqual({ x: 555, y: 900, source: 'suggested' });
    expect(detail.draft.tasks['drop-landing']!.landmarks!.front!['right-knee']).toEqual({ x: 425, y: 905, source: 'moved' });
  });
});
