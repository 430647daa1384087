// Entry point: reads the configuration, connects to PostgreSQL and listens on loopback.
import { createApp } from './app';
import { loadConfig } from './config/config';
import { createDb } from './db/knex';
import { startMail } from './notifications/mail-runtime';

async function main(): Promise<void> {
  let config;
  try {
    config = loadConfig();
  } catch (err) {
    console.error((err as Error).message);
    process.exit(2);
  }
  const db = createDb(config.databaseUrl);
  await db.raw('select 1');
  const { app, close, services } = createApp(config, db);
  const mail = await startMail(config, services);
  const server = app.listen(config.port, config.host, () => {
    console.log(`Closing Circuit API and portal listening on http://${config.host}:${config.port}`);
  });
  const shutdown = () => {
    server.close(async () => {
      await mail.stop();
      await close();
      await db.destroy();
      process.exit(0);
    });
  };
  process.on('SIGINT', shutdown);
  process.on('SIGTERM', shutdown);
}

main().catch((err) => {
  console.error('The server could not start:', err);
  process.exit(1);
});
