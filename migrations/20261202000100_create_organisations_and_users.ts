import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('organisations', (t) => {
    t.increments('id');
    t.string('name', 160).notNullable();
    t.string('kind', 32).notNullable();
    t.string('phone', 40);
    t.string('address', 300);
    t.string('licence_number', 60);
    t.string('licence_state', 2);
    t.string('licence_class', 80);
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp('updated_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.index(['kind', 'name']);
  });
  await knex.raw(
    "ALTER TABLE organisations ADD CONSTRAINT organisations_kind_check CHECK (kind IN ('brokerage', 'contractor', 'inspection-company', 'platform'))",
  );

  await knex.schema.createTable('users', (t) => {
    t.increments('id');
    t.string('email', 254).notNullable();
    t.string('name', 120).notNullable();
    t.string('password_hash', 100).notNullable();
    t.string('role', 20).notNullable();
    t.integer('organisation_id').references('id').inTable('organisations').onDelete('RESTRICT');
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp('updated_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.index(['organisation_id']);
  });
  await knex.raw('CREATE UNIQUE INDEX users_email_unique ON users (lower(email))');
  await knex.raw(
    "ALTER TABLE users ADD CONSTRAINT users_role_check CHECK (role IN ('agent', 'seller', 'contractor', 'inspector', 'admin'))",
  );
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('users');
  await knex.schema.dropTable('organisations');
}
