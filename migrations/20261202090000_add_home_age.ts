import type { Knex } from 'knex';

// Home age: the request list filters by the year a house was built, and a sent quote keeps each
// line's note on the code in force when the house was built as it read when the quote was sent.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('repair_requests', (t) => {
    t.index(['year_built'], 'repair_requests_year_built_index');
  });
  await knex.schema.alterTable('quote_lines', (t) => {
    /** The item's edition note when sent (shared `ItemEditionNoteSchema`), null when it had none. */
    t.jsonb('edition_note');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('quote_lines', (t) => {
    t.dropColumn('edition_note');
  });
  await knex.schema.alterTable('repair_requests', (t) => {
    t.dropIndex(['year_built'], 'repair_requests_year_built_index');
  });
}
