// Knex CLI configuration (`npm run migrate`, `npm run seed`). The server itself builds its Knex
// instance in db/knex.ts from the same DATABASE_URL.
import { join } from 'node:path';
import type { Knex } from 'knex';

const root = join(__dirname, '..', '..', '..');

const config: Knex.Config = {
  client: 'pg',
  connection: process.env.DATABASE_URL,
  pool: { min: 0, max: 4 },
  migrations: { directory: join(root, 'migrations'), extension: 'ts', loadExtensions: ['.ts'] },
  seeds: { directory: join(root, 'seeds'), extension: 'ts', loadExtensions: ['.ts'] },
};

export default config;
