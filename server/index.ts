import cluster from 'node:cluster';
import { workerCount } from './config/env';
import { runWorker } from './worker';

/**
 * npm start's server: WEB_CONCURRENCY worker processes (default: one per core) sharing the port
 * through node:cluster. Each worker is a whole app with its own caches; the change feed keeps
 * them true to the database (server/services/change-feed.ts), and whatever must be shared
 * (sessions, the sign-in throttle, the mail outbox) lives in PostgreSQL. SIGTERM or SIGINT stops
 * every worker gracefully (each finishes its in-flight requests); a worker that dies otherwise
 * is replaced. With one worker, the app runs in this process.
 */
const workers = workerCount();

if (workers === 1 || !cluster.isPrimary) {
  runWorker(cluster.isPrimary ? 'server' : `worker ${cluster.worker!.id}`);
} else {
  console.log(`[isobath] starting ${workers} workers (WEB_CONCURRENCY=${process.env.WEB_CONCURRENCY ?? `unset: one per core`})`);
  let stopping = false;
  let failed = false;
  const fork = () => cluster.fork();
  for (let i = 0; i < workers; i++) fork();
  cluster.on('exit', (worker, code, signal) => {
    if (stopping) {
      // Ended by the signal itself (a worker still starting has no handler yet): stopped as asked.
      if (code !== 0 && !(code === null && signal)) failed = true;
      if (Object.keys(cluster.workers ?? {}).length === 0) process.exit(failed ? 1 : 0);
      return;
    }
    console.log(`[isobath] worker ${worker.id} (process ${worker.process.pid}) exited (${signal ?? code}); starting another`);
    setTimeout(fork, 500).unref();
  });
  const stop = (signal: NodeJS.Signals) => {
    if (stopping) return;
    stopping = true;
    console.log(`[isobath] ${signal}: stopping ${Object.keys(cluster.workers ?? {}).length} workers`);
    for (const w of Object.values(cluster.workers ?? {})) w?.process.kill(signal);
    // A worker that does not finish in time is ended by its own 10 s guard; this one is the last resort.
    setTimeout(() => process.exit(1), 15_000).unref();
  };
  process.on('SIGTERM', () => stop('SIGTERM'));
  process.on('SIGINT', () => stop('SIGINT'));
}
