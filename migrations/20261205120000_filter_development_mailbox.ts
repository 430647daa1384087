import type { Knex } from 'knex';

// The development mailbox is filtered by request and by recipient (review 7, P5-5), each by an index:
// a captured message names the request of the outbox row it was sent from (found by its Message-ID,
// null for a digest or an invitation before the request existed), and its recipients are kept in
// lower case so an address matches the array index whatever case it was typed in.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('captured_mail', (t) => {
    t.integer('request_id').references('id').inTable('repair_requests').onDelete('SET NULL');
  });
  await knex.raw('CREATE INDEX captured_mail_request_id_id_index ON captured_mail (request_id, id)');
  await knex.raw('CREATE INDEX captured_mail_to_addresses_index ON captured_mail USING gin (to_addresses)');
  // The sink finds a message's outbox row by its Message-ID.
  await knex.raw('CREATE INDEX outbox_messages_message_id_index ON outbox_messages (message_id)');
  await knex.raw(`UPDATE captured_mail c SET request_id = o.request_id FROM outbox_messages o WHERE o.message_id = c.message_id`);
  await knex.raw(`UPDATE captured_mail SET to_addresses = ARRAY(SELECT lower(a) FROM unnest(to_addresses) AS a)`);
}

export async function down(knex: Knex): Promise<void> {
  await knex.raw('DROP INDEX IF EXISTS outbox_messages_message_id_index');
  await knex.raw('DROP INDEX IF EXISTS captured_mail_to_addresses_index');
  await knex.schema.alterTable('captured_mail', (t) => {
    t.dropColumn('request_id');
  });
}
