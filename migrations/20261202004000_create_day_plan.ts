import type { Knex } from 'knex';

// The day plan: each contractor organisation's planning settings (drive assumptions, working day,
// shop address), coordinates a contractor enters for a property (else its ZIP code's centre is used),
// and the secret addresses of the electricians' calendar feeds.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('day_plan_settings', (t) => {
    t.integer('organisation_id').primary().references('id').inTable('organisations').onDelete('CASCADE');
    t.smallint('road_factor_percent').notNullable();
    t.smallint('average_speed_mph').notNullable();
    t.smallint('setup_minutes').notNullable();
    t.smallint('flat_item_minutes').notNullable();
    t.string('day_start', 5).notNullable();
    t.string('day_end', 5).notNullable();
    t.string('lunch_start', 5).notNullable();
    t.smallint('lunch_minutes').notNullable();
    t.string('shop_street', 200).notNullable();
    t.string('shop_city', 100).notNullable();
    t.string('shop_state', 2).notNullable();
    t.string('shop_zip', 5).notNullable();
    t.double('shop_latitude');
    t.double('shop_longitude');
    t.integer('version').notNullable().defaultTo(1);
    t.integer('updated_by').references('id').inTable('users').onDelete('SET NULL');
    t.timestamp('updated_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
  });

  await knex.schema.alterTable('repair_requests', (t) => {
    /** Coordinates entered by the contractor (a dropped pin or typed in); null: the ZIP code's centre. */
    t.double('latitude');
    t.double('longitude');
  });
  await knex.raw('ALTER TABLE repair_requests ADD CONSTRAINT repair_requests_pin_check CHECK ((latitude IS NULL) = (longitude IS NULL) AND (latitude IS NULL OR (latitude BETWEEN -90 AND 90 AND longitude BETWEEN -180 AND 180)))');

  await knex.schema.createTable('calendar_feeds', (t) => {
    t.integer('user_id').primary().references('id').inTable('users').onDelete('CASCADE');
    /** SHA-256 of the secret in the feed's address: the address itself is never stored. */
    t.string('token_sha256', 64).notNullable().unique();
    t.integer('created_by').references('id').inTable('users').onDelete('SET NULL');
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('calendar_feeds');
  await knex.raw('ALTER TABLE repair_requests DROP CONSTRAINT repair_requests_pin_check');
  await knex.schema.alterTable('repair_requests', (t) => {
    t.dropColumn('longitude');
    t.dropColumn('latitude');
  });
  await knex.schema.dropTable('day_plan_settings');
}
