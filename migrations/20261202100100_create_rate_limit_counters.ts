import type { Knex } from 'knex';

// Attempt counters of the rate limits (sign-in per address and per account, password changes),
// kept in PostgreSQL so that a restart or a second server instance does not reset them.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('rate_limit_counters', (t) => {
    /** `<limiter>:<subject>`, e.g. `sign-in-account:ann@example.test`. */
    t.string('key', 300).primary();
    t.integer('hits').notNullable();
    t.timestamp('resets_at', { useTz: true }).notNullable();
    t.index(['resets_at']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('rate_limit_counters');
}
