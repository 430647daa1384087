import type { Knex } from 'knex';

// Inspection-report excerpts uploaded to a request (PDF, text file or pasted text), with the text
// extracted per page, and the link from each parsed line item back to its place in that text.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('report_files', (t) => {
    t.increments('id');
    t.integer('request_id').notNullable().references('id').inTable('repair_requests').onDelete('CASCADE');
    t.string('sha256', 64).notNullable();
    t.string('kind', 10).notNullable();
    t.string('original_name', 255).notNullable();
    t.integer('size_bytes').notNullable();
    t.integer('page_count').notNullable();
    /** Key of the stored bytes in the file storage (content-addressed: the same bytes are kept once). */
    t.string('storage_key', 100).notNullable();
    t.jsonb('pages').notNullable();
    t.integer('skipped_count').notNullable().defaultTo(0);
    t.jsonb('skipped').notNullable().defaultTo('[]');
    t.integer('uploaded_by').references('id').inTable('users').onDelete('SET NULL');
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.unique(['request_id', 'sha256']);
  });
  await knex.raw("ALTER TABLE report_files ADD CONSTRAINT report_files_kind_check CHECK (kind IN ('pdf', 'text', 'pasted'))");

  await knex.schema.alterTable('line_items', (t) => {
    t.integer('report_file_id').references('id').inTable('report_files').onDelete('SET NULL');
    t.integer('evidence_start');
    t.integer('evidence_end');
    t.index(['report_file_id']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('line_items', (t) => {
    t.dropColumn('evidence_end');
    t.dropColumn('evidence_start');
    t.dropColumn('report_file_id');
  });
  await knex.schema.dropTable('report_files');
}
