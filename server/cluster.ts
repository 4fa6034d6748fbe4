// Several server processes on one host sharing one port (Node's cluster module): the primary accepts
// connections and hands them round-robin to its workers, each a full server (`main()` in index.ts)
// on the same database. Start with `node --import tsx server/cluster.ts`; SERVER_PROCESSES says how
// many (default: one per core). Everything the processes must share lives in PostgreSQL (sessions,
// rate limits, idempotency keys, the e-mail queue, draft versions): see the README's Deployment.
import cluster from 'node:cluster';
import os from 'node:os';

export type ClusterOptions = {
  processes: number;
  /** Runs in each worker. */
  worker: () => Promise<void>;
  log?: (message: string) => void;
};

/**
 * Forks `processes` workers. SIGTERM or SIGINT to the primary is passed to every worker, which drains
 * as a single process does (README: graceful shutdown); the primary exits when the last has. A worker
 * that ends on its own is replaced, at most once every 5 s, so a crash does not shrink the pool and a
 * worker that cannot start does not spin.
 */
export function runClustered({ processes, worker, log = (m) => process.stderr.write(`${m}\n`) }: ClusterOptions): void {
  if (!cluster.isPrimary) {
    worker().catch((error: unknown) => {
      log(`Squadline worker could not start: ${error instanceof Error ? error.message : String(error)}`);
      process.exit(1);
    });
    return;
  }
  let stopping = false;
  let lastRestart = 0;
  for (let i = 0; i < processes; i++) cluster.fork();
  cluster.on('exit', (w, code, signal) => {
    // The worker that ended may still be listed until it has also disconnected.
    const alive = Object.values(cluster.workers ?? {}).filter((x) => x && !x.isDead()).length;
    if (stopping) {
      if (alive === 0) process.exit(0);
      return;
    }
    log(`worker ${w.process.pid} ended (${signal ?? code}); starting another`);
    const wait = Math.max(0, lastRestart + 5_000 - Date.now());
    lastRestart = Date.now() + wait;
    setTimeout(() => {
      if (!stopping) cluster.fork();
    }, wait);
  });
  const stop = (signal: NodeJS.Signals) => {
    if (stopping) return;
    stopping = true;
    const workers = Object.values(cluster.workers ?? {});
    if (workers.length === 0) process.exit(0);
    for (const w of workers) w?.process.kill(signal === 'SIGINT' ? 'SIGINT' : 'SIGTERM');
  };
  process.on('SIGTERM', () => stop('SIGTERM'));
  process.on('SIGINT', () => stop('SIGINT'));
}

if (require.main === module) {
  const processes = Number(process.env.SERVER_PROCESSES ?? os.availableParallelism());
  if (!Number.isInteger(processes) || processes < 1) {
    process.stderr.write('SERVER_PROCESSES must be a whole number of at least 1.\n');
    process.exit(1);
  }
  // Imported here, not at the top: the primary only forks and passes signals, it opens no database.
  runClustered({ processes, worker: async () => (await import('./index')).main() });
}
