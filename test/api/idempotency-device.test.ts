import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { assessmentResults, idempotencyKeys, photos } from '@/db/schema';
import type { RoundDetail } from '@/features/screening/contract';
import { makeAthlete, makeClub, makeSquad, makeTestApp, makeUser, signedInAgent } from '../fixtures/builders';
import { memoryStorage, phonePhotoWithExif } from '../fixtures/photos';
import { makeDraft } from '../fixtures/screening';
import { createTestDb, type TestDb } from '../fixtures/test-db';

// A device's outbox sends each change with an Idempotency-Key: a retry after a lost answer must get the
// first answer back and change nothing.
let testDb: TestDb;
let app: ReturnType<typeof makeTestApp>['app'];
type Agent = Awaited<ReturnType<typeof signedInAgent>>;
let tester: Agent;
let other: Agent;
let assessmentId: string;

beforeAll(async () => {
  testDb = await createTestDb();
  ({ app } = makeTestApp(testDb.db, { storage: memoryStorage() }));
  const db = testDb.db;
  const club = await makeClub(db, 'Quayside');
  const squad = await makeSquad(db, club.id, 'Under-15');
  await makeUser(db, { email: 'tester@quayside.test', clubId: club.id, role: 'tester' });
  await makeUser(db, { email: 'coach@quayside.test', clubId: club.id, role: 'head_coach' });
  const athlete = await makeAthlete(db, { clubId: club.id, squadId: squad.id, firstName: 'Ola', lastName: 'Berg' });
  tester = await signedInAgent(app, 'tester@quayside.test');
  other = await signedInAgent(app, 'coach@quayside.test');
  const round = (await tester.post('/api/rounds').send({ squadId: squad.id, name: 'Autumn', screenedOn: '2026-10-01' })).body as RoundDetail;
  assessmentId = round.athletes.find((a) => a.athleteId === athlete.id)!.assessmentId;
});

afterAll(async () => {
  await testDb.drop();
});

describe('Idempotency-Key', () => {
  it('a draft save sent twice with the same key is saved once; the repeat gets the first answer', async () => {
    const send = () => tester.put(`/api/assessments/${assessmentId}`).set('Idempotency-Key', 'draft-key-0001').send({ draftVersion: 0, draft: makeDraft() });
    const first = await send();
    expect(first.status).toBe(200);
    const again = await send();
    expect(again.status).toBe(200);
    expect(again.headers['idempotent-replayed']).toBe('true');
    expect(again.body).toEqual(first.body);
    // Without the key, the same request on the old version is a conflict: the first save happened once.
    const plain = await tester.put(`/api/assessments/${assessmentId}`).send({ draftVersion: 0, draft: makeDraft() });
    expect(plain.status).toBe(409);
  });

  it('a photo uploaded twice with the same key is stored once', async () => {
    const photo = await phonePhotoWithExif();
    const send = () =>
      tester
        .post(`/api/assessments/${assessmentId}/photos`)
        .set('Idempotency-Key', 'photo-key-0001')
        .field('task', 'two-leg-squat')
        .field('view', 'front')
        .attach('photo', photo, { filename: 'front.jpg', contentType: 'image/jpeg' });
    const first = await send();
    expect(first.status).toBe(201);
    const again = await send();
    expect(again.status).toBe(201);
    expect(again.body.id).toBe(first.body.id);
    expect(await testDb.db.select().from(photos).where(eq(photos.assessmentId, assessmentId))).toHaveLength(1);
  });

  it('a submit sent twice with the same key makes one result; a new key makes a new version', async () => {
    const submit = (key: string) => tester.post(`/api/assessments/${assessmentId}/submit`).set('Idempotency-Key', key);
    const first = await submit('submit-key-0001');
    expect(first.status).toBe(200);
    const again = await submit('submit-key-0001');
    expect(again.body.id).toBe(first.body.id);
    expect(await testDb.db.select().from(assessmentResults).where(eq(assessmentResults.assessmentId, assessmentId))).toHaveLength(1);
    expect((await submit('submit-key-0002')).body.version).toBe(2);
  });

  it('keys are per person, refused when malformed, and not reusable on another route', async () => {
    const coachSubmit = await other.post(`/api/assessments/${assessmentId}/submit`).set('Idempotency-Key', 'submit-key-0001');
    expect(coachSubmit.status).toBe(200);
    expect(coachSubmit.body.version).toBe(3);
    const bad = await tester.post(`/api/assessments/${assessmentId}/submit`).set('Idempotency-Key', 'no spaces allowed');
    expect(bad.status).toBe(400);
    expect(bad.body.error.code).toBe('invalid_input');
    const reused = await tester.put(`/api/assessments/${assessmentId}`).set('Idempotency-Key', 'submit-key-0001').send({ draftVersion: 1, draft: makeDraft() });
    expect(reused.status).toBe(422);
    expect(reused.body.error.code).toBe('idempotency_key_reused');
  });

  it('a refused request is answered the same on a retry (the tester sees the same reason)', async () => {
    const send = () => tester.put(`/api/assessments/${assessmentId}`).set('Idempotency-Key', 'refused-key-0001').send({ draftVersion: 'x', draft: {} });
    const first = await send();
    expect(first.status).toBe(400);
    const again = await send();
    expect(again.status).toBe(400);
    expect(again.body).toEqual(first.body);
    const rows = await testDb.db.select().from(idempotencyKeys).where(eq(idempotencyKeys.key, 'refused-key-0001'));
    expect(rows[0]?.status).toBe(400);
  });
});
