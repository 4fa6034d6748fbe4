import { index, integer, jsonb, pgTable, primaryKey, text, timestamp, uuid } from 'drizzle-orm/pg-core';
import { users } from './auth';

/**
 * Requests sent with an `Idempotency-Key` header (a phone retrying after a dropped connection, the
 * offline sync replaying its queue): the first one runs and its answer is kept here for a day; a
 * retry with the same key gets that answer again instead of running twice. See server/http/idempotency.ts.
 */
export const idempotencyKeys = pgTable(
  'idempotency_keys',
  {
    userId: uuid('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    key: text('key').notNull(),
    method: text('method').notNull(),
    path: text('path').notNull(),
    /** SHA-256 of method, path and JSON body: the same key with another request is refused. */
    fingerprint: text('fingerprint').notNull(),
    /** Null while the first request is still running. */
    status: integer('status'),
    response: jsonb('response'),
    createdAt: timestamp('created_at', { withTimezone: true, mode: 'date' }).notNull().defaultNow(),
  },
  (t) => [primaryKey({ columns: [t.userId, t.key] }), index('idempotency_keys_created_idx').on(t.createdAt)],
);
