import { index, pgTable, text, timestamp } from 'drizzle-orm/pg-core';

/**
 * Every file written to photo storage, logged before the write. A file whose database row never came
 * (a crash, a failed second write) is found here and removed by the sweep in
 * `server/storage/orphan-sweep.ts`; files that did get their row just leave the log.
 */
export const storageWrites = pgTable(
  'storage_writes',
  {
    key: text('key').primaryKey(),
    writtenAt: timestamp('written_at', { withTimezone: true, mode: 'date' }).notNull().defaultNow(),
  },
  (t) => [index('storage_writes_written_at_idx').on(t.writtenAt)],
);
