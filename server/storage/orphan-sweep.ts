import { inArray, lt, or, sql } from 'drizzle-orm';
import type { Logger } from 'pino';
import type { Db } from '@/db/client';
import { photos, storageWrites } from '@/db/schema';
import type { PhotoStorage } from './storage';

/**
 * A storage whose writes are logged in `storage_writes` first, so a file written without its database
 * row (a crash between the two, a failed second write) can be found and removed by `sweepOrphans`.
 */
export function loggedWrites(db: Db, storage: PhotoStorage): PhotoStorage {
  return {
    kind: storage.kind,
    get: (key) => storage.get(key),
    delete: (key) => storage.delete(key),
    async put(key, data, contentType) {
      await db.insert(storageWrites).values({ key }).onConflictDoNothing();
      await storage.put(key, data, contentType);
    },
  };
}

/** An upload older than this has either its row by now or none ever: our choice, far above any upload. */
export const ORPHAN_GRACE_MS = 60 * 60 * 1000;

/**
 * Removes stored files that have no database row, once they are older than `graceMs`: claims the old
 * log entries (delete ... returning, so two processes never claim the same entry), keeps the files a
 * photo row points at, deletes the others. Returns the keys removed.
 */
export async function sweepOrphans(db: Db, storage: PhotoStorage, options: { graceMs?: number; logger?: Logger } = {}) {
  const cutoff = new Date(Date.now() - (options.graceMs ?? ORPHAN_GRACE_MS));
  const claimed = await db.delete(storageWrites).where(lt(storageWrites.writtenAt, cutoff)).returning({ key: storageWrites.key });
  if (claimed.length === 0) return [];
  const keys = claimed.map((c) => c.key);
  const kept = await db
    .select({ storageKey: photos.storageKey, thumbKey: photos.thumbKey })
    .from(photos)
    .where(or(inArray(photos.storageKey, keys), inArray(photos.thumbKey, keys)));
  const referenced = new Set(kept.flatMap((k) => [k.storageKey, k.thumbKey]));
  const orphans = keys.filter((k) => !referenced.has(k));
  for (const key of orphans) {
    try {
      await storage.delete(key);
    } catch (err) {
      // Logged again so the next sweep retries it.
      await db
        .insert(storageWrites)
        .values({ key, writtenAt: sql`now() - interval '1 day'` })
        .onConflictDoNothing();
      options.logger?.warn({ err }, 'orphan photo file not removed; will retry');
    }
  }
  if (orphans.length > 0) options.logger?.info({ removed: orphans.length }, 'orphan photo files removed');
  return orphans;
}
