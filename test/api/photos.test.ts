import { eq } from 'drizzle-orm';
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { consents, photos } from '@/db/schema';
import type { AssessmentDetail, PhotoView, RoundDetail } from '@/features/screening/contract';
import { makeAthlete, makeClub, makeSquad, makeTestApp, makeUser, signedInAgent } from '../fixtures/builders';
import { exifTags, GPS_IFD_POINTER, memoryStorage, NOT_AN_IMAGE, phonePhotoWithExif, pngWithAlpha, TOO_LARGE } from '../fixtures/photos';
import { createTestDb, type TestDb } from '../fixtures/test-db';

let testDb: TestDb;
let app: ReturnType<typeof makeTestApp>['app'];
const storage = memoryStorage();
type Agent = Awaited<ReturnType<typeof signedInAgent>>;
let tester: Agent;
let withConsent: string; // assessment id
let withoutConsent: string;
let clubId: string;

beforeAll(async () => {
  testDb = await createTestDb();
  ({ app } = makeTestApp(testDb.db, { storage }));
  const db = testDb.db;
  const club = await makeClub(db, 'Riverside');
  clubId = club.id;
  const other = await makeClub(db, 'Hillside');
  const squad = await makeSquad(db, club.id);
  await makeUser(db, { email: 'tester@riverside.test', clubId: club.id, role: 'tester' });
  await makeUser(db, { email: 'physio@riverside.test', clubId: club.id, role: 'physio' });
  const parent = await makeUser(db, { email: 'parent@riverside.test', clubId: club.id, role: 'parent' });
  await makeUser(db, { email: 'tester@hillside.test', clubId: other.id, role: 'tester' });
  const yes = await makeAthlete(db, { clubId: club.id, squadId: squad.id, firstName: 'Ava', lastName: 'Brook', guardianUserId: parent.id });
  const no = await makeAthlete(db, { clubId: club.id, squadId: squad.id, firstName: 'Zed', lastName: 'Adams', photoConsent: false });
  tester = await signedInAgent(app, 'tester@riverside.test');
  const round = (await tester.post('/api/rounds').send({ squadId: squad.id, name: 'Photos', screenedOn: '2026-09-14' })).body as RoundDetail;
  withConsent = round.athletes.find((a) => a.athleteId === yes.id)!.assessmentId;
  withoutConsent = round.athletes.find((a) => a.athleteId === no.id)!.assessmentId;
});

afterAll(async () => {
  await testDb.drop();
});

function upload(
  agent: Agent,
  assessmentId: string,
  file: Buffer,
  fields: { task?: string; view?: string } = { task: 'two-leg-squat', view: 'front' },
  filename = 'photo.jpg',
) {
  let req = agent.post(`/api/assessments/${assessmentId}/photos`);
  if (fields.task) req = req.field('task', fields.task);
  if (fields.view) req = req.field('view', fields.view);
  return req.attach('photo', file, { filename, contentType: 'image/jpeg' });
}

