import type { Knex } from 'knex';

// The invoice payable at closing is e-mailed to the escrow company with its PDF attached: the outbox
// row names the invoice and the worker renders the PDF when it sends (off the request that caused it).
// The development mailbox lists what each captured message carried as attachments.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('outbox_messages', (t) => {
    t.integer('attachment_invoice_id').references('id').inTable('invoices').onDelete('SET NULL');
  });
  await knex.schema.alterTable('invoices', (t) => {
    /** An invoice payable at closing: the address it was last e-mailed to, and how many times it was sent. */
    t.string('sent_to', 254);
    t.integer('send_count').notNullable().defaultTo(0);
  });
  await knex.schema.alterTable('captured_mail', (t) => {
    /** [{fileName, contentType, bytes}] of the parts received as attachments. */
    t.jsonb('attachments').notNullable().defaultTo('[]');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('captured_mail', (t) => {
    t.dropColumn('attachments');
  });
  await knex.schema.alterTable('invoices', (t) => {
    t.dropColumn('sent_to');
    t.dropColumn('send_count');
  });
  await knex.schema.alterTable('outbox_messages', (t) => {
    t.dropColumn('attachment_invoice_id');
  });
}
