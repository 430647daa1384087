import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.raw('CREATE EXTENSION IF NOT EXISTS pg_trgm');

  await knex.schema.createTable('repair_requests', (t) => {
    t.increments('id');
    t.string('street', 200).notNullable();
    t.string('city', 100).notNullable();
    t.string('state', 2).notNullable();
    t.string('zip', 10).notNullable();
    t.integer('year_built').notNullable();
    t.date('closing_date').notNullable();
    t.smallint('nec_edition').notNullable();
    t.string('status', 20).notNullable().defaultTo('draft');
    t.integer('contractor_organisation_id').references('id').inTable('organisations').onDelete('RESTRICT');
    t.integer('created_by').notNullable().references('id').inTable('users').onDelete('RESTRICT');
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp('updated_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.index(['contractor_organisation_id', 'status']);
    t.index(['closing_date']);
    t.index(['status', 'closing_date']);
  });
  await knex.raw(
    "ALTER TABLE repair_requests ADD CONSTRAINT repair_requests_edition_check CHECK (nec_edition IN (2017, 2020, 2023))",
  );
  await knex.raw(
    "CREATE INDEX repair_requests_search_trgm ON repair_requests USING gin ((street || ' ' || city || ' ' || zip) gin_trgm_ops)",
  );

  // The people named on a request. A row without user_id is a pending invitation.
  await knex.schema.createTable('request_parties', (t) => {
    t.increments('id');
    t.integer('request_id').notNullable().references('id').inTable('repair_requests').onDelete('CASCADE');
    t.string('role', 20).notNullable();
    t.string('email', 254).notNullable();
    t.integer('user_id').references('id').inTable('users').onDelete('RESTRICT');
    t.string('invite_token', 64).unique();
    t.timestamp('invite_expires_at', { useTz: true });
    t.integer('invited_by').references('id').inTable('users').onDelete('SET NULL');
    t.timestamp('joined_at', { useTz: true });
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.unique(['request_id', 'role', 'email']);
    t.index(['user_id', 'request_id']);
  });
  await knex.raw(
    "ALTER TABLE request_parties ADD CONSTRAINT request_parties_role_check CHECK (role IN ('buyer-agent', 'listing-agent', 'seller', 'inspector'))",
  );

  await knex.schema.createTable('request_status_changes', (t) => {
    t.increments('id');
    t.integer('request_id').notNullable().references('id').inTable('repair_requests').onDelete('CASCADE');
    t.string('from_status', 20);
    t.string('to_status', 20).notNullable();
    t.integer('changed_by').references('id').inTable('users').onDelete('SET NULL');
    t.text('note');
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.index(['request_id', 'created_at']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('request_status_changes');
  await knex.schema.dropTable('request_parties');
  await knex.schema.dropTable('repair_requests');
}
