// Before the API tests: the database named by DATABASE_URL gets the current schema.
// `npm test` provides a throwaway cluster; to run `npx jest --selectProjects api` by hand, point
// DATABASE_URL at a database you are happy to have emptied.
import knex from 'knex';
import config from '../../server/src/db/knexfile';

export default async function globalSetup(): Promise<void> {
  if (!process.env.DATABASE_URL) {
    throw new Error('The API tests need DATABASE_URL (npm test starts a throwaway PostgreSQL and sets it).');
  }
  const db = knex(config);
  try {
    await db.migrate.latest();
  } finally {
    await db.destroy();
  }
}
