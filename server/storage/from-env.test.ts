import path from 'node:path';

import { describe, expect, it } from 'vitest';

import { createStorageFromEnv } from './from-env';

const defaults = { localDir: path.join('uploads-fake') };

describe('createStorageFromEnv', () => {
  it('defaults to local storage', () => {
    expect(createStorageFromEnv({}, defaults).kind).toBe('local');
  });

  it('treats an empty STORAGE_DRIVER as unset', () => {
    expect(createStorageFromEnv({ STORAGE_DRIVER: '' }, defaults).kind).toBe('local');
  });

  it('builds S3 storage when the required variables are set', () => {
    const storage = createStorageFromEnv(
      {
        STORAGE_DRIVER: 's3',
        S3_BUCKET: 'photos',
        S3_REGION: 'eu-west-2',
        S3_ENDPOINT: 'http://127.0.0.1:9000',
        S3_ACCESS_KEY_ID: 'id',
        S3_SECRET_ACCESS_KEY: 'secret',
        S3_FORCE_PATH_STYLE: 'true',
      },
      defaults,
    );

    expect(storage.kind).toBe('s3');
  });

  it.each([
    [{ STORAGE_DRIVER: 's3' }, 'STORAGE_DRIVER=s3 needs S3_BUCKET, S3_REGION to be set'],
    [{ STORAGE_DRIVER: 's3', S3_BUCKET: 'photos' }, 'STORAGE_DRIVER=s3 needs S3_REGION to be set'],
    [{ STORAGE_DRIVER: 's3', S3_BUCKET: ' ', S3_REGION: 'eu-west-2' }, 'STORAGE_DRIVER=s3 needs S3_BUCKET to be set'],
    [{ STORAGE_DRIVER: 's3', S3_BUCKET: 'photos', S3_REGION: 'eu-west-2', S3_ACCESS_KEY_ID: 'id' }, 'STORAGE_DRIVER=s3 needs S3_SECRET_ACCESS_KEY to be set'],
    [
      { STORAGE_DRIVER: 's3', S3_BUCKET: 'photos', S3_REGION: 'eu-west-2', S3_SECRET_ACCESS_KEY: 'secret' },
      'STORAGE_DRIVER=s3 needs S3_ACCESS_KEY_ID to be set',
    ],
    [
      { STORAGE_DRIVER: 's3', S3_BUCKET: 'photos', S3_REGION: 'eu-west-2', S3_FORCE_PATH_STYLE: 'yes' },
      'S3_FORCE_PATH_STYLE must be "true" or "false", got "yes"',
    ],
    [{ STORAGE_DRIVER: 'gcs' }, 'STORAGE_DRIVER must be "local" or "s3", got "gcs"'],
  ])('refuses %j', (env, message) => {
    expect(() => createStorageFromEnv(env, defaults)).toThrow(message);
  });
});
