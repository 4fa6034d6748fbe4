import { afterAll, beforeAll, describe, expect, it } from 'vitest';

import { startFakeS3, type FakeS3 } from './fake-s3';
import { createS3Storage } from './s3-storage';
import { InvalidStorageKeyError, type PhotoStorage } from './storage';

const BUCKET = 'squadline-photos';
const KEY = 'club-1/assessment-2/photo-3.jpg';

describe('createS3Storage against a fake S3 server', () => {
  let fake: FakeS3;
  let storage: PhotoStorage;

  beforeAll(async () => {
    fake = await startFakeS3({ buckets: [BUCKET] });
    storage = createS3Storage({
      bucket: BUCKET,
      region: 'eu-west-2',
      endpoint: fake.endpoint,
      accessKeyId: 'test-key',
      secretAccessKey: 'test-secret',
      forcePathStyle: true,
    });
  });

  afterAll(async () => {
    await fake.close();
  });

  it('puts an object with a signed, path-style request and gets it back', async () => {
    const data = Buffer.from([0xff, 0xd8, 0xff, 0xe0, 0x00, 0x10]);

    await storage.put(KEY, data, 'image/jpeg');

    expect(storage.kind).toBe('s3');
    expect(fake.object(BUCKET, KEY)).toEqual({ data, contentType: 'image/jpeg' });
    const put = fake.requests().find((request) => request.method === 'PUT');
    expect(put?.path).toBe(`/${BUCKET}/${KEY}`);
    expect(put?.headers.authorization).toContain('Credential=test-key/');
    // Custom endpoints get checksums only when required (see s3-storage.ts).
    expect(put?.headers['x-amz-checksum-crc32']).toBeUndefined();
    expect(await storage.get(KEY)).toEqual({ data, contentType: 'image/jpeg' });
  });

  it('returns null for a missing key', async () => {
    expect(await storage.get('club-1/assessment-2/missing.jpg')).toBeNull();
  });

  it('deletes an object', async () => {
    await storage.put('club-1/a/to-delete.png', Buffer.from('x'), 'image/png');

    await storage.delete('club-1/a/to-delete.png');

    expect(fake.object(BUCKET, 'club-1/a/to-delete.png')).toBeUndefined();
    expect(await storage.get('club-1/a/to-delete.png')).toBeNull();
  });

  it('surfaces a missing bucket instead of treating it as a missing photo', async () => {
    const wrongBucket = createS3Storage({
      bucket: 'no-such-bucket',
      region: 'eu-west-2',
      endpoint: fake.endpoint,
      accessKeyId: 'test-key',
      secretAccessKey: 'test-secret',
      forcePathStyle: true,
    });

    await expect(wrongBucket.get(KEY)).rejects.toMatchObject({ name: 'NoSuchBucket' });
  });

  it('refuses a traversal key before sending anything', async () => {
    const before = fake.requests().length;

    await expect(storage.put('../x.jpg', Buffer.from('x'), 'image/jpeg')).rejects.toThrow(InvalidStorageKeyError);
    await expect(storage.get('/x.jpg')).rejects.toThrow(InvalidStorageKeyError);
    await expect(storage.delete('a//x.jpg')).rejects.toThrow(InvalidStorageKeyError);

    expect(fake.requests()).toHaveLength(before);
  });

  it('refuses half a key pair', () => {
    expect(() => createS3Storage({ bucket: BUCKET, region: 'eu-west-2', accessKeyId: 'only-id' })).toThrow(/both accessKeyId and secretAccessKey/);
  });
});
