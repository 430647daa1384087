import type { Knex } from 'knex';

// The capacity in which a quote approval was signed: by the seller, by the listing agent for the
// seller, or by an administrator for the seller's side (shared SIGNER_CAPACITIES). Signatures given
// before are read from the signer's part on the request: the seller if they are the seller, else
// the listing agent if they are that, else an administrator.
export async function up(knex: Knex): Promise<void> {
  await knex.raw("ALTER TABLE quote_approvals ADD COLUMN signer_capacity text NOT NULL DEFAULT 'seller'");
  await knex.raw(`
    UPDATE quote_approvals a SET signer_capacity = CASE
      WHEN EXISTS (SELECT 1 FROM request_parties p WHERE p.request_id = a.request_id AND p.user_id = a.signed_by AND p.role = 'seller') THEN 'seller'
      WHEN EXISTS (SELECT 1 FROM request_parties p WHERE p.request_id = a.request_id AND p.user_id = a.signed_by AND p.role = 'listing-agent') THEN 'listing-agent'
      ELSE 'admin' END`);
  await knex.raw("ALTER TABLE quote_approvals ALTER COLUMN signer_capacity DROP DEFAULT");
  await knex.raw("ALTER TABLE quote_approvals ADD CONSTRAINT quote_approvals_signer_capacity_check CHECK (signer_capacity IN ('seller', 'listing-agent', 'admin'))");
}

export async function down(knex: Knex): Promise<void> {
  await knex.raw('ALTER TABLE quote_approvals DROP COLUMN IF EXISTS signer_capacity');
}
