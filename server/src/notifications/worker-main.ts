// A process that only sends the outbox (`tsx server/src/notifications/worker-main.ts`): run one or
// more beside servers started with OUTBOX_WORKER=off; they share the work through row claims.
import { loadConfig } from '../config/config';
import { createDb } from '../db/knex';
import { createServices } from '../services';
import { startMail } from './mail-runtime';

async function main(): Promise<void> {
  const config = loadConfig({ ...process.env, OUTBOX_WORKER: 'on' });
  const db = createDb(config.databaseUrl, 4);
  const mail = await startMail(config, createServices(db, config));
  console.log(`Outbox worker ${mail.worker!.name} is sending.`);
  const stop = async () => {
    await mail.stop();
    await db.destroy();
    process.exit(0);
  };
  process.on('SIGINT', stop);
  process.on('SIGTERM', stop);
}

main().catch((err) => {
  console.error('The outbox worker could not start:', err);
  process.exit(1);
});
