import type { Knex } from 'knex';

// A proposed item may now be read from a device word and a condition word in one clause, with no
// phrase of the parser's table (confidence `composed`, see shared/src/findings/device-condition.ts).
export async function up(knex: Knex): Promise<void> {
  await knex.raw('ALTER TABLE line_items DROP CONSTRAINT IF EXISTS line_items_confidence_check');
  await knex.raw(
    "ALTER TABLE line_items ADD CONSTRAINT line_items_confidence_check CHECK (confidence IS NULL OR confidence IN ('exact', 'normalised', 'composed', 'inferred'))",
  );
}

export async function down(knex: Knex): Promise<void> {
  await knex.raw("UPDATE line_items SET confidence = 'inferred' WHERE confidence = 'composed'");
  await knex.raw('ALTER TABLE line_items DROP CONSTRAINT IF EXISTS line_items_confidence_check');
  await knex.raw(
    "ALTER TABLE line_items ADD CONSTRAINT line_items_confidence_check CHECK (confidence IS NULL OR confidence IN ('exact', 'normalised', 'inferred'))",
  );
}
