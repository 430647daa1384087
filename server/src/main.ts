// Entry point: reads the configuration, connects to PostgreSQL and listens on loopback.
import { createApp } from './app';
import { loadConfig } from './config/config';
import { createDb } from './db/knex';
import { fakeKeys, startFakePaymentService, type FakePaymentService } from './integrations/payments/fake-payment-service';
import { sweepStorageAtStart } from './integrations/storage/sweep-at-start';
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
  // Without real payment keys (and outside production) card payments go to a local fake on loopback.
  let fake: FakePaymentService | null = null;
  if (!config.payments && config.env !== 'production') {
    const keys = fakeKeys();
    fake = await startFakePaymentService({ ...keys, host: '127.0.0.1', port: config.fakePaymentsPort, webhookUrl: `http://${config.host}:${config.port}/api/payments/webhook` });
    config = { ...config, payments: { ...keys, apiBase: fake.url } };
    console.log(`Fake payment service (test cards only) on ${fake.url}`);
  }
  const swept = await sweepStorageAtStart(config.storageDir, db);
  if (swept.committed + swept.removed > 0) console.log(`Storage: ${swept.removed} unfinished upload(s) removed, ${swept.committed} kept`);
  const { app, close, services } = createApp(config, db);
  const mail = await startMail(config, services);
  const server = app.listen(config.port, config.host, () => {
    console.log(`Closing Circuit API and portal listening on http://${config.host}:${config.port}`);
  });
  // Once: a second signal while closing (a test runner's timeout, Ctrl-C twice) must not end pools twice.
  let isClosing = false;
  const shutdown = () => {
    if (isClosing) return;
    isClosing = true;
    server.close(async () => {
      await mail.stop();
      await fake?.close();
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
