import { integer, pgTable, text, timestamp } from 'drizzle-orm/pg-core';

/**
 * Counters of the rate limits (failed sign-ins per account and per address, reset requests per e-mail
 * and per address). Kept in PostgreSQL so a limit holds across every server process. One row per key
 * and fixed window; `key` names the limit and what it counts, e.g. `sign-in:account:<e-mail hash>`.
 */
export const rateLimits = pgTable('rate_limits', {
  key: text('key').primaryKey(),
  windowStartedAt: timestamp('window_started_at', { withTimezone: true, mode: 'date' }).notNull(),
  count: integer('count').notNull(),
});
