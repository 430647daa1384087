import type { Knex } from 'knex';

// E-mail through an outbox, the activity timeline of a request, people's message preferences, the
// daily digest runs, and the development mailbox (messages the local SMTP sink received).
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('activity_events', (t) => {
    t.bigIncrements('id');
    t.integer('request_id').notNullable().references('id').inTable('repair_requests').onDelete('CASCADE');
    t.integer('line_item_id').references('id').inTable('line_items').onDelete('SET NULL');
    t.integer('actor_user_id').references('id').inTable('users').onDelete('SET NULL');
    /** The group the timeline filters by (status, items, parties, ...). */
    t.string('kind', 20).notNullable();
    /** What happened, as a short machine name (confirm-items, item-edited, party-invited ...). */
    t.string('action', 40).notNullable();
    t.string('summary', 500).notNullable();
    t.jsonb('before');
    t.jsonb('after');
    /** Money the event is about (a quote total, an approved scope, a payment), for the dashboards. */
    t.integer('amount_cents');
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.index(['request_id', 'created_at']);
    t.index(['request_id', 'kind']);
    t.index(['action', 'created_at']);
  });

  await knex.schema.createTable('outbox_messages', (t) => {
    t.bigIncrements('id');
    /** Same key twice (the same message to the same person) is written once. */
    t.string('dedupe_key', 200).notNullable().unique();
    t.string('kind', 30).notNullable();
    t.integer('request_id').references('id').inTable('repair_requests').onDelete('CASCADE');
    t.integer('recipient_user_id').references('id').inTable('users').onDelete('CASCADE');
    t.string('recipient_email', 254).notNullable();
    t.string('subject', 300).notNullable();
    t.text('text_body').notNullable();
    t.text('html_body').notNullable();
    t.string('link', 500).notNullable();
    /** pending → sending → sent; held (waits for the digest) → digested; failed; skipped. */
    t.string('status', 20).notNullable().defaultTo('pending');
    t.integer('attempts').notNullable().defaultTo(0);
    t.timestamp('next_attempt_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    /** While `sending`: until when the claim holds; a claim past this is taken over after a crash. */
    t.timestamp('lease_until', { useTz: true });
    t.uuid('lease_token');
    t.string('message_id', 200).notNullable();
    t.text('last_error');
    t.timestamp('sent_at', { useTz: true });
    t.bigInteger('digest_id').references('id').inTable('outbox_messages').onDelete('SET NULL');
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.index(['status', 'next_attempt_at']);
    t.index(['recipient_user_id', 'status']);
    t.index(['request_id']);
  });

  await knex.schema.createTable('outbox_attempts', (t) => {
    t.bigIncrements('id');
    t.bigInteger('message_id').notNullable().references('id').inTable('outbox_messages').onDelete('CASCADE');
    t.integer('attempt').notNullable();
    t.uuid('lease_token').notNullable();
    t.string('worker', 100).notNullable();
    t.timestamp('started_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp('finished_at', { useTz: true });
    /** sent | failed | (null while under way or when the worker stopped mid-send) */
    t.string('outcome', 20);
    t.text('error');
    t.unique(['message_id', 'attempt']);
  });

  await knex.schema.createTable('notification_preferences', (t) => {
    t.integer('user_id').notNullable().references('id').inTable('users').onDelete('CASCADE');
    t.string('kind', 30).notNullable();
    /** immediate | digest | off */
    t.string('delivery', 20).notNullable();
    t.timestamp('updated_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.primary(['user_id', 'kind']);
  });
  await knex.raw("ALTER TABLE notification_preferences ADD CONSTRAINT notification_preferences_delivery_check CHECK (delivery IN ('immediate', 'digest', 'off'))");

  await knex.schema.createTable('digest_runs', (t) => {
    t.date('day').primary();
    t.timestamp('started_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
  });

  await knex.schema.createTable('captured_mail', (t) => {
    t.bigIncrements('id');
    t.string('message_id', 300);
    t.string('from_address', 300).notNullable();
    t.specificType('to_addresses', 'text[]').notNullable();
    t.string('subject', 500).notNullable();
    t.text('text_body').notNullable();
    t.text('html_body').notNullable();
    t.timestamp('received_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.index(['received_at']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('captured_mail');
  await knex.schema.dropTable('digest_runs');
  await knex.schema.dropTable('notification_preferences');
  await knex.schema.dropTable('outbox_attempts');
  await knex.schema.dropTable('outbox_messages');
  await knex.schema.dropTable('activity_events');
}
