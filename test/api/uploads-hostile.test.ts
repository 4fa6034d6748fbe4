// Hostile photo uploads: each refused with a clear message in the usual error shape, nothing stored,
// the server still answering afterwards, and memory bounded (a decompression bomb is refused from its
// header, before any pixel is decoded).
import { sql } from 'drizzle-orm';
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { RoundDetail } from '@/features/screening/contract';
import { makeAthlete, makeClub, makeSquad, makeTestApp, makeUser, signedInAgent } from '../fixtures/builders';
import { memoryStorage, NOT_AN_IMAGE, pngWithAlpha, TOO_LARGE } from '../fixtures/photos';
import { pixelBombPng } from '../fixtures/pixel-bomb';
import { createTestDb, type TestDb } from '../fixtures/test-db';

let testDb: TestDb;
let app: ReturnType<typeof makeTestApp>['app'];
const storage = memoryStorage();
let tester: Awaited<ReturnType<typeof signedInAgent>>;
let assessmentId: string;

beforeAll(async () => {
  testDb = await createTestDb();
  ({ app } = makeTestApp(testDb.db, { storage }));
  const club = await makeClub(testDb.db, 'Upload Club');
  const squad = await makeSquad(testDb.db, club.id);
  await makeUser(testDb.db, { email: 'tester@upload.test', clubId: club.id, role: 'tester' });
  await makeAthlete(testDb.db, { clubId: club.id, squadId: squad.id });
  tester = await signedInAgent(app, 'tester@upload.test');
  const round = (await tester.post('/api/rounds').send({ squadId: squad.id, name: 'Uploads', screenedOn: '2026-09-14' })).body as RoundDetail;
  assessmentId = round.athletes[0]!.assessmentId;
});

afterAll(async () => {
  await testDb?.drop();
});

function upload(file: Buffer, filename = 'photo.jpg') {
  return tester
    .post(`/api/assessments/${assessmentId}/photos`)
    .field('task', 'two-leg-squat')
    .field('view', 'front')
    .attach('photo', file, { filename, contentType: 'image/jpeg' });
}

async function photoRows(): Promise<number> {
  const r = await testDb.db.execute<{ n: number }>(sql`select count(*)::int as n from photos`);
  return r.rows[0]!.n;
}

