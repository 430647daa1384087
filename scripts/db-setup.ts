// Brings a database up to date: runs the Knex migrations, then the demo seeds when asked.
//   tsx scripts/db-setup.ts --seed=if-empty   seed only a database with no users (npm start)
//   tsx scripts/db-setup.ts --seed=always     reset the demo scenario (npm run seed does the same)
//   tsx scripts/db-setup.ts --seed=never      migrations only (tests)
import knex from 'knex';
import config from '../server/src/db/knexfile';

async function main(): Promise<void> {
  const mode = (process.argv.find((a) => a.startsWith('--seed=')) ?? '--seed=if-empty').slice('--seed='.length);
  if (!['if-empty', 'always', 'never'].includes(mode)) throw new Error(`Unknown --seed mode: ${mode}`);
  if (!process.env.DATABASE_URL) throw new Error('DATABASE_URL is not set');
  const db = knex(config);
  try {
    const [, applied] = await db.migrate.latest();
    console.log(applied.length ? `• Applied ${applied.length} migration(s)` : '• Database schema is up to date');
    const { count } = (await db('users').count<{ count: string }[]>({ count: '*' }))[0];
    if (mode === 'always' || (mode === 'if-empty' && Number(count) === 0)) {
      await db.seed.run();
      console.log('• Demo scenario seeded');
    } else if (mode === 'if-empty') {
      console.log('• Keeping the existing data (run `npm run seed` to reset the demo scenario)');
    }
  } finally {
    await db.destroy();
  }
}

main().catch((err) => {
  console.error(err instanceof Error ? err.message : err);
  process.exit(1);
});
