// Retries: a phone that lost an answer sends the same request again. Submits are idempotent by
// themselves (the same draft gives the same result, not a second version); any write carrying an
// Idempotency-Key header gets its first answer back instead of running twice.
import { randomUUID } from 'node:crypto';
import { eq, sql } from 'drizzle-orm';
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { assessmentResults, photos } from '@/db/schema';
import type { ResultView, RoundDetail } from '@/features/screening/contract';
import { makeAthlete, makeClub, makeSquad, makeTestApp, makeUser, signedInAgent } from '../fixtures/builders';
import { memoryStorage } from '../fixtures/photos';
import { makeDraft } from '../fixtures/screening';
import { createTestDb, type TestDb } from '../fixtures/test-db';

let testDb: TestDb;
let app: ReturnType<typeof makeTestApp>['app'];
const storage = memoryStorage();
type Agent = Awaited<ReturnType<typeof signedInAgent>>;
let tester: Agent;
let coach: Agent;
let round: RoundDetail;
let squadId: string;
let userId: string;

beforeAll(async () => {
  testDb = await createTestDb();
  ({ app } = makeTestApp(testDb.db, { storage }));
  const db = testDb.db;
  const club = await makeClub(db, 'Retry Club');
  const squad = await makeSquad(db, club.id);
  squadId = squad.id;
  userId = (await makeUser(db, { email: 'tester@retry.test', clubId: club.id, role: 'tester' })).id;
  await makeUser(db, { email: 'coach@retry.test', clubId: club.id, role: 'head_coach' });
  for (const firstName of ['Ada', 'Ben', 'Cas', 'Dee', 'Eli']) await makeAthlete(db, { clubId: club.id, squadId: squad.id, firstName });
  tester = await signedInAgent(app, 'tester@retry.test');
  coach = await signedInAgent(app, 'coach@retry.test');
  const res = await tester.post('/api/rounds').send({ squadId: squad.id, name: 'Retries', screenedOn: '2026-09-14' });
  round = res.body;
});

afterAll(async () => {
  await testDb?.drop();
});

const assessment = (i: number) => round.athletes[i]!.assessmentId;
const resultRows = (id: string) => testDb.db.select().from(assessmentResults).where(eq(assessmentResults.assessmentId, id));

describe('submitting the same draft twice', () => {
  it('gives one result: the retry answers 200 with the result already made', async () => {
    const id = assessment(0);
    expect((await tester.put(`/api/assessments/${id}`).send({ draftVersion: 0, draft: makeDraft() })).status).toBe(200);
    const first = await tester.post(`/api/assessments/${id}/submit`);
    const retry = await tester.post(`/api/assessments/${id}/submit`);
    expect(first.status).toBe(200);
    expect(retry.status).toBe(200);
    expect((retry.body as ResultView).id).toBe((first.body as ResultView).id);
    expect((retry.body as ResultView).version).toBe(1);
    expect(await resultRows(id)).toHaveLength(1);
  });

  it('gives one result when both arrive at once (two taps, or a retry racing the first)', async () => {
    const id = assessment(1);
    await tester.put(`/api/assessments/${id}`).send({ draftVersion: 0, draft: makeDraft() });
    const [a, b] = await Promise.all([tester.post(`/api/assessments/${id}/submit`), coach.post(`/api/assessments/${id}/submit`)]);
    expect([a.status, b.status]).toEqual([200, 200]);
    expect(a.body.id).toBe(b.body.id);
    expect(await resultRows(id)).toHaveLength(1);
  });

  it('still makes a new version once the draft was edited', async () => {
    const id = assessment(0);
    await tester.put(`/api/assessments/${id}`).send({ draftVersion: 1, draft: makeDraft({ step: 'edited' }) });
    const again = await tester.post(`/api/assessments/${id}/submit`);
    expect(again.status).toBe(200);
    expect(again.body.version).toBe(2);
    expect(await resultRows(id)).toHaveLength(2);
  });
});

