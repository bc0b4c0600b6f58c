import http from 'node:http';
import { createDatabase } from './db';
import { loadConfig } from './env';
import { createApp } from './app';
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
  let closing = false;
  // Once shutting down, a request on a kept-alive connection (an event stream reconnecting) gets 503 and a closed
  // connection instead of reaching a database pool that is closing.
  const server = http.createServer((req, res) => {
    if (!closing) return void app(req, res);
    res.writeHead(503, { Connection: 'close', 'Retry-After': '5' }).end();
  });
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
