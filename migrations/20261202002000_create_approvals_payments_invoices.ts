import type { Knex } from 'knex';

// The seller's side of a request: the signed decision on a quote version (and on each item), change
// orders, card payments and funds paid at closing, refunds, the payment events received once each,
// and numbered invoices and receipts with one counter row per contractor organisation and series.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('quote_approvals', (t) => {
    t.increments('id');
    t.integer('request_id').notNullable().references('id').inTable('repair_requests').onDelete('CASCADE');
    t.integer('quote_id').notNullable().references('id').inTable('quotes').onDelete('RESTRICT');
    t.integer('quote_version').notNullable();
    t.integer('signed_by').notNullable().references('id').inTable('users').onDelete('RESTRICT');
    /** The full name typed as signature. */
    t.string('signer_name', 200).notNullable();
    /** The exact terms the signer agreed to, as shown. */
    t.text('consent_text').notNullable();
    t.timestamp('signed_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.string('ip_address', 64).notNullable();
    t.string('user_agent', 500).notNullable();
    /** SHA-256 (hex) of the quote version as stored when signed. */
    t.string('quote_hash', 64).notNullable();
    /** The approved scope priced by the shared engine when signed. */
    t.integer('approved_total_cents').notNullable();
    t.integer('approved_tax_cents').notNullable();
    t.integer('deposit_cents').notNullable();
    t.unique(['request_id']);
  });

  await knex.schema.createTable('change_orders', (t) => {
    t.increments('id');
    t.integer('request_id').notNullable().references('id').inTable('repair_requests').onDelete('CASCADE');
    /** 1, 2, 3 … per request. */
    t.integer('number').notNullable();
    t.integer('created_by').notNullable().references('id').inTable('users').onDelete('RESTRICT');
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.text('reason').notNullable();
    /** sent | approved | declined */
    t.string('status', 20).notNullable().defaultTo('sent');
    /** The lines: added items and quantity changes, as sent. */
    t.jsonb('lines').notNullable();
    /** Price of the change: the scope total with it less the scope total without it (may be negative). */
    t.integer('price_cents').notNullable();
    /** Scope totals before and after, as priced when sent. */
    t.integer('scope_before_cents').notNullable();
    t.integer('scope_after_cents').notNullable();
    t.integer('decided_by').references('id').inTable('users').onDelete('RESTRICT');
    t.timestamp('decided_at', { useTz: true });
    t.string('signer_name', 200);
    t.string('ip_address', 64);
    t.string('user_agent', 500);
    t.text('decision_note');
    t.unique(['request_id', 'number']);
  });

  await knex.schema.createTable('item_decisions', (t) => {
    t.increments('id');
    t.integer('request_id').notNullable().references('id').inTable('repair_requests').onDelete('CASCADE');
    t.integer('line_item_id').notNullable().references('id').inTable('line_items').onDelete('CASCADE');
    t.integer('approval_id').references('id').inTable('quote_approvals').onDelete('CASCADE');
    t.integer('change_order_id').references('id').inTable('change_orders').onDelete('CASCADE');
    /** approved | declined */
    t.string('decision', 20).notNullable();
    t.string('note', 500);
    t.integer('decided_by').notNullable().references('id').inTable('users').onDelete('RESTRICT');
    t.timestamp('decided_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.index(['request_id']);
    t.index(['line_item_id']);
  });

  await knex.schema.alterTable('line_items', (t) => {
    /** The change order that added the item (null for items of the report). */
    t.integer('change_order_id').references('id').inTable('change_orders').onDelete('SET NULL');
  });

  await knex.schema.createTable('invoice_counters', (t) => {
    t.integer('organisation_id').notNullable().references('id').inTable('organisations').onDelete('CASCADE');
    /** invoice | receipt */
    t.string('series', 20).notNullable();
    t.integer('last_number').notNullable().defaultTo(0);
    t.primary(['organisation_id', 'series']);
  });

  await knex.schema.createTable('payments', (t) => {
    t.increments('id');
    t.integer('request_id').notNullable().references('id').inTable('repair_requests').onDelete('CASCADE');
    t.integer('organisation_id').notNullable().references('id').inTable('organisations').onDelete('RESTRICT');
    /** card | closing */
    t.string('method', 20).notNullable();
    /** deposit | full | balance | closing */
    t.string('purpose', 20).notNullable();
    t.integer('amount_cents').notNullable();
    /** pending | succeeded | failed | cancelled */
    t.string('status', 20).notNullable().defaultTo('pending');
    t.integer('refunded_cents').notNullable().defaultTo(0);
    /** The key the client sent with the request that created it (a double submit finds this row). */
    t.string('idempotency_key', 100).notNullable();
    t.string('checkout_session_id', 255).unique();
    t.text('checkout_url');
    t.string('payment_intent_id', 255);
    t.string('failure_message', 500);
    /** For funds at closing: the escrow invoice it settles, the reference and the day received. */
    t.string('reference', 200);
    t.date('received_on');
    t.integer('created_by').notNullable().references('id').inTable('users').onDelete('RESTRICT');
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp('paid_at', { useTz: true });
    t.unique(['request_id', 'idempotency_key']);
    t.index(['request_id', 'status']);
  });

  await knex.schema.createTable('refunds', (t) => {
    t.increments('id');
    t.integer('payment_id').notNullable().references('id').inTable('payments').onDelete('CASCADE');
    t.integer('amount_cents').notNullable();
    t.string('reason', 500).notNullable();
    /** pending | succeeded | failed */
    t.string('status', 20).notNullable().defaultTo('pending');
    t.string('provider_refund_id', 255).unique();
    t.string('idempotency_key', 100).notNullable().unique();
    t.integer('created_by').notNullable().references('id').inTable('users').onDelete('RESTRICT');
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp('settled_at', { useTz: true });
    t.index(['payment_id']);
  });

  await knex.schema.createTable('payment_events', (t) => {
    /** The payment service's event id: each is acted on once. */
    t.string('event_id', 255).primary();
    t.string('type', 100).notNullable();
    t.timestamp('received_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    /** What the event did: credited, ignored, … */
    t.string('outcome', 100).notNullable();
  });

  await knex.schema.createTable('invoices', (t) => {
    t.increments('id');
    t.integer('organisation_id').notNullable().references('id').inTable('organisations').onDelete('RESTRICT');
    /** invoice | receipt */
    t.string('series', 20).notNullable();
    t.integer('number').notNullable();
    t.integer('request_id').notNullable().references('id').inTable('repair_requests').onDelete('CASCADE');
    /** invoice | closing-invoice | receipt */
    t.string('kind', 20).notNullable();
    t.integer('payment_id').references('id').inTable('payments').onDelete('SET NULL');
    t.integer('issued_by').references('id').inTable('users').onDelete('SET NULL');
    t.timestamp('issued_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    /** Who it is addressed to (the seller, or the escrow / title company). */
    t.jsonb('addressed_to').notNullable();
    /** Lines, payments, tax and balance as they were when issued. */
    t.jsonb('content').notNullable();
    t.integer('total_cents').notNullable();
    t.integer('balance_cents').notNullable();
    t.unique(['organisation_id', 'series', 'number']);
    t.index(['request_id']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('invoices');
  await knex.schema.dropTable('payment_events');
  await knex.schema.dropTable('refunds');
  await knex.schema.dropTable('payments');
  await knex.schema.dropTable('invoice_counters');
  await knex.schema.alterTable('line_items', (t) => t.dropColumn('change_order_id'));
  await knex.schema.dropTable('item_decisions');
  await knex.schema.dropTable('change_orders');
  await knex.schema.dropTable('quote_approvals');
}
