/**
 * Where assessment photos live. The API only talks to this interface so the
 * same routes run against a folder on a laptop and against S3 in production.
 */
export interface PhotoStorage {
  put(key: string, data: Buffer, contentType: string): Promise<void>;
  /** Resolves to null when nothing is stored under the key. */
  get(key: string): Promise<{ data: Buffer; contentType: string } | null>;
  /** Deleting a key that does not exist is not an error, as in S3. */
  delete(key: string): Promise<void>;
  readonly kind: 'local' | 's3';
}

export class InvalidStorageKeyError extends Error {
  readonly code = 'INVALID_STORAGE_KEY';

  constructor(
    readonly key: string,
    reason: string,
  ) {
    super(`Invalid storage key ${JSON.stringify(key)}: ${reason}`);
    this.name = 'InvalidStorageKeyError';
  }
}

// S3 caps keys at 1024 bytes; keeping the same cap locally means a key that
// works in development cannot fail only in production.
const MAX_KEY_BYTES = 1024;

// Keys are built from UUIDs and a file extension, so a narrow alphabet costs
// nothing and keeps keys safe as file names on every OS and in URLs.
const SEGMENT_PATTERN = /^[A-Za-z0-9_-][A-Za-z0-9._-]*$/;

/**
 * Throws InvalidStorageKeyError unless the key is a relative path such as
 * `club-uuid/assessment-uuid/photo-uuid.jpg`. Both implementations call this
 * first: locally a bad key could escape the uploads folder (path traversal),
 * and in S3 it would create objects no local run could read back.
 *
 * Segments may not start with '.', which also rules out '.' and '..'; the
 * local storage relies on that to keep its temp and sidecar files (which do
 * start with '.') from ever colliding with a stored photo.
 */
export function assertValidKey(key: string): void {
  if (typeof key !== 'string' || key.length === 0) {
    throw new InvalidStorageKeyError(String(key), 'key is empty');
  }
  if (Buffer.byteLength(key, 'utf8') > MAX_KEY_BYTES) {
    throw new InvalidStorageKeyError(key, `key is longer than ${MAX_KEY_BYTES} bytes`);
  }
  if (key.includes('\\')) {
    throw new InvalidStorageKeyError(key, 'backslashes are not allowed (path traversal)');
  }
  if (key.startsWith('/') || /^[A-Za-z]:/.test(key)) {
    throw new InvalidStorageKeyError(key, 'absolute paths are not allowed (path traversal)');
  }
  for (const segment of key.split('/')) {
    if (segment === '') {
      throw new InvalidStorageKeyError(key, 'empty path segments are not allowed');
    }
    if (segment === '..' || segment === '.') {
      throw new InvalidStorageKeyError(key, `'${segment}' segments are not allowed (path traversal)`);
    }
    if (!SEGMENT_PATTERN.test(segment)) {
      throw new InvalidStorageKeyError(
        key,
        `segment ${JSON.stringify(segment)} may contain only letters, digits, '.', '_' and '-' and must not start with '.'`,
      );
    }
  }
}

const CONTENT_TYPES_BY_EXTENSION: Readonly<Record<string, string>> = {
  jpg: 'image/jpeg',
  jpeg: 'image/jpeg',
  png: 'image/png',
  webp: 'image/webp',
  heic: 'image/heic',
  gif: 'image/gif',
};

export const DEFAULT_CONTENT_TYPE = 'application/octet-stream';

/** Best guess from the key's extension, for objects stored without a content type. */
export function contentTypeFromKey(key: string): string {
  const dot = key.lastIndexOf('.');
  if (dot === -1 || dot < key.lastIndexOf('/')) return DEFAULT_CONTENT_TYPE;
  return CONTENT_TYPES_BY_EXTENSION[key.slice(dot + 1).toLowerCase()] ?? DEFAULT_CONTENT_TYPE;
}
