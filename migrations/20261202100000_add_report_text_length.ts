import type { Knex } from 'knex';

// Report lists carry summaries: the length of each report's text is kept beside it, so that the
// pages themselves are read only when someone opens the text.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('report_files', (t) => {
    t.integer('text_length').notNullable().defaultTo(0);
  });
  await knex.raw(
    'UPDATE report_files SET text_length = coalesce((SELECT sum(length(p)) FROM jsonb_array_elements_text(pages) AS p), 0)',
  );
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('report_files', (t) => {
    t.dropColumn('text_length');
  });
}
