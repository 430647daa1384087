import knex, { type Knex } from 'knex';
import pg from 'pg';

// DATE columns stay ISO strings (YYYY-MM-DD); pg would otherwise shift them into local-time Dates.
pg.types.setTypeParser(pg.types.builtins.DATE, (value: string) => value);

export type Db = Knex;
export type Trx = Knex.Transaction;

/** One Knex instance per process (per test file in the API tests). Pool min 0, as Knex advises. */
export function createDb(databaseUrl: string, poolMax = 10): Db {
  return knex({
    client: 'pg',
    connection: databaseUrl,
    pool: { min: 0, max: poolMax },
  });
}
