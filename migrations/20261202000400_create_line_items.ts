import type { Knex } from 'knex';

// The defects of one request, one row each: proposed by the report parser or added by a person.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('line_items', (t) => {
    t.increments('id');
    t.integer('request_id').notNullable().references('id').inTable('repair_requests').onDelete('CASCADE');
    t.string('code', 40).notNullable();
    t.string('room', 20).notNullable().defaultTo('unknown');
    t.string('location', 300);
    t.integer('quantity');
    t.text('evidence');
    t.integer('page');
    t.string('severity', 20).notNullable();
    t.specificType('nec_refs', 'text[]').notNullable().defaultTo('{}');
    t.string('status', 20).notNullable().defaultTo('proposed');
    /** Whether a person changed the parser's proposal (re-parsing never overwrites it then). */
    t.boolean('is_edited').notNullable().defaultTo(false);
    t.integer('version').notNullable().defaultTo(1);
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp('updated_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.index(['request_id', 'status']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('line_items');
}
