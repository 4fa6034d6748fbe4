import { createHash } from 'node:crypto';
import { sql } from 'drizzle-orm';
import type { Options, Store } from 'express-rate-limit';
import type { Db } from '@/db/client';

/**
 * An express-rate-limit store in PostgreSQL (table `rate_limit_hits`), so several server processes
 * count the same attempts: eight wrong passwords are eight, whichever process saw them. One statement
 * per hit; a window that ran out starts again at 1.
 */
export function postgresRateLimitStore(db: Db, prefix: string): Store {
  let windowMs = 60_000;
  // Keys carry what the client typed (an e-mail address): hashed, so any text fits a key, NUL included.
  const k = (key: string) => `${prefix}:${createHash('sha256').update(key).digest('hex')}`;
  return {
    prefix,
    localKeys: false,
    init(options: Options) {
      windowMs = options.windowMs;
    },
    async increment(key) {
      const { rows } = await db.execute<{ hits: number; reset_at: Date | string }>(sql`
        insert into rate_limit_hits (key, hits, reset_at)
        values (${k(key)}, 1, now() + ${windowMs} * interval '1 millisecond')
        on conflict (key) do update set
          hits = case when rate_limit_hits.reset_at <= now() then 1 else rate_limit_hits.hits + 1 end,
          reset_at = case when rate_limit_hits.reset_at <= now() then now() + ${windowMs} * interval '1 millisecond' else rate_limit_hits.reset_at end
        returning hits, reset_at`);
      const row = rows[0]!;
      return { totalHits: row.hits, resetTime: new Date(row.reset_at) };
    },
    async decrement(key) {
      await db.execute(sql`update rate_limit_hits set hits = greatest(hits - 1, 0) where key = ${k(key)}`);
    },
    async resetKey(key) {
      await db.execute(sql`delete from rate_limit_hits where key = ${k(key)}`);
    },
  };
}
