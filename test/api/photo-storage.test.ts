// Photo storage housekeeping: files written without their database row are swept, and uploads in
// flight are bounded (20 phones uploading at once hold at most a few uploads in memory).
import { sql } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { assessments, rounds, storageWrites } from '@/db/schema';
import { uploadSlots } from '@/server/http/upload-slots';
import { loggedWrites, sweepOrphans } from '@/server/storage/orphan-sweep';
import { makeAthlete, makeClub, makeSquad, makeTestApp, makeUser, signedInAgent } from '../fixtures/builders';
import { memoryStorage, phonePhotoWithExif } from '../fixtures/photos';
import { createTestDb, type TestDb } from '../fixtures/test-db';

let testDb: TestDb;
let clubId: string;
let assessmentId: string;

beforeAll(async () => {
  testDb = await createTestDb();
  const db = testDb.db;
  const club = await makeClub(db, 'Storage Club');
  clubId = club.id;
  const squad = await makeSquad(db, club.id);
  await makeUser(db, { email: 'tester@storage.test', clubId: club.id, role: 'tester' });
  const athlete = await makeAthlete(db, { clubId: club.id, squadId: squad.id });
  const [round] = await db.insert(rounds).values({ clubId: club.id, squadId: squad.id, name: 'R', screenedOn: '2026-09-14' }).returning();
  const [a] = await db.insert(assessments).values({ clubId: club.id, roundId: round!.id, athleteId: athlete.id }).returning();
  assessmentId = a!.id;
});

afterAll(async () => {
  await testDb.drop();
});

describe('orphan sweep', () => {
  it('removes a file whose database row never came, and keeps the photos that have one', async () => {
    const storage = memoryStorage();
    const { app } = makeTestApp(testDb.db, { storage });
    const tester = await signedInAgent(app, 'tester@storage.test');
    const upload = await tester
      .post(`/api/assessments/${assessmentId}/photos`)
      .field('task', 'two-leg-squat')
      .field('view', 'front')
      .attach('photo', await phonePhotoWithExif(), { filename: 'a.jpg', contentType: 'image/jpeg' });
    expect(upload.status).toBe(201);
    expect(storage.objects.size).toBe(2); // the photo and its thumbnail

    // A crash after the file was written, before its row: written through the same logged storage.
    const orphanKey = `${clubId}/${assessmentId}/crashed-upload.jpg`;
    await loggedWrites(testDb.db, storage).put(orphanKey, Buffer.from('half a story'), 'image/jpeg');
    expect(storage.objects.has(orphanKey)).toBe(true);

    // Too recent: an upload may still be on its way to its row.
    expect(await sweepOrphans(testDb.db, storage)).toEqual([]);
    expect(storage.objects.has(orphanKey)).toBe(true);

    await testDb.db.execute(sql`update storage_writes set written_at = now() - interval '2 hours'`);
    expect(await sweepOrphans(testDb.db, storage)).toEqual([orphanKey]);
    expect(storage.objects.has(orphanKey)).toBe(false);
    expect(storage.objects.size).toBe(2);
    expect(await testDb.db.select().from(storageWrites)).toEqual([]);
    // The photo is still served.
    expect((await tester.get(`/api/photos/${upload.body.id}`)).status).toBe(200);
  });
});

describe('uploads in flight', () => {
  it('reads at most a few uploads at once when 20 phones upload together, and loses none', async () => {
    const slots = uploadSlots({ slots: 3 });
    const storage = memoryStorage();
    const { app } = makeTestApp(testDb.db, { storage, uploads: slots });
    const tester = await signedInAgent(app, 'tester@storage.test');
    const photo = await phonePhotoWithExif();
    const results = await Promise.all(
      Array.from({ length: 20 }, (_, i) =>
        tester
          .post(`/api/assessments/${assessmentId}/photos`)
          .field('task', 'two-leg-squat')
          .field('view', i % 2 ? 'front' : 'side')
          .attach('photo', photo, { filename: `p${i}.jpg`, contentType: 'image/jpeg' }),
      ),
    );
    expect(results.map((r) => r.status)).toEqual(Array(20).fill(201));
    const stats = slots.stats();
    expect(stats.maxActive).toBeLessThanOrEqual(3);
    expect(stats.maxActive).toBeGreaterThan(1); // they did overlap: the bound was what held them
    expect(stats).toMatchObject({ active: 0, waiting: 0 });
  });
});
