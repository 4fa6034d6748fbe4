// The server as `npm start` runs it, plus what only the load benchmark needs: a bare route (the
// baseline every figure is compared with), the process's peak memory, and the worker's pid on each
// answer. With BENCH_PROCESSES > 1 it forks that many processes sharing the port with server/cluster.ts
// (Node's cluster module: the primary hands connections round-robin), as `SERVER_PROCESSES` does.
import { runClustered } from '@/server/cluster';
import { main } from '@/server/index';

const processes = Number(process.env.BENCH_PROCESSES ?? 1);

function worker() {
  return main({
    mount(root) {
      root.use((_req, res, next) => {
        res.setHeader('X-Bench-Pid', String(process.pid));
        next();
      });
      root.get('/bench/bare', (_req, res) => {
        res.json({ ok: true });
      });
      root.get('/bench/memory', (_req, res) => {
        res.json({ pid: process.pid, peakRssBytes: process.resourceUsage().maxRSS * 1024, rssBytes: process.memoryUsage().rss });
      });
    },
  });
}

// Several processes: the production cluster entry's own code (server/cluster.ts), with this worker.
if (processes > 1) runClustered({ processes, worker });
else
  worker().catch((error: unknown) => {
    process.stderr.write(`bench server could not start: ${String(error)}\n`);
    process.exit(1);
  });
