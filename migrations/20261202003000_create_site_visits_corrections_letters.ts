import type { Knex } from 'knex';

// The proof side of a request: site visits (real appointments at the property, not the quote's
// pricing visits), one correction record per item with its photos, completion letters with their
// revisions and verification codes, and the inspector's (or buyer's agent's) review of a letter.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('site_visits', (t) => {
    t.increments('id');
    t.integer('request_id').notNullable().references('id').inTable('repair_requests').onDelete('CASCADE');
    t.integer('number').notNullable();
    t.date('visit_date').notNullable();
    t.string('arrival_from', 5).notNullable();
    t.string('arrival_to', 5).notNullable();
    t.integer('electrician_id').notNullable().references('id').inTable('users').onDelete('RESTRICT');
    /** Lockbox code or occupant contact: only the assigned contractor and the listing agent see it. */
    t.text('access_notes');
    /** The quoted (pricing) visit whose items this site visit takes, if one was chosen. */
    t.string('quoted_visit_key', 40);
    t.string('status', 12).notNullable().defaultTo('booked');
    t.timestamp('started_at', { useTz: true });
    t.timestamp('finished_at', { useTz: true });
    t.integer('booked_by').references('id').inTable('users').onDelete('SET NULL');
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp('updated_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.unique(['request_id', 'number']);
    t.index(['electrician_id', 'visit_date']);
  });
  await knex.raw("ALTER TABLE site_visits ADD CONSTRAINT site_visits_status_check CHECK (status IN ('booked', 'started', 'finished'))");

  await knex.schema.alterTable('line_items', (t) => {
    /** The site visit the item is planned for. */
    t.integer('site_visit_id').references('id').inTable('site_visits').onDelete('SET NULL');
    t.index(['site_visit_id']);
  });

  await knex.schema.createTable('item_corrections', (t) => {
    t.increments('id');
    t.integer('line_item_id').notNullable().unique().references('id').inTable('line_items').onDelete('CASCADE');
    t.integer('request_id').notNullable().references('id').inTable('repair_requests').onDelete('CASCADE');
    /** The site visit on which the item was corrected (warranty and callbacks trace it). */
    t.integer('site_visit_id').references('id').inTable('site_visits').onDelete('SET NULL');
    t.string('outcome', 20).notNullable();
    t.text('reason').notNullable().defaultTo('');
    t.text('work_performed').notNullable().defaultTo('');
    t.text('materials').notNullable().defaultTo('');
    t.string('device_make', 80).notNullable().defaultTo('');
    t.string('device_model', 80).notNullable().defaultTo('');
    t.string('device_lot', 80).notNullable().defaultTo('');
    t.specificType('labels', 'text[]').notNullable().defaultTo('{}');
    t.jsonb('readings').notNullable();
    t.integer('recorded_by').references('id').inTable('users').onDelete('SET NULL');
    t.timestamp('recorded_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.index(['request_id']);
  });
  await knex.raw(
    "ALTER TABLE item_corrections ADD CONSTRAINT item_corrections_outcome_check CHECK (outcome IN ('corrected', 'not-corrected', 'declined-on-site'))",
  );

  await knex.schema.createTable('correction_photos', (t) => {
    t.increments('id');
    t.integer('correction_id').notNullable().references('id').inTable('item_corrections').onDelete('CASCADE');
    t.integer('request_id').notNullable().references('id').inTable('repair_requests').onDelete('CASCADE');
    t.string('kind', 10).notNullable();
    t.string('storage_key', 100).notNullable();
    t.integer('width').notNullable();
    t.integer('height').notNullable();
    t.integer('size_bytes').notNullable();
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.index(['correction_id']);
    t.index(['request_id']);
  });
  await knex.raw("ALTER TABLE correction_photos ADD CONSTRAINT correction_photos_kind_check CHECK (kind IN ('before', 'after'))");

  await knex.schema.createTable('completion_letters', (t) => {
    t.increments('id');
    t.integer('request_id').notNullable().references('id').inTable('repair_requests').onDelete('CASCADE');
    t.string('number', 20).notNullable();
    t.integer('revision').notNullable();
    t.string('verification_code', 20).notNullable().unique();
    t.string('sha256', 64).notNullable();
    t.string('storage_key', 100).notNullable();
    t.integer('item_count').notNullable();
    t.string('permit_number', 60);
    t.integer('issued_by').references('id').inTable('users').onDelete('SET NULL');
    t.timestamp('issued_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.unique(['request_id', 'revision']);
    t.index(['sha256']);
  });

  await knex.schema.createTable('proof_reviews', (t) => {
    t.increments('id');
    t.integer('request_id').notNullable().references('id').inTable('repair_requests').onDelete('CASCADE');
    t.integer('letter_id').notNullable().references('id').inTable('completion_letters').onDelete('CASCADE');
    t.string('decision', 12).notNullable();
    t.text('note').notNullable().defaultTo('');
    /** Items not accepted, with the reason: [{ itemId, reason }]. */
    t.jsonb('items').notNullable().defaultTo('[]');
    t.integer('decided_by').references('id').inTable('users').onDelete('SET NULL');
    t.timestamp('decided_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.index(['request_id', 'decided_at']);
    t.index(['letter_id']);
  });
  await knex.raw("ALTER TABLE proof_reviews ADD CONSTRAINT proof_reviews_decision_check CHECK (decision IN ('accept', 'not-accept'))");
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('proof_reviews');
  await knex.schema.dropTable('completion_letters');
  await knex.schema.dropTable('correction_photos');
  await knex.schema.dropTable('item_corrections');
  await knex.schema.alterTable('line_items', (t) => {
    t.dropColumn('site_visit_id');
  });
  await knex.schema.dropTable('site_visits');
}
