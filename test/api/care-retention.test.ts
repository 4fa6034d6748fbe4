import { eq } from 'drizzle-orm';
import pino from 'pino';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { assessmentResults, assessments, auditEvents, consents, photos } from '@/db/schema';
import { retentionJob } from '@/server/care/jobs';
import { monthsBefore, runRetention } from '@/server/care/retention.service';
import { makeAthlete, makeClub, makeSquad, makeTestApp, makeUser, signedInAgent } from '../fixtures/builders';
import { makeSubmittedScreen } from '../fixtures/care';
import { memoryStorage } from '../fixtures/photos';
import { createTestDb, type TestDb } from '../fixtures/test-db';

let testDb: TestDb;
const storage = memoryStorage();
const ids: Record<string, string> = {};
const DAY = 24 * 60 * 60 * 1000;
const start = new Date();

async function addPhoto(clubId: string, assessmentId: string, takenAt: Date) {
  const [row] = await testDb.db
    .insert(photos)
    .values({
      clubId,
      assessmentId,
      taskId: 'two-leg-squat',
      view: 'front',
      storageKey: `${clubId}/${assessmentId}/${takenAt.getTime()}.jpg`,
      thumbKey: `${clubId}/${assessmentId}/${takenAt.getTime()}-thumb.jpg`,
      width: 900,
      height: 1600,
      createdAt: takenAt,
    })
    .returning();
  await storage.put(row!.storageKey, Buffer.from('jpeg'), 'image/jpeg');
  await storage.put(row!.thumbKey, Buffer.from('jpeg'), 'image/jpeg');
  return row!;
}

beforeAll(async () => {
  testDb = await createTestDb();
  const db = testDb.db;
  const club = await makeClub(db, 'Riverside');
  const other = await makeClub(db, 'Hillside');
  ids.club = club.id;
  ids.other = other.id;
  const squad = await makeSquad(db, club.id);
  const otherSquad = await makeSquad(db, other.id);
  const tester = await makeUser(db, { email: 'tester@riverside.test', clubId: club.id, role: 'tester' });
  const otherTester = await makeUser(db, { clubId: other.id, role: 'tester' });
  await makeUser(db, { email: 'admin@riverside.test', clubId: club.id, role: 'admin' });
  const withdrawn = await makeAthlete(db, { clubId: club.id, squadId: squad.id, firstName: 'Wil', lastName: 'Drawn' });
  const kept = await makeAthlete(db, { clubId: club.id, squadId: squad.id, firstName: 'Kee', lastName: 'Pt' });
  const far = await makeAthlete(db, { clubId: other.id, squadId: otherSquad.id, firstName: 'Far', lastName: 'Away' });
  ids.withdrawnAthlete = withdrawn.id;
  const a1 = await makeSubmittedScreen(db, { clubId: club.id, squadId: squad.id, athleteId: withdrawn.id, userId: tester.id });
  const a2 = await makeSubmittedScreen(db, { clubId: club.id, squadId: squad.id, athleteId: kept.id, userId: tester.id });
  const a3 = await makeSubmittedScreen(db, { clubId: other.id, squadId: otherSquad.id, athleteId: far.id, userId: otherTester.id });
  ids.withdrawnPhoto = (await addPhoto(club.id, a1.assessmentId, start)).id;
  ids.recentPhoto = (await addPhoto(club.id, a2.assessmentId, start)).id;
  // Taken 20 months before the test's "today": expires 4 months from now at the default 24 months.
  ids.oldPhoto = (await addPhoto(club.id, a2.assessmentId, monthsBefore(start, 20))).id;
  ids.otherClubOldPhoto = (await addPhoto(other.id, a3.assessmentId, monthsBefore(start, 20))).id;
  // The family withdraws photo consent today.
  await db.insert(consents).values({ athleteId: withdrawn.id, kind: 'photos', granted: false, decidedOn: start.toISOString().slice(0, 10) });
});

afterAll(async () => {
  await testDb.drop();
});

const photoIds = async () => (await testDb.db.select({ id: photos.id }).from(photos)).map((p) => p.id).sort();
const counts = async () => ({
  assessments: (await testDb.db.select().from(assessments)).length,
  results: (await testDb.db.select().from(assessmentResults)).length,
  consents: (await testDb.db.select().from(consents)).length,
});

