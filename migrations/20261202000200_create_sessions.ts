import type { Knex } from 'knex';

// The session store's table, in the shape connect-pg-simple expects.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('sessions', (t) => {
    t.string('sid').primary();
    t.json('sess').notNullable();
    t.timestamp('expire', { precision: 6 }).notNullable();
    t.index(['expire'], 'sessions_expire_index');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('sessions');
}