describe('Idempotency-Key', () => {
  it('replays a draft save instead of answering the retry with a conflict', async () => {
    const id = assessment(2);
    const key = randomUUID();
    const body = { draftVersion: 0, draft: makeDraft() };
    const first = await tester.put(`/api/assessments/${id}`).set('Idempotency-Key', key).send(body);
    const retry = await tester.put(`/api/assessments/${id}`).set('Idempotency-Key', key).send(body);
    expect(first.status).toBe(200);
    expect(retry.status).toBe(200);
    expect(retry.body).toEqual(first.body);
    expect(retry.headers['idempotent-replayed']).toBe('true');
    expect(first.headers['idempotent-replayed']).toBeUndefined();
    // The draft moved on once, not twice.
    expect((await tester.get(`/api/assessments/${id}`)).body.draftVersion).toBe(1);
    // Without a key the same retry is a stale save: 409 with the current draft to merge.
    const unkeyed = await tester.put(`/api/assessments/${id}`).send(body);
    expect(unkeyed.status).toBe(409);
  });

  it('treats the same body with its keys in another order as the same request', async () => {
    const id = assessment(2);
    const key = randomUUID();
    const draft = makeDraft({ step: 'two-leg-squat' });
    const first = await tester.put(`/api/assessments/${id}`).set('Idempotency-Key', key).send({ draftVersion: 1, draft });
    const retry = await tester.put(`/api/assessments/${id}`).set('Idempotency-Key', key).send({ draft, draftVersion: 1 });
    expect(first.status).toBe(200);
    expect(retry.status).toBe(200);
    expect(retry.headers['idempotent-replayed']).toBe('true');
  });

  it('replays a photo upload: one photo stored, the same id returned', async () => {
    const id = assessment(3);
    const jpeg = await sharp({ create: { width: 640, height: 480, channels: 3, background: '#8ab' } })
      .jpeg()
      .toBuffer();
    const key = randomUUID();
    const send = () =>
      tester
        .post(`/api/assessments/${id}/photos`)
        .set('Idempotency-Key', key)
        .field('task', 'two-leg-squat')
        .field('view', 'front')
        .attach('photo', jpeg, 'squat.jpg');
    const first = await send();
    const files = storage.objects.size;
    const retry = await send();
    expect(first.status).toBe(201);
    expect(retry.status).toBe(201);
    expect(retry.body.id).toBe(first.body.id);
    expect(storage.objects.size).toBe(files);
    expect(await testDb.db.select().from(photos).where(eq(photos.assessmentId, id))).toHaveLength(1);
  });

  it('replays a submit', async () => {
    const id = assessment(4);
    await tester.put(`/api/assessments/${id}`).send({ draftVersion: 0, draft: makeDraft() });
    const key = randomUUID();
    const first = await tester.post(`/api/assessments/${id}/submit`).set('Idempotency-Key', key);
    const retry = await tester.post(`/api/assessments/${id}/submit`).set('Idempotency-Key', key);
    expect(retry.status).toBe(200);
    expect(retry.body).toEqual(first.body);
    expect(retry.headers['idempotent-replayed']).toBe('true');
  });

  it('replays a creation (a round): one round, not two', async () => {
    const key = randomUUID();
    const body = { squadId, name: 'Keyed round', screenedOn: '2026-10-01' };
    const first = await tester.post('/api/rounds').set('Idempotency-Key', key).send(body);
    const retry = await tester.post('/api/rounds').set('Idempotency-Key', key).send(body);
    expect(first.status).toBe(201);
    expect(retry.status).toBe(201);
    expect(retry.body.round.id).toBe(first.body.round.id);
    const rows = await testDb.db.execute<{ n: number }>(sql`select count(*)::int as n from rounds where name = 'Keyed round'`);
    expect(rows.rows[0]!.n).toBe(1);
  });

  it('refuses the same key for a different request with 422', async () => {
    const key = randomUUID();
    expect((await tester.post('/api/rounds').set('Idempotency-Key', key).send({ squadId, name: 'One', screenedOn: '2026-10-02' })).status).toBe(201);
    const other = await tester.post('/api/rounds').set('Idempotency-Key', key).send({ squadId, name: 'Two', screenedOn: '2026-10-02' });
    expect(other.status).toBe(422);
    expect(other.body.error.code).toBe('idempotency_key_reused');
  });

  it('does not keep a refused request: the corrected request with the same key runs', async () => {
    const key = randomUUID();
    const bad = await tester.post('/api/rounds').set('Idempotency-Key', key).send({ squadId, name: '', screenedOn: '2026-10-03' });
    expect(bad.status).toBe(400);
    const good = await tester.post('/api/rounds').set('Idempotency-Key', key).send({ squadId, name: 'Corrected', screenedOn: '2026-10-03' });
    expect(good.status).toBe(201);
  });

  it('keeps keys per user: the same key from someone else is their own request', async () => {
    const key = randomUUID();
    const a = await tester.post('/api/rounds').set('Idempotency-Key', key).send({ squadId, name: 'Mine', screenedOn: '2026-10-04' });
    const b = await coach.post('/api/rounds').set('Idempotency-Key', key).send({ squadId, name: 'Mine', screenedOn: '2026-10-04' });
    expect(a.status).toBe(201);
    expect(b.status).toBe(201);
    expect(b.body.round.id).not.toBe(a.body.round.id);
    expect(b.headers['idempotent-replayed']).toBeUndefined();
  });

  it('answers 409 while the first request with the key still runs, and takes over an abandoned one', async () => {
    const key = randomUUID();
    const body = { squadId, name: 'Slow', screenedOn: '2026-10-05' };
    const fingerprintOf = async () => {
      // Let the middleware claim, then read the fingerprint it wrote, then make the claim look unfinished.
      await tester.post('/api/rounds').set('Idempotency-Key', key).send(body);
      const r = await testDb.db.execute<{ fingerprint: string }>(sql`select fingerprint from idempotency_keys where key = ${key}`);
      return r.rows[0]!.fingerprint;
    };
    const fingerprint = await fingerprintOf();
    await testDb.db.execute(sql`update idempotency_keys set status = null, response = null where key = ${key}`);
    const busy = await tester.post('/api/rounds').set('Idempotency-Key', key).send(body);
    expect(busy.status).toBe(409);
    expect(busy.body.error.code).toBe('request_in_progress');
    expect(busy.headers['retry-after']).toBe('1');
    // The first process died mid-request: after 30 s the key is taken over and the request runs again.
    await testDb.db.execute(sql`update idempotency_keys set created_at = now() - interval '1 minute' where key = ${key} and fingerprint = ${fingerprint}`);
    const taken = await tester.post('/api/rounds').set('Idempotency-Key', key).send(body);
    expect(taken.status).toBe(201);
    expect(taken.headers['idempotent-replayed']).toBeUndefined();
    const rows = await testDb.db.execute<{ status: number; user_id: string }>(sql`select status, user_id from idempotency_keys where key = ${key}`);
    expect(rows.rows).toEqual([{ status: 201, user_id: userId }]);
  });

  it.each(['short', 'has spaces in it', 'x'.repeat(201), 'ünïcödé-key-1234'])('refuses a malformed key %j with 400 naming the header', async (key) => {
    const res = await tester.post('/api/rounds').set('Idempotency-Key', key).send({ squadId, name: 'Bad key', screenedOn: '2026-10-06' });
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toHaveProperty('Idempotency-Key');
  });
});
