import { createHash } from 'node:crypto';
import { sql } from 'drizzle-orm';
import type { Db } from '@/db/client';
import { rateLimits } from '@/db/schema';

export type Limit = { windowMs: number; max: number };

/** The limits of the sign-in and reset routes. Our choice, for a club of a few hundred accounts. */
export type AuthLimits = {
  /** Failed sign-ins of one account, from any address. */
  signInPerAccount: Limit;
  /** Failed sign-ins from one address, over every account (spraying one password). */
  signInPerAddress: Limit;
  /** Reset requests for one e-mail address, counted whether or not it has an account (a cooldown). */
  resetPerEmail: Limit;
  /** Reset requests, invitation acceptances and reset completions from one address. */
  linksPerAddress: Limit;
};

export const DEFAULT_AUTH_LIMITS: AuthLimits = {
  signInPerAccount: { windowMs: 15 * 60_000, max: 8 },
  signInPerAddress: { windowMs: 15 * 60_000, max: 40 },
  resetPerEmail: { windowMs: 15 * 60_000, max: 3 },
  linksPerAddress: { windowMs: 15 * 60_000, max: 30 },
};

/** E-mail addresses are hashed in keys: the table must not become a list of who tried to sign in. */
export const keyPart = (value: string) => createHash('sha256').update(value.trim().toLowerCase()).digest('hex').slice(0, 32);

/**
 * Fixed-window counters in PostgreSQL: one atomic upsert per hit, so every server process sees the
 * same count. `hit` counts and answers whether the caller is now over the limit; `over` only reads.
 */
export function rateLimiter(db: Db) {
  async function hit(key: string, limit: Limit, now = new Date()): Promise<boolean> {
    const windowStart = sql`${new Date(now.getTime() - limit.windowMs).toISOString()}::timestamptz`;
    const at = sql`${now.toISOString()}::timestamptz`;
    const [row] = await db
      .insert(rateLimits)
      .values({ key, windowStartedAt: now, count: 1 })
      .onConflictDoUpdate({
        target: rateLimits.key,
        set: {
          count: sql`case when ${rateLimits.windowStartedAt} <= ${windowStart} then 1 else ${rateLimits.count} + 1 end`,
          windowStartedAt: sql`case when ${rateLimits.windowStartedAt} <= ${windowStart} then ${at} else ${rateLimits.windowStartedAt} end`,
        },
      })
      .returning({ count: rateLimits.count });
    return row!.count > limit.max;
  }

  async function over(key: string, limit: Limit, now = new Date()): Promise<boolean> {
    const rows = await db
      .select({ count: rateLimits.count })
      .from(rateLimits)
      .where(sql`${rateLimits.key} = ${key} and ${rateLimits.windowStartedAt} > ${new Date(now.getTime() - limit.windowMs).toISOString()}::timestamptz`);
    return (rows[0]?.count ?? 0) >= limit.max;
  }

  /** Old windows are of no use: removed now and then so the table stays small. */
  async function prune(olderThanMs: number, now = new Date()) {
    await db.delete(rateLimits).where(sql`${rateLimits.windowStartedAt} < ${new Date(now.getTime() - olderThanMs).toISOString()}::timestamptz`);
  }

  return { hit, over, prune };
}

export type RateLimiter = ReturnType<typeof rateLimiter>;
