import type { Knex } from 'knex';

// The capacity in which a change order was decided, as for quote approvals (migration
// 20261205090000, shared SIGNER_CAPACITIES): by the seller, by the listing agent for the seller, or by
// an administrator for the seller's side. Null while the change order waits. Decisions made before are
// read from the decider's part on the request in the same way.
export async function up(knex: Knex): Promise<void> {
  await knex.raw('ALTER TABLE change_orders ADD COLUMN signer_capacity text');
  await knex.raw(`
    UPDATE change_orders c SET signer_capacity = CASE
      WHEN EXISTS (SELECT 1 FROM request_parties p WHERE p.request_id = c.request_id AND p.user_id = c.decided_by AND p.role = 'seller') THEN 'seller'
      WHEN EXISTS (SELECT 1 FROM request_parties p WHERE p.request_id = c.request_id AND p.user_id = c.decided_by AND p.role = 'listing-agent') THEN 'listing-agent'
      ELSE 'admin' END
    WHERE c.decided_by IS NOT NULL`);
  await knex.raw(
    "ALTER TABLE change_orders ADD CONSTRAINT change_orders_signer_capacity_check CHECK ((decided_by IS NULL AND signer_capacity IS NULL) OR (decided_by IS NOT NULL AND signer_capacity IN ('seller', 'listing-agent', 'admin')))",
  );
}

export async function down(knex: Knex): Promise<void> {
  await knex.raw('ALTER TABLE change_orders DROP COLUMN IF EXISTS signer_capacity');
}
