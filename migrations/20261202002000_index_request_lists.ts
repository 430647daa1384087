import type { Knex } from 'knex';

// Request lists sort within the viewer's scope: a contractor's lists read the organisation's rows in
// the order of the sort, and the administrator's lists read the whole table in that order, so each
// sort has an index that delivers its first page without sorting every visible row.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('repair_requests', (t) => {
    t.index(['contractor_organisation_id', 'closing_date', 'id'], 'repair_requests_contractor_closing_index');
    t.index(['contractor_organisation_id', 'created_at', 'id'], 'repair_requests_contractor_created_index');
    t.index(['created_at', 'id'], 'repair_requests_created_index');
    t.index(['street', 'id'], 'repair_requests_street_index');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('repair_requests', (t) => {
    t.dropIndex([], 'repair_requests_contractor_closing_index');
    t.dropIndex([], 'repair_requests_contractor_created_index');
    t.dropIndex([], 'repair_requests_created_index');
    t.dropIndex([], 'repair_requests_street_index');
  });
}
