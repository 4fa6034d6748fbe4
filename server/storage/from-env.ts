import path from 'node:path';

import { createLocalStorage } from './local-storage';
import { createS3Storage } from './s3-storage';
import type { PhotoStorage } from './storage';

type Env = Readonly<Record<string, string | undefined>>;

/**
 * Builds the photo storage the environment asks for:
 * - `STORAGE_DRIVER=local` (default): files under `LOCAL_UPLOADS_DIR`, or
 *   `defaults.localDir` when unset.
 * - `STORAGE_DRIVER=s3`: `S3_BUCKET` and `S3_REGION` are required;
 *   `S3_ENDPOINT`, `S3_ACCESS_KEY_ID` + `S3_SECRET_ACCESS_KEY` (as a pair) and
 *   `S3_FORCE_PATH_STYLE=true|false` are optional.
 *
 * Misconfiguration throws at startup, naming the variables to fix, rather
 * than on the first photo upload.
 */
export function createStorageFromEnv(env: Env = process.env, defaults: { localDir: string }): PhotoStorage {
  const driver = read(env, 'STORAGE_DRIVER') ?? 'local';

  if (driver === 'local') {
    return createLocalStorage(path.resolve(read(env, 'LOCAL_UPLOADS_DIR') ?? defaults.localDir));
  }
  if (driver !== 's3') {
    throw new Error(`STORAGE_DRIVER must be "local" or "s3", got ${JSON.stringify(driver)}`);
  }

  const bucket = read(env, 'S3_BUCKET');
  const region = read(env, 'S3_REGION');
  const accessKeyId = read(env, 'S3_ACCESS_KEY_ID');
  const secretAccessKey = read(env, 'S3_SECRET_ACCESS_KEY');
  const endpoint = read(env, 'S3_ENDPOINT');
  const forcePathStyle = parseBoolean(env, 'S3_FORCE_PATH_STYLE');

  const missing = [
    ...(bucket === undefined ? ['S3_BUCKET'] : []),
    ...(region === undefined ? ['S3_REGION'] : []),
    // Half a key pair is always a mistake; silently falling back to the
    // SDK's credential chain would hide it until the first upload.
    ...(accessKeyId !== undefined && secretAccessKey === undefined ? ['S3_SECRET_ACCESS_KEY'] : []),
    ...(secretAccessKey !== undefined && accessKeyId === undefined ? ['S3_ACCESS_KEY_ID'] : []),
  ];
  if (bucket === undefined || region === undefined || missing.length > 0) {
    throw new Error(`STORAGE_DRIVER=s3 needs ${missing.join(', ')} to be set`);
  }

  return createS3Storage({ bucket, region, endpoint, accessKeyId, secretAccessKey, forcePathStyle });
}

// Empty values count as unset: env files and compose files often carry
// `S3_ENDPOINT=` lines for variables that do not apply.
function read(env: Env, name: string): string | undefined {
  const value = env[name]?.trim();
  return value === undefined || value === '' ? undefined : value;
}

function parseBoolean(env: Env, name: string): boolean | undefined {
  const value = read(env, name)?.toLowerCase();
  if (value === undefined) return undefined;
  if (value === 'true' || value === '1') return true;
  if (value === 'false' || value === '0') return false;
  throw new Error(`${name} must be "true" or "false", got ${JSON.stringify(env[name])}`);
}
