import { drizzle, type NodePgDatabase } from 'drizzle-orm/node-postgres';
import { migrate } from 'drizzle-orm/node-postgres/migrator';
import path from 'node:path';
import { Pool } from 'pg';
import * as schema from './schema';

export type Db = NodePgDatabase<typeof schema>;
export type DbHandle = { db: Db; pool: Pool; close(): Promise<void> };

export const MIGRATIONS_DIR = path.join(__dirname, '..', 'migrations');

export function connect(url: string, max = 10): DbHandle {
  // Never wait forever for a connection: a stopped database refuses at once (the request answers 503);
  // the timeout also bounds the wait for a free pool slot, so it is generous enough for a busy server.
  const pool = new Pool({ connectionString: url, max, connectionTimeoutMillis: 5_000 });
  // An idle client losing its connection (the database restarting or stopping) must not crash the
  // process; the next query reconnects or fails with its own error.
  pool.on('error', (err) => process.stderr.write(`database connection lost: ${err.message}\n`));
  // A client checked out by a transaction, idle between two statements when the server goes away,
  // emits 'error' on itself; without a listener that would end the process. The statement that uses
  // it next fails and the request answers 503.
  pool.on('connect', (client) => {
    client.on('error', (err) => process.stderr.write(`database connection lost (in use): ${err.message}\n`));
  });
  const db = drizzle(pool, { schema });
  return { db, pool, close: () => pool.end() };
}

/** Applies committed migrations; safe to run again. */
export async function runMigrations(db: Db): Promise<void> {
  await migrate(db, { migrationsFolder: MIGRATIONS_DIR });
}
