import { sweepSessions } from './auth/session';
import { createDatabase } from './db';
import { loadConfig } from './env';
import { createApp } from './app';
import { createHttpServer } from './http-server';
import { sweepRateLimits } from './middleware/rate-limit';
import { createMailer } from './services/mailer';
import { startNotificationWorker } from './services/notifications';
import { createSheetEvents } from './services/sheet-events';

/** Production entry point: connect, listen, and shut down cleanly on SIGTERM or SIGINT. */
async function main() {
  const config = loadConfig();
  const sequelize = createDatabase(config);
  await sequelize.authenticate();
  const mailer = createMailer(config.smtp);
  const events = createSheetEvents(config.databaseUrl);
  const app = createApp({ config, sequelize, mailer, events });
  const notificationWorker = startNotificationWorker(sequelize, mailer);
  // Every process sweeps expired sessions and rate-limit counters once a minute: two idempotent deletes on indexes.
  const sweeper = setInterval(() => {
    Promise.all([sweepSessions(sequelize), sweepRateLimits(sequelize)]).catch((error: unknown) => {
      console.warn('[trimsheet] sweeping expired sessions and counters:', error instanceof Error ? error.message : error);
    });
  }, 60_000);
  let closing = false;
  // Once shutting down, a request on a kept-alive connection (an event stream reconnecting) gets 503.
  const server = createHttpServer(config, app, () => closing);
  server.listen(config.port, config.host, () => {
    console.log(`[trimsheet] serving ${config.publicUrl}`);
  });
  server.on('error', (error: NodeJS.ErrnoException) => {
    const reason =
      error.code === 'EADDRINUSE' ? `port ${config.port} on ${config.host} is already in use (set PORT to another)` : error.message;
    console.error(`[trimsheet] could not listen: ${reason}`);
    process.exit(1);
  });
  const shutdown = () => {
    if (closing) return;
    closing = true;
    clearInterval(sweeper);
    // Open event streams would hold server.close() until they end: end them first.
    const eventsClosed = events.close();
    server.close(() => {
      void notificationWorker
        .stop()
        .then(() => {
          mailer.close();
          return Promise.all([eventsClosed, sequelize.close()]);
        })
        .then(() => process.exit(0));
    });
    // Connections still open after 5 s are cut; say so in the exit code.
    setTimeout(() => process.exit(1), 5000);
  };
  process.on('SIGTERM', shutdown);
  process.on('SIGINT', shutdown);
}

main().catch((error: unknown) => {
  console.error('[trimsheet] could not start:', error);
  process.exit(1);
});
