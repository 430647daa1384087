import type { Knex } from 'knex';

// A contractor organisation's rate book: its visit terms (one row), its entries (each change is a new
// version row, so a sent quote keeps pointing at the exact figures it was priced with), its site
// conditions ("adders") and a log of every change.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('rate_books', (t) => {
    t.increments('id');
    t.integer('organisation_id').notNullable().unique().references('id').inTable('organisations').onDelete('CASCADE');
    t.integer('service_call_cents').notNullable();
    t.integer('first_hour_minimum_cents').notNullable();
    t.integer('first_hour_covers_minutes').notNullable();
    t.integer('hourly_rate_cents').notNullable();
    t.integer('billing_increment_minutes').notNullable();
    t.integer('materials_markup_bp').notNullable();
    t.integer('materials_tax_bp').notNullable();
    t.integer('permit_fee_cents').notNullable();
    t.integer('permit_handling_cents').notNullable();
    t.integer('card_deposit_bp').notNullable();
    t.integer('quote_validity_days').notNullable();
    t.text('warranty_text').notNullable();
    t.integer('visit_capacity_minutes').notNullable();
    /** Optimistic-concurrency version of the terms. */
    t.integer('version').notNullable().defaultTo(1);
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp('updated_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
  });

  // The identity of an entry; its content lives in versions. Deleting only hides it.
  await knex.schema.createTable('rate_book_entries', (t) => {
    t.increments('id');
    t.integer('organisation_id').notNullable().references('id').inTable('organisations').onDelete('CASCADE');
    /** The contractor's short name for the entry (CSV key), unique among the organisation's live entries. */
    t.string('key', 60).notNullable();
    t.integer('position').notNullable();
    t.integer('current_version').notNullable().defaultTo(1);
    t.timestamp('deleted_at', { useTz: true });
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp('updated_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.index(['organisation_id', 'position']);
  });
  await knex.raw('CREATE UNIQUE INDEX rate_book_entries_live_key ON rate_book_entries (organisation_id, key) WHERE deleted_at IS NULL');

  await knex.schema.createTable('rate_book_entry_versions', (t) => {
    t.increments('id');
    t.integer('entry_id').notNullable().references('id').inTable('rate_book_entries').onDelete('CASCADE');
    t.integer('version').notNullable();
    t.string('code', 60);
    t.string('name', 160).notNullable();
    t.string('unit', 30).notNullable();
    t.string('mode', 20).notNullable();
    // time-and-materials
    t.integer('labour_minutes_per_unit');
    t.integer('materials_cents_per_unit');
    t.integer('markup_bp');
    t.jsonb('materials').notNullable().defaultTo('[]');
    t.integer('minutes_low');
    t.integer('minutes_high');
    // flat
    t.integer('first_unit_cents');
    t.integer('additional_unit_cents');
    t.integer('hard_site_multiplier_bp');
    t.integer('created_by').references('id').inTable('users').onDelete('SET NULL');
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.unique(['entry_id', 'version']);
  });
  await knex.raw(`ALTER TABLE rate_book_entry_versions ADD CONSTRAINT rate_book_entry_versions_mode_check CHECK (
    (mode = 'time-and-materials' AND labour_minutes_per_unit IS NOT NULL AND materials_cents_per_unit IS NOT NULL
       AND minutes_low IS NOT NULL AND minutes_high IS NOT NULL)
    OR (mode = 'flat' AND first_unit_cents IS NOT NULL AND additional_unit_cents IS NOT NULL AND hard_site_multiplier_bp IS NOT NULL))`);

  await knex.schema.createTable('rate_book_adders', (t) => {
    t.increments('id');
    t.integer('organisation_id').notNullable().references('id').inTable('organisations').onDelete('CASCADE');
    t.string('key', 60).notNullable();
    t.string('name', 120).notNullable();
    t.string('kind', 30).notNullable();
    t.integer('minutes');
    t.integer('multiplier_bp');
    t.integer('applies_when_built_before');
    t.integer('position').notNullable();
    t.integer('version').notNullable().defaultTo(1);
    t.timestamp('deleted_at', { useTz: true });
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp('updated_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.index(['organisation_id', 'position']);
  });
  await knex.raw('CREATE UNIQUE INDEX rate_book_adders_live_key ON rate_book_adders (organisation_id, key) WHERE deleted_at IS NULL');
  await knex.raw(`ALTER TABLE rate_book_adders ADD CONSTRAINT rate_book_adders_kind_check CHECK (
    (kind IN ('minutes-per-unit', 'minutes-per-visit') AND minutes IS NOT NULL) OR (kind = 'labour-multiplier' AND multiplier_bp IS NOT NULL))`);

  await knex.schema.createTable('rate_book_changes', (t) => {
    t.increments('id');
    t.integer('organisation_id').notNullable().references('id').inTable('organisations').onDelete('CASCADE');
    t.integer('changed_by').references('id').inTable('users').onDelete('SET NULL');
    /** terms | entry | adder */
    t.string('subject', 20).notNullable();
    t.integer('subject_id');
    /** create | update | delete | import */
    t.string('action', 20).notNullable();
    t.jsonb('before');
    t.jsonb('after');
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.index(['organisation_id', 'created_at']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('rate_book_changes');
  await knex.schema.dropTable('rate_book_adders');
  await knex.schema.dropTable('rate_book_entry_versions');
  await knex.schema.dropTable('rate_book_entries');
  await knex.schema.dropTable('rate_books');
}
