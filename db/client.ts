import { drizzle, type NodePgDatabase } from 'drizzle-orm/node-postgres';
import { migrate } from 'drizzle-orm/node-postgres/migrator';
import path from 'node:path';
import { Client, type ClientConfig, Pool } from 'pg';
import * as schema from './schema';

export type Db = NodePgDatabase<typeof schema>;
export type DbHandle = { db: Db; pool: Pool; close(): Promise<void> };

export const MIGRATIONS_DIR = path.join(__dirname, '..', 'migrations');

/** Opening one connection (TCP and authentication). A stopped database refuses at once; this bounds an unreachable host. */
export const CONNECT_TIMEOUT_MS = 5_000;
/**
 * Waiting for a free connection when all of the pool's are in use by other requests: a busy server,
 * not a database that is down. Requests queue this long, then get 503 `busy` (see
 * `isPoolBusy`). Our choice: longer than any single request takes under load, shorter than a client's
 * patience.
 */
export const POOL_WAIT_MS = 15_000;
/** The message pg-pool gives when the wait for a free connection ran out (it has no error code). */
export const POOL_WAIT_MESSAGE = 'timeout exceeded when trying to connect';

/**
 * pg-pool uses one setting, `connectionTimeoutMillis`, both for the wait in its queue and for opening
 * a connection, and both end in errors that read as "timeout". They are different things: a queue is
 * a busy server, a connection that cannot be opened is a database that is down or unreachable. So the
 * pool's setting is the queue wait and each client carries its own, shorter, connection timeout.
 */
class BoundedClient extends Client {
  constructor(config?: string | ClientConfig) {
    super({ ...(typeof config === 'string' ? { connectionString: config } : config), connectionTimeoutMillis: CONNECT_TIMEOUT_MS });
  }
}

export function connect(url: string, max = 10, poolWaitMs = POOL_WAIT_MS): DbHandle {
  const pool = new Pool({
    connectionString: url,
    max,
    connectionTimeoutMillis: poolWaitMs,
    // Keep connections open through a quiet minute: reopening them under load costs a handshake each.
    idleTimeoutMillis: 60_000,
    Client: BoundedClient,
  });
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

type Queryable = { query<T>(config: { name: string; text: string; values: unknown[] }): Promise<{ rows: T[] }> };

/**
 * Runs one statement as a named prepared statement: PostgreSQL parses and plans it once per pooled
 * connection, not on every request, and the text is a constant, not rebuilt per request by the query
 * builder. For the statements every request runs (the session) and the heavy reads (progress). `db` is
 * the Drizzle database (its pool) or, inside a transaction, the transaction (its own connection).
 */
export async function preparedRows<T>(db: object, name: string, text: string, values: unknown[]): Promise<T[]> {
  const holder = db as { $client?: Queryable; session?: { client?: Queryable } };
  const client = holder.$client ?? holder.session?.client;
  if (!client) throw new Error('preparedRows needs a node-postgres database or transaction.');
  return (await client.query<T>({ name, text, values })).rows;
}

/** Applies committed migrations; safe to run again. */
export async function runMigrations(db: Db): Promise<void> {
  await migrate(db, { migrationsFolder: MIGRATIONS_DIR });
}