describe('hostile uploads', () => {
  let goodJpeg: Buffer;
  beforeAll(async () => {
    goodJpeg = await sharp(await pngWithAlpha(800, 600))
      .jpeg()
      .toBuffer();
  });

  it.each([
    ['a text file renamed .jpg', () => NOT_AN_IMAGE, 'photo.jpg', 415, 'unsupported_type', /not a photo we can read/],
    [
      'a JPEG cut off after a third of its bytes',
      () => goodJpeg.subarray(0, Math.floor(goodJpeg.length / 3)),
      'photo.jpg',
      400,
      'unreadable_photo',
      /damaged or cut short/,
    ],
    ['a JPEG cut off inside its header', () => goodJpeg.subarray(0, 40), 'photo.jpg', 415, 'unsupported_type', /not a photo we can read/],
    ['a zero-byte file', () => Buffer.alloc(0), 'photo.jpg', 400, 'invalid_input', /need attention/],
    ['a file over 12 MB', () => TOO_LARGE, 'photo.jpg', 413, 'too_large', /too large/],
    ['a file name with Windows folders', () => goodJpeg, '..\\..\\photo.jpg', 400, 'invalid_input', /need attention/],
  ] as const)('refuses %s clearly and stores nothing', async (_what, file, filename, status, code, message) => {
    const [files, rows] = [storage.objects.size, await photoRows()];
    const res = await upload(file(), filename);
    expect(res.status, JSON.stringify(res.body)).toBe(status);
    expect(res.body.error.code).toBe(code);
    expect(res.body.error.message).toMatch(message);
    expect(storage.objects.size).toBe(files);
    expect(await photoRows()).toBe(rows);
  });

  it('names the photo field when the file is empty or its name has folders', async () => {
    expect((await upload(Buffer.alloc(0))).body.error.fields).toHaveProperty('photo');
  });

  it('refuses a file name with folders (../) sent as the raw bytes a hostile client would write', async () => {
    // supertest trims folders from file names itself, so this multipart body is written by hand.
    const files = storage.objects.size;
    const head = (name: string, extra = '') => `--B\r\nContent-Disposition: form-data; name="${name}"${extra}\r\n`;
    const body = Buffer.concat([
      Buffer.from(
        `${head('task')}\r\ntwo-leg-squat\r\n${head('view')}\r\nfront\r\n${head('photo', '; filename="../../etc/photo.jpg"')}Content-Type: image/jpeg\r\n\r\n`,
      ),
      goodJpeg,
      Buffer.from('\r\n--B--\r\n'),
    ]);
    const res = await tester.post(`/api/assessments/${assessmentId}/photos`).set('Content-Type', 'multipart/form-data; boundary=B').send(body);
    expect(res.status, JSON.stringify(res.body)).toBe(400);
    expect(res.body.error.fields.photo).toMatch(/without folders/);
    expect(storage.objects.size).toBe(files);
  });

  it('refuses a 20,000 x 20,000 image packed in a small file from its header, with memory bounded', async () => {
    const bomb = await pixelBombPng(20_000, 20_000);
    expect(bomb.length).toBeLessThan(1024 * 1024); // a small file...
    const meta = await sharp(bomb, { limitInputPixels: false }).metadata();
    expect([meta.width, meta.height]).toEqual([20_000, 20_000]); // ...that really is 400 megapixels
    global.gc?.();
    const rssBefore = process.memoryUsage().rss;
    const files = storage.objects.size;
    const res = await upload(bomb, 'bomb.png');
    const grown = process.memoryUsage().rss - rssBefore;
    expect(res.status).toBe(413);
    expect(res.body.error.code).toBe('too_many_pixels');
    expect(res.body.error.message).toMatch(/20000 x 20000 pixels/);
    // Decoding it would take 400 MB (one byte per pixel); refusing it takes almost nothing.
    expect(grown).toBeLessThan(150 * 1024 * 1024);
    expect(storage.objects.size).toBe(files);
  });

  it('refuses malformed multipart bodies with 400', async () => {
    const cut = await tester
      .post(`/api/assessments/${assessmentId}/photos`)
      .set('Content-Type', 'multipart/form-data; boundary=B')
      .send(
        '--B\r\nContent-Disposition: form-data; name="task"\r\n\r\ntwo-leg-squat\r\n--B\r\nContent-Disposition: form-data; name="photo"; filename="p.jpg"\r\n\r\n\xff\xd8\xff',
      );
    expect(cut.status).toBe(400);
    const garbageHeaders = await tester
      .post(`/api/assessments/${assessmentId}/photos`)
      .set('Content-Type', 'multipart/form-data; boundary=B')
      .send('--B\r\nthis is not a header\r\n\r\nx\r\n--B--\r\n');
    expect(garbageHeaders.status).toBeGreaterThanOrEqual(400);
    expect(garbageHeaders.status).toBeLessThan(500);
    const twoFiles = await tester
      .post(`/api/assessments/${assessmentId}/photos`)
      .field('task', 'two-leg-squat')
      .field('view', 'front')
      .attach('photo', goodJpeg, 'a.jpg')
      .attach('photo', goodJpeg, 'b.jpg');
    expect(twoFiles.status).toBe(400);
    expect(twoFiles.body.error.message).toMatch(/one file/i);
  });

  it('still takes a good photo afterwards: the server stayed up', async () => {
    const rows = await photoRows();
    const res = await upload(goodJpeg, 'IMG_0001.jpg');
    expect(res.status).toBe(201);
    expect(await photoRows()).toBe(rows + 1);
  });
});
