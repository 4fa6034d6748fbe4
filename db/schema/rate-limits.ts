import { integer, pgTable, text, timestamp } from 'drizzle-orm/pg-core';

/**
 * Hit counters of the sign-in rate limits, shared by every server process (a counter kept in one
 * process's memory would let each process grant the full limit). See server/http/rate-limit-store.ts.
 */
export const rateLimitHits = pgTable('rate_limit_hits', {
  key: text('key').primaryKey(),
  hits: integer('hits').notNull(),
  resetAt: timestamp('reset_at', { withTimezone: true, mode: 'date' }).notNull(),
});
