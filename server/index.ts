import { createDatabase } from './db';
import { loadConfig } from './env';
import { createApp } from './app';
import { createMailer } from './services/mailer';

/** Production entry point: connect, listen, and shut down cleanly on SIGTERM or SIGINT. */
async function main() {
  const config = loadConfig();
  const sequelize = createDatabase(config);
  await sequelize.authenticate();
  const mailer = createMailer(config.smtp);
  const app = createApp({ config, sequelize, mailer });
  const server = app.listen(config.port, config.host, () => {
    console.log(`[trimsheet] serving ${config.publicUrl}`);
  });
  server.on('error', (error: NodeJS.ErrnoException) => {
    const reason =
      error.code === 'EADDRINUSE' ? `port ${config.port} on ${config.host} is already in use (set PORT to another)` : error.message;
    console.error(`[trimsheet] could not listen: ${reason}`);
    process.exit(1);
  });
  const shutdown = () => {
    server.close(() => {
      mailer.close();
      void sequelize.close().then(() => process.exit(0));
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