describe('photo upload limits', () => {
  it('refuses a file over 12 MB with 413 and stores nothing', async () => {
    const before = storage.objects.size;
    const res = await upload(tester, withConsent, TOO_LARGE);
    expect(res.status).toBe(413);
    expect(res.body.error.code).toBe('too_large');
    expect(storage.objects.size).toBe(before);
  });

  it('checks the type from the bytes: a text file named photo.jpg is refused with 415', async () => {
    const res = await upload(tester, withConsent, NOT_AN_IMAGE, undefined, 'photo.jpg');
    expect(res.status).toBe(415);
    expect(res.body.error).toMatchObject({ code: 'unsupported_type', message: expect.stringMatching(/JPEG, PNG, WebP/) });
  });

  it('refuses an image type we do not take (GIF) even when named .jpg', async () => {
    const gif = await sharp({ create: { width: 10, height: 10, channels: 3, background: '#000' } })
      .gif()
      .toBuffer();
    const res = await upload(tester, withConsent, gif);
    expect(res.status).toBe(415);
    expect(res.body.error.message).toMatch(/GIF/);
  });

  it('refuses a photo when the family has not agreed, saying so', async () => {
    const before = storage.objects.size;
    const res = await upload(tester, withoutConsent, await phonePhotoWithExif());
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe('no_photo_consent');
    expect(res.body.error.message).toMatch(/Zed Adams's family has not agreed to photos/);
    expect(storage.objects.size).toBe(before);
    expect(await testDb.db.select().from(photos).where(eq(photos.assessmentId, withoutConsent))).toEqual([]);
  });

  it.each([
    [{ view: 'front' }, 'task'],
    [{ task: 'two-leg-squat' }, 'view'],
    [{ task: 'knee-to-wall-left', view: 'front' }, 'view'],
    [{ task: 'bench-press', view: 'front' }, 'task'],
  ])('answers 400 for fields %j (%s)', async (fields, field) => {
    const res = await upload(tester, withConsent, await pngWithAlpha(), fields);
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toHaveProperty(field);
  });

  it('answers 400 when no photo is attached', async () => {
    const res = await tester.post(`/api/assessments/${withConsent}/photos`).field('task', 'two-leg-squat').field('view', 'front');
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toHaveProperty('photo');
  });
});

describe('stored photos', () => {
  let view: PhotoView;
  let original: Buffer;

  beforeAll(async () => {
    original = await phonePhotoWithExif({ width: 1200, height: 2400, orientation: 6 });
    const res = await upload(tester, withConsent, original, { task: 'drop-landing', view: 'front' });
    expect(res.status).toBe(201);
    view = res.body;
  });

  it('starts from a photo that really carries camera details and a location', async () => {
    // Without this the metadata test below could pass on a photo that never had any.
    const meta = await sharp(original).metadata();
    expect(meta.exif).toBeDefined();
    const tags = exifTags(meta.exif!);
    expect(tags.ifd0).toContain(GPS_IFD_POINTER);
    expect(tags.gps.length).toBeGreaterThanOrEqual(4);
    expect(original.includes(Buffer.from('TestCam'))).toBe(true);
  });

  it('keeps no metadata at all, location included, in the photo or its thumbnail', async () => {
    const [row] = await testDb.db.select().from(photos).where(eq(photos.id, view.id));
    expect(row!.storageKey).toBe(`${clubId}/${withConsent}/${view.id}.jpg`);
    expect(row!.thumbKey).toBe(`${clubId}/${withConsent}/${view.id}-thumb.jpg`);
    for (const key of [row!.storageKey, row!.thumbKey]) {
      const stored = await storage.get(key);
      expect(stored?.contentType).toBe('image/jpeg');
      const meta = await sharp(stored!.data).metadata();
      expect(meta.format).toBe('jpeg');
      expect(meta.exif).toBeUndefined();
      expect(meta.xmp).toBeUndefined();
      expect(meta.iptc).toBeUndefined();
      expect(meta.icc).toBeUndefined();
      expect(meta.orientation).toBeUndefined();
      expect(stored!.data.includes(Buffer.from('Exif\0'))).toBe(false);
      expect(stored!.data.includes(Buffer.from('TestCam'))).toBe(false);
    }
  });

  it('applies the orientation, fits 1600 px and makes a 320 px thumbnail', async () => {
    // Stored portrait 1200x2400 with orientation 6: displayed landscape, 2400x1200, scaled to 1600x800.
    expect([view.width, view.height]).toEqual([1600, 800]);
    const [row] = await testDb.db.select().from(photos).where(eq(photos.id, view.id));
    const full = await sharp((await storage.get(row!.storageKey))!.data).metadata();
    const thumb = await sharp((await storage.get(row!.thumbKey))!.data).metadata();
    expect([full.width, full.height]).toEqual([1600, 800]);
    expect([thumb.width, thumb.height]).toEqual([320, 160]);
  });

  it('never enlarges a small photo and accepts PNG, flattening transparency', async () => {
    const res = await upload(tester, withConsent, await pngWithAlpha(800, 600), { task: 'single-leg-squat-left', view: 'front' }, 'screenshot.png');
    expect(res.status).toBe(201);
    expect([res.body.width, res.body.height]).toEqual([800, 600]);
    const bytes = await tester.get(res.body.url).buffer(true);
    const meta = await sharp(bytes.body as Buffer).metadata();
    expect([meta.format, meta.hasAlpha]).toEqual(['jpeg', false]);
  });

  it('serves the bytes to club staff with a private cache header', async () => {
    const full = await tester.get(view.url).buffer(true);
    expect(full.status).toBe(200);
    expect(full.headers['content-type']).toBe('image/jpeg');
    expect(full.headers['cache-control']).toBe('no-store');
    expect((await sharp(full.body as Buffer).metadata()).width).toBe(1600);
    const thumb = await tester.get(view.thumbUrl).buffer(true);
    expect((await sharp(thumb.body as Buffer).metadata()).width).toBe(320);
    const physio = await signedInAgent(app, 'physio@riverside.test');
    expect((await physio.get(view.url)).status).toBe(200);
    expect((await tester.get(`/api/photos/${view.id}?size=huge`)).status).toBe(400);
  });

  it('never serves a photo to a parent or to another club', async () => {
    const parent = await signedInAgent(app, 'parent@riverside.test');
    expect((await parent.get(view.url)).status).toBe(403);
    expect((await upload(parent, withConsent, await pngWithAlpha())).status).toBe(403);
    const outsider = await signedInAgent(app, 'tester@hillside.test');
    expect((await outsider.get(view.url)).status).toBe(403);
    expect((await outsider.get(view.thumbUrl)).status).toBe(403);
    expect((await upload(outsider, withConsent, await pngWithAlpha())).status).toBe(403);
    expect((await tester.get('/api/photos/00000000-0000-4000-8000-000000000000')).status).toBe(404);
    expect((await tester.get('/api/photos/not-an-id')).status).toBe(404);
  });

  it('replaces the earlier photo of the same task and view, keeping it for history', async () => {
    const first = (await upload(tester, withConsent, await pngWithAlpha(), { task: 'racket-side-lunge', view: 'side' })).body as PhotoView;
    const second = (await upload(tester, withConsent, await pngWithAlpha(), { task: 'racket-side-lunge', view: 'side' })).body as PhotoView;
    const rows = await testDb.db.select().from(photos).where(eq(photos.assessmentId, withConsent));
    expect(rows.find((r) => r.id === first.id)!.replacedAt).toBeInstanceOf(Date);
    expect(rows.find((r) => r.id === second.id)!.replacedAt).toBeNull();
    const detail = (await tester.get(`/api/assessments/${withConsent}`)).body as AssessmentDetail;
    const lunge = detail.photos.filter((p) => p.taskId === 'racket-side-lunge');
    expect(lunge.map((p) => p.id)).toEqual([second.id]);
    // The replaced photo can still be opened from the history.
    expect((await tester.get(first.url)).status).toBe(200);
  });

  it('hides the photos already taken once the family withdraws consent, and shows them again if it is given back', async () => {
    const before = (await tester.get(`/api/assessments/${withConsent}`)).body as AssessmentDetail;
    expect(before.photos.length).toBeGreaterThan(0);
    const shown = before.photos[0]!;
    const athleteId = before.athlete.id;

    await testDb.db
      .insert(consents)
      .values({ athleteId, kind: 'photos', granted: false, decidedOn: '2026-11-30', createdAt: new Date('2030-01-01T00:00:00Z') });
    const hidden = await tester.get(shown.url);
    expect(hidden.status).toBe(403);
    expect(hidden.body.error.code).toBe('no_photo_consent');
    expect((await tester.get(shown.thumbUrl)).status).toBe(403);
    const after = (await tester.get(`/api/assessments/${withConsent}`)).body as AssessmentDetail;
    expect(after.athlete.photoConsent).toBe(false);
    expect(after.photos).toEqual([]);
    // The landmarks and results are numbers, not images: they stay.
    expect(after.draft).toEqual(before.draft);

    await testDb.db.insert(consents).values({ athleteId, kind: 'photos', granted: true, decidedOn: '2026-12-01', createdAt: new Date('2030-01-02T00:00:00Z') });
    expect((await tester.get(shown.url)).status).toBe(200);
  });
});
