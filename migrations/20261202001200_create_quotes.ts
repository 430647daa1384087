import type { Knex } from 'knex';

// Sent quotes: one immutable row per version of a request's quote, with everything it was priced
// with copied in (terms, entries, adders, contractor), and its lines.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('quotes', (t) => {
    t.increments('id');
    t.integer('request_id').notNullable().references('id').inTable('repair_requests').onDelete('CASCADE');
    t.integer('version').notNullable();
    t.integer('organisation_id').notNullable().references('id').inTable('organisations').onDelete('RESTRICT');
    t.integer('sent_by').references('id').inTable('users').onDelete('SET NULL');
    t.timestamp('sent_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.date('valid_until').notNullable();
    t.integer('subtotal_cents').notNullable();
    t.integer('tax_cents').notNullable();
    t.integer('total_cents').notNullable();
    t.integer('deposit_cents').notNullable();
    t.text('warranty_text').notNullable();
    t.text('safety_notice').notNullable();
    t.text('note');
    /** Contractor name, licence, address and phone as they were when sent. */
    t.jsonb('contractor').notNullable();
    /** The property address as it was when sent. */
    t.jsonb('property').notNullable();
    /** The rate book as priced (engine form) and the priced input: the quote can be recomputed. */
    t.jsonb('rate_book').notNullable();
    t.jsonb('pricing_input').notNullable();
    t.jsonb('breakdown').notNullable();
    t.unique(['request_id', 'version']);
  });

  await knex.schema.createTable('quote_lines', (t) => {
    t.increments('id');
    t.integer('quote_id').notNullable().references('id').inTable('quotes').onDelete('CASCADE');
    t.integer('position').notNullable();
    t.integer('line_item_id').references('id').inTable('line_items').onDelete('SET NULL');
    /** priced | out-of-scope */
    t.string('kind', 20).notNullable();
    t.string('code', 40).notNullable();
    t.string('room', 20).notNullable();
    t.string('location', 300).notNullable().defaultTo('');
    t.integer('entry_version_id').references('id').inTable('rate_book_entry_versions').onDelete('RESTRICT');
    /** The entry as priced: key, version, name, unit, code and pricing. */
    t.jsonb('entry');
    t.integer('quantity');
    t.boolean('is_quantity_assumed').notNullable().defaultTo(false);
    t.jsonb('adders').notNullable().defaultTo('[]');
    t.string('visit_key', 40);
    t.integer('labour_minutes').notNullable().defaultTo(0);
    t.integer('labour_cents').notNullable().defaultTo(0);
    t.integer('materials_cents').notNullable().defaultTo(0);
    t.integer('flat_cents').notNullable().defaultTo(0);
    t.integer('line_cents').notNullable().defaultTo(0);
    t.text('out_of_scope_reason');
    t.index(['quote_id', 'position']);
    t.index(['entry_version_id']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('quote_lines');
  await knex.schema.dropTable('quotes');
}