describe('photo retention', () => {
  it('keeps everything inside the grace and retention periods', async () => {
    const before = await photoIds();
    const report = await runRetention(testDb.db, storage, ids.club!, { now: new Date(start.getTime() + 10 * DAY) });
    expect(report).toMatchObject({ deleted: 0, candidates: [] });
    expect(await photoIds()).toEqual(before);
  });

  it('deletes photos of a withdrawn consent after the 30-day grace period, recorded, nothing else touched', async () => {
    const now = new Date(start.getTime() + 31 * DAY);
    const dry = await runRetention(testDb.db, storage, ids.club!, { now, dryRun: true });
    expect(dry.candidates).toEqual([expect.objectContaining({ photoId: ids.withdrawnPhoto, reason: 'consent-withdrawn', athleteName: 'Wil Drawn' })]);
    expect(dry.deleted).toBe(0);
    expect((await photoIds()).length).toBe(4);

    const before = await counts();
    const [photo] = await testDb.db.select().from(photos).where(eq(photos.id, ids.withdrawnPhoto!));
    const report = await runRetention(testDb.db, storage, ids.club!, { now });
    expect(report.deleted).toBe(1);
    expect(storage.objects.has(photo!.storageKey)).toBe(false);
    expect(storage.objects.has(photo!.thumbKey)).toBe(false);
    expect(await photoIds()).toEqual([ids.recentPhoto, ids.oldPhoto, ids.otherClubOldPhoto].sort());
    expect(storage.objects.size).toBe(6);
    expect(await counts()).toEqual(before);
    const audit = await testDb.db.select().from(auditEvents).where(eq(auditEvents.action, 'photo.deleted'));
    expect(audit).toEqual([
      expect.objectContaining({
        subjectId: ids.withdrawnPhoto,
        athleteId: ids.withdrawnAthlete,
        clubId: ids.club,
        actorId: null,
        detail: expect.objectContaining({ reason: 'consent-withdrawn' }),
      }),
    ]);
  });

  it('the scheduled job deletes photos past the 24-month retention in every club, and only those', async () => {
    const now = new Date(monthsBefore(start, -4).getTime() + DAY);
    const deleted = await retentionJob(testDb.db, storage, pino({ level: 'silent' }), now);
    expect(deleted).toBe(2);
    expect(await photoIds()).toEqual([ids.recentPhoto]);
    expect(storage.objects.size).toBe(2);
    const audit = await testDb.db.select().from(auditEvents).where(eq(auditEvents.action, 'photo.deleted'));
    expect(audit.map((a) => a.subjectId).sort()).toEqual([ids.withdrawnPhoto, ids.oldPhoto, ids.otherClubOldPhoto].sort());
    expect(audit.filter((a) => a.subjectId !== ids.withdrawnPhoto).every((a) => (a.detail as { reason: string }).reason === 'retention-expired')).toBe(true);
  });

  it('offers admins a dry run through the API, and refuses testers', async () => {
    const { app } = makeTestApp(testDb.db, { storage });
    const admin = await signedInAgent(app, 'admin@riverside.test');
    const res = await admin.get('/api/retention/dry-run');
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ dryRun: true, deleted: 0, candidates: [] });
    const tester = await signedInAgent(app, 'tester@riverside.test');
    expect((await tester.get('/api/retention/dry-run')).status).toBe(403);
  });
});

describe('monthsBefore', () => {
  it.each([
    ['2026-03-31T12:00:00Z', 1, '2026-02-28T12:00:00.000Z'],
    ['2026-12-02T00:00:00Z', 24, '2024-12-02T00:00:00.000Z'],
    ['2024-02-29T00:00:00Z', 12, '2023-02-28T00:00:00.000Z'],
    ['2026-01-15T00:00:00Z', -4, '2026-05-15T00:00:00.000Z'],
  ])('%s minus %i months is %s (calendar months, end of month clamped: our choice)', (from, months, expected) => {
    expect(monthsBefore(new Date(from), months).toISOString()).toBe(expected);
  });
});
