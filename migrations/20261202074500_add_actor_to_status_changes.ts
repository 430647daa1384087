import type { Knex } from 'knex';

// The part the person played when they moved a request (seller, contractor, inspector…), as the
// flow table names it: the history says who acted in which part, not only which account.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('request_status_changes', (t) => {
    t.string('actor', 20);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('request_status_changes', (t) => {
    t.dropColumn('actor');
  });
}
