import { createServer } from 'node:http';
import { env } from './config/env';
import { createApp } from './app';
import { closeDatabase, databaseBusy } from './db/sequelize';
import { cachesUsable } from './services/change-feed';
import { rememberListeningPort } from './services/app-link';
import { startOutboxWorker } from './services/outbox';

/**
 * One server process: the app on the configured port, shut down gracefully on SIGTERM/SIGINT.
 * Run alone (one worker) or as one of npm start's workers (server/index.ts, node:cluster), which
 * share the port.
 */
export function runWorker(label: string): void {
  const config = env();
  const { app, close, ready } = createApp();
  const server = createServer(app);
  // Mail that could not go at once is retried from the outbox (shared safely with other processes).
  const outbox = startOutboxWorker();
  server.keepAliveTimeout = 65_000;

  // Requests still being handled; shutdown waits for them before closing the database.
  let inFlight = 0;
  server.on('request', (_req, res) => {
    inFlight++;
    res.once('close', () => inFlight--);
  });

  server.listen(config.PORT, config.HOST, () => {
    const address = server.address();
    const port = typeof address === 'object' && address ? address.port : config.PORT;
    // Outside production (no APP_URL), the links in mail point at this port.
    rememberListeningPort(port);
    console.log(`[isobath] ${label} serving on http://localhost:${port} (${config.NODE_ENV}, process ${process.pid})`);
    void ready.then(() => console.log(`[isobath] process ${process.pid} ${cachesUsable() ? 'listening for changes' : 'not yet listening for changes: serving uncached'}`));
  });

  // A handler whose client has gone may still be working: wait for open responses and for
  // database work to end (at most until the deadline) before closing the pools.
  const settle = async (deadline: number) => {
    while ((inFlight > 0 || databaseBusy() > 0) && Date.now() < deadline) await new Promise((r) => setTimeout(r, 25));
  };

  // Graceful shutdown: stop accepting, let in-flight requests finish, then close pools.
  let stopping = false;
  async function shutdown(signal: string) {
    if (stopping) return;
    stopping = true;
    console.log(`[isobath] ${label} ${signal}: finishing in-flight requests`);
    const force = setTimeout(() => process.exit(1), 10_000);
    force.unref();
    server.close(async () => {
      await settle(Date.now() + 5_000);
      await outbox.stop();
      await close();
      await closeDatabase();
      process.exit(0);
    });
    server.closeIdleConnections();
  }
  process.on('SIGTERM', () => void shutdown('SIGTERM'));
  process.on('SIGINT', () => void shutdown('SIGINT'));
}
