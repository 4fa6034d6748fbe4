import { randomUUID } from 'node:crypto';
import { mkdir, readFile, rename, rm, writeFile } from 'node:fs/promises';
import path from 'node:path';

import { assertValidKey, contentTypeFromKey, type PhotoStorage } from './storage';

interface SidecarMeta {
  contentType: string;
}

/**
 * Stores photos as files under rootDir, mirroring the key's folders
 * (`rootDir/club/assessment/photo.jpg`). Meant for development and tests; the
 * repo's git-ignored `uploads-fake/` is the usual root.
 *
 * The content type goes in a hidden sidecar (`.photo.jpg.meta.json`) so get()
 * returns exactly what put() was given. Valid keys never start a segment with
 * '.', so sidecars and temp files cannot collide with a photo.
 */
export function createLocalStorage(rootDir: string): PhotoStorage {
  const root = path.resolve(rootDir);

  function pathsFor(key: string): { file: string; meta: string } {
    assertValidKey(key);
    const file = path.resolve(root, ...key.split('/'));
    // assertValidKey already refuses traversal; this second check keeps the
    // guarantee even if the key rules are loosened later.
    const relative = path.relative(root, file);
    if (relative === '' || relative.startsWith('..') || path.isAbsolute(relative)) {
      throw new Error(`Storage key ${JSON.stringify(key)} resolves outside ${root}`);
    }
    return { file, meta: path.join(path.dirname(file), `.${path.basename(file)}.meta.json`) };
  }

  return {
    kind: 'local',

    async put(key, data, contentType) {
      const { file, meta } = pathsFor(key);
      await mkdir(path.dirname(file), { recursive: true });
      await writeAtomically(file, data);
      await writeAtomically(meta, JSON.stringify({ contentType } satisfies SidecarMeta));
    },

    async get(key) {
      const { file, meta } = pathsFor(key);
      const data = await readIfExists(file);
      if (data === null) return null;
      return { data, contentType: (await readContentType(meta)) ?? contentTypeFromKey(key) };
    },

    async delete(key) {
      const { file, meta } = pathsFor(key);
      // Photo first: if we stop halfway, a stray sidecar is harmless, while a
      // photo without its sidecar would still be served (with a guessed type).
      await rm(file, { force: true });
      await rm(meta, { force: true });
    },
  };
}

// A reader never sees a half-written photo: rename within one folder is
// atomic, so the file is either the old version or the complete new one.
async function writeAtomically(target: string, data: Buffer | string): Promise<void> {
  const temp = path.join(path.dirname(target), `.${path.basename(target)}.${randomUUID()}.tmp`);
  try {
    await writeFile(temp, data);
    await rename(temp, target);
  } catch (error) {
    await rm(temp, { force: true });
    throw error;
  }
}

async function readIfExists(file: string): Promise<Buffer | null> {
  try {
    return await readFile(file);
  } catch (error) {
    if (isErrnoException(error) && error.code === 'ENOENT') return null;
    throw error;
  }
}

// A missing or unreadable sidecar (a file copied in by hand, an interrupted
// put) falls back to the extension instead of failing the request.
async function readContentType(metaFile: string): Promise<string | null> {
  const raw = await readIfExists(metaFile);
  if (raw === null) return null;
  try {
    const parsed: unknown = JSON.parse(raw.toString('utf8'));
    if (typeof parsed === 'object' && parsed !== null && 'contentType' in parsed) {
      const { contentType } = parsed;
      if (typeof contentType === 'string' && contentType !== '') return contentType;
    }
  } catch {
    // Corrupt sidecar: same fallback as a missing one.
  }
  return null;
}

function isErrnoException(error: unknown): error is NodeJS.ErrnoException {
  return error instanceof Error && 'code' in error;
}
