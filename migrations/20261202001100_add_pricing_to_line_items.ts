import type { Knex } from 'knex';

// What a contractor sets on each line item while pricing (entry, site conditions, quantity, visit,
// or "not our scope" with a reason), the visits of a request, and the site conditions flagged on a
// request for its ballpark range.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('line_items', (t) => {
    t.integer('entry_id').references('id').inTable('rate_book_entries').onDelete('SET NULL');
    t.specificType('adder_ids', 'integer[]').notNullable().defaultTo('{}');
    /** Quantity the contractor prices; null uses the item's own quantity. */
    t.integer('pricing_quantity');
    /** Whether the quantity was unknown and 1 was assumed when the entry was set. */
    t.boolean('is_quantity_assumed').notNullable().defaultTo(false);
    t.string('visit_key', 40).notNullable().defaultTo('visit-1');
    t.text('out_of_scope_reason');
  });

  await knex.schema.alterTable('repair_requests', (t) => {
    /** Site conditions (rate-book adder ids of the assigned contractor) flagged for the ballpark. */
    t.specificType('site_adder_ids', 'integer[]').notNullable().defaultTo('{}');
  });

  await knex.schema.createTable('request_pricing_visits', (t) => {
    t.increments('id');
    t.integer('request_id').notNullable().references('id').inTable('repair_requests').onDelete('CASCADE');
    t.string('key', 40).notNullable();
    t.integer('position').notNullable();
    t.specificType('adder_ids', 'integer[]').notNullable().defaultTo('{}');
    t.boolean('has_permit').notNullable().defaultTo(false);
    t.unique(['request_id', 'key']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('request_pricing_visits');
  await knex.schema.alterTable('repair_requests', (t) => {
    t.dropColumn('site_adder_ids');
  });
  await knex.schema.alterTable('line_items', (t) => {
    t.dropColumn('out_of_scope_reason');
    t.dropColumn('visit_key');
    t.dropColumn('is_quantity_assumed');
    t.dropColumn('pricing_quantity');
    t.dropColumn('adder_ids');
    t.dropColumn('entry_id');
  });
}
