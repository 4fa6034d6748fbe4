import { mkdtemp, readdir, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';

import { afterEach, beforeEach, describe, expect, it } from 'vitest';

import { createLocalStorage } from './local-storage';
import { InvalidStorageKeyError, type PhotoStorage } from './storage';

const KEY = 'club-1/assessment-2/photo-3.jpg';

describe('createLocalStorage', () => {
  let root: string;
  let storage: PhotoStorage;

  beforeEach(async () => {
    root = await mkdtemp(path.join(tmpdir(), 'squadline-storage-'));
    storage = createLocalStorage(root);
  });

  afterEach(async () => {
    await rm(root, { recursive: true, force: true });
  });

  it('returns what was put, with its content type', async () => {
    const data = Buffer.from([0xff, 0xd8, 0xff, 0x00, 0x42]);

    await storage.put(KEY, data, 'image/jpeg');

    expect(storage.kind).toBe('local');
    expect(await storage.get(KEY)).toEqual({ data, contentType: 'image/jpeg' });
  });

  it('keeps the content type given to put even when the extension says otherwise', async () => {
    await storage.put('club-1/a/photo.bin', Buffer.from('x'), 'image/webp');

    expect((await storage.get('club-1/a/photo.bin'))?.contentType).toBe('image/webp');
  });

  it('overwrites an existing photo and leaves no temp files behind', async () => {
    await storage.put(KEY, Buffer.from('first'), 'image/jpeg');
    await storage.put(KEY, Buffer.from('second'), 'image/png');

    expect(await storage.get(KEY)).toEqual({ data: Buffer.from('second'), contentType: 'image/png' });
    const files = await readdir(path.join(root, 'club-1', 'assessment-2'));
    expect(files.sort()).toEqual(['.photo-3.jpg.meta.json', 'photo-3.jpg']);
  });

  it('returns null for a key that was never stored', async () => {
    expect(await storage.get('club-1/assessment-2/missing.jpg')).toBeNull();
  });

  it('falls back to the extension when the sidecar is missing', async () => {
    await storage.put(KEY, Buffer.from('x'), 'image/jpeg');
    await rm(path.join(root, 'club-1', 'assessment-2', '.photo-3.jpg.meta.json'));

    expect((await storage.get(KEY))?.contentType).toBe('image/jpeg');
  });

  it('falls back to the extension when the sidecar is corrupt', async () => {
    await storage.put('club-1/a/photo.png', Buffer.from('x'), 'image/png');
    await writeFile(path.join(root, 'club-1', 'a', '.photo.png.meta.json'), '{not json');

    expect((await storage.get('club-1/a/photo.png'))?.contentType).toBe('image/png');
  });

  it('deletes the photo and its sidecar, and deleting again is not an error', async () => {
    await storage.put(KEY, Buffer.from('x'), 'image/jpeg');

    await storage.delete(KEY);
    await storage.delete(KEY);

    expect(await storage.get(KEY)).toBeNull();
    expect(await readdir(path.join(root, 'club-1', 'assessment-2'))).toEqual([]);
  });

  it.each(['../escape.jpg', 'club-1/../../escape.jpg', '/tmp/escape.jpg', 'club-1\\escape.jpg', 'club-1//x.jpg'])(
    'refuses the traversal key %j on put, get and delete without touching the disk',
    async (key) => {
      await expect(storage.put(key, Buffer.from('x'), 'image/jpeg')).rejects.toThrow(InvalidStorageKeyError);
      await expect(storage.get(key)).rejects.toThrow(InvalidStorageKeyError);
      await expect(storage.delete(key)).rejects.toThrow(InvalidStorageKeyError);
      expect(await readdir(root)).toEqual([]);
      expect(await readdir(path.dirname(root))).not.toContain('escape.jpg');
    },
  );
});
