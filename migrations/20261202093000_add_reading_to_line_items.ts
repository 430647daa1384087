import type { Knex } from 'knex';

// How the report reader arrived at each proposed item: its confidence (an exact phrase, a
// normalised match, or inferred from context), the report's follow-up text that belongs to it
// ("This should be corrected by a licensed electrician."), and for a computed finding the
// computation ("40 A breaker on 10 AWG copper; NEC 240.4(D) allows 30 A"). Items a person adds
// carry no confidence.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('line_items', (t) => {
    t.string('confidence', 16);
    t.text('recommendation');
    t.text('computation');
  });
  await knex.raw(
    "ALTER TABLE line_items ADD CONSTRAINT line_items_confidence_check CHECK (confidence IS NULL OR confidence IN ('exact', 'normalised', 'inferred'))",
  );
}

export async function down(knex: Knex): Promise<void> {
  await knex.raw('ALTER TABLE line_items DROP CONSTRAINT IF EXISTS line_items_confidence_check');
  await knex.schema.alterTable('line_items', (t) => {
    t.dropColumn('computation');
    t.dropColumn('recommendation');
    t.dropColumn('confidence');
  });
}
