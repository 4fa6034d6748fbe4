// The server as `npm start` runs it, plus what only the load benchmark needs: a bare route (the
// baseline every figure is compared with), the process's peak memory, and the worker's pid on each
// answer. With BENCH_PROCESSES > 1 it forks that many processes sharing the port (Node's cluster
// module: the primary hands connections round-robin), as several processes behind a load balancer.
import cluster from 'node:cluster';
import { main } from '@/server/index';

const processes = Number(process.env.BENCH_PROCESSES ?? 1);

if (processes > 1 && cluster.isPrimary) {
  for (let i = 0; i < processes; i++) cluster.fork();
  let exited = 0;
  cluster.on('exit', () => {
    exited += 1;
    if (exited === processes) process.exit(0);
  });
  const stop = () => {
    for (const w of Object.values(cluster.workers ?? {})) w?.kill('SIGTERM');
  };
  process.on('SIGTERM', stop);
  process.on('SIGINT', stop);
} else {
  main({
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
  }).catch((error: unknown) => {
    process.stderr.write(`bench server could not start: ${String(error)}\n`);
    process.exit(1);
  });
}
