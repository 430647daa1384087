import type { Knex } from 'knex';

// Outcomes of items recorded within a few minutes of each other are told in one e-mail per person:
// an `item-corrected` message waits (next_attempt_at) for more outcomes of the same request, and
// `gathered` lists the outcomes it tells ({itemId, itemLabel, outcome}), so that the next one can be
// added and the message written again until a worker claims it.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('outbox_messages', (t) => {
    t.jsonb('gathered');
  });
  await knex.raw(
    `CREATE INDEX outbox_messages_gathering_index ON outbox_messages (request_id, recipient_user_id) WHERE kind = 'item-corrected' AND status = 'pending' AND attempts = 0`,
  );
}

export async function down(knex: Knex): Promise<void> {
  await knex.raw('DROP INDEX outbox_messages_gathering_index');
  await knex.schema.alterTable('outbox_messages', (t) => {
    t.dropColumn('gathered');
  });
}
