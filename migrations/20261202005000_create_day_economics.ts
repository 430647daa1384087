import type { Knex } from 'knex';

// Day economics: photos attached at intake (shown on the visit screen), the pick list's spare
// allowance per rate-book entry and its ticks as the truck is loaded, and on each correction record
// whether the item was finished on the first visit (and why a return visit was needed).
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('intake_photos', (t) => {
    t.increments('id');
    t.integer('request_id').notNullable().references('id').inTable('repair_requests').onDelete('CASCADE');
    /** The item the photo shows, when the uploader named one. */
    t.integer('line_item_id').references('id').inTable('line_items').onDelete('SET NULL');
    t.string('caption', 200).notNullable().defaultTo('');
    t.string('storage_key', 100).notNullable();
    t.integer('width').notNullable();
    t.integer('height').notNullable();
    t.integer('size_bytes').notNullable();
    t.integer('uploaded_by').references('id').inTable('users').onDelete('SET NULL');
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.index(['request_id']);
  });

  await knex.schema.createTable('pick_list_spares', (t) => {
    t.integer('organisation_id').notNullable().references('id').inTable('organisations').onDelete('CASCADE');
    /** The rate-book entry key. */
    t.string('entry_key', 60).notNullable();
    /** Spare units of the entry's materials loaded on a day that uses the entry. */
    t.integer('spare_units').notNullable();
    t.timestamp('updated_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.primary(['organisation_id', 'entry_key']);
  });
  await knex.raw('ALTER TABLE pick_list_spares ADD CONSTRAINT pick_list_spares_units_check CHECK (spare_units BETWEEN 0 AND 20)');

  await knex.schema.createTable('pick_list_ticks', (t) => {
    t.increments('id');
    t.integer('organisation_id').notNullable().references('id').inTable('organisations').onDelete('CASCADE');
    t.integer('electrician_id').notNullable().references('id').inTable('users').onDelete('CASCADE');
    t.date('plan_date').notNullable();
    /** The pick-list line (kind and material name). */
    t.string('line_key', 200).notNullable();
    t.integer('ticked_by').references('id').inTable('users').onDelete('SET NULL');
    t.timestamp('ticked_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.unique(['electrician_id', 'plan_date', 'line_key']);
    t.index(['organisation_id', 'plan_date']);
  });

  await knex.schema.alterTable('item_corrections', (t) => {
    /** Finished on the first visit; false for a return visit, rework, or an outcome that needs one. */
    t.boolean('first_visit').notNullable().defaultTo(true);
    t.string('return_cause', 30);
  });
  await knex.schema.alterTable('site_visits', (t) => {
    t.index(['visit_date']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('site_visits', (t) => {
    t.dropIndex(['visit_date']);
  });
  await knex.schema.alterTable('item_corrections', (t) => {
    t.dropColumn('return_cause');
    t.dropColumn('first_visit');
  });
  await knex.schema.dropTable('pick_list_ticks');
  await knex.schema.dropTable('pick_list_spares');
  await knex.schema.dropTable('intake_photos');
}
