import { randomBytes } from 'node:crypto';
import type { Knex } from 'knex';
import { ORGANISATIONS, PEOPLE, REQUESTS, type DemoRequest } from './data/demo-scenario';

/** The status a line item has once its request reached `status` (demo data only). */
const ITEM_STATUS_FOR_REQUEST: Record<string, string> = {
  pricing: 'open',
  quoted: 'priced',
  approved: 'approved',
  scheduled: 'approved',
  'in-progress': 'approved',
  corrected: 'done',
  'letter-issued': 'done',
  accepted: 'accepted',
  declined: 'declined',
};

function isoDateIn(days: number): string {
  const d = new Date();
  d.setUTCDate(d.getUTCDate() + days);
  return d.toISOString().slice(0, 10);
}

// Resets the requests and creates the dozen demo requests with their parties, history and items.
export async function seed(knex: Knex): Promise<void> {
  await knex.raw('TRUNCATE request_status_changes, request_parties, line_items, repair_requests RESTART IDENTITY CASCADE');
  const users = new Map<string, { id: number; email: string }>();
  for (const p of PEOPLE) {
    const row = await knex('users').where({ email: p.email }).first('id', 'email');
    users.set(p.key, row);
  }
  const orgs = new Map<string, number>();
  for (const o of ORGANISATIONS) {
    const row = await knex('organisations').where({ name: o.name }).first('id');
    orgs.set(o.key, row.id);
  }

  for (const [index, r] of REQUESTS.entries()) {
    await seedRequest(knex, r, index, users, orgs);
  }
}

async function seedRequest(
  knex: Knex,
  r: DemoRequest,
  index: number,
  users: Map<string, { id: number; email: string }>,
  orgs: Map<string, number>,
): Promise<void> {
  const agent = users.get(r.buyerAgent)!;
  const status = r.path[r.path.length - 1];
  // Requests were opened some days before closing; each later step came a day after the one before.
  const openedAt = new Date(Date.now() - (r.path.length + 2 + index) * 86_400_000);
  const [row] = await knex('repair_requests')
    .insert({
      street: r.street,
      city: r.city,
      state: 'CO',
      zip: r.zip,
      year_built: r.yearBuilt,
      closing_date: isoDateIn(r.closingInDays),
      nec_edition: r.necEdition,
      status,
      contractor_organisation_id: r.contractor ? orgs.get(r.contractor) : null,
      created_by: agent.id,
      created_at: openedAt,
      updated_at: new Date(openedAt.getTime() + (r.path.length - 1) * 86_400_000),
    })
    .returning('id');
  const requestId: number = row.id;

  await knex('request_status_changes').insert(
    r.path.map((to, step) => ({
      request_id: requestId,
      from_status: step === 0 ? null : r.path[step - 1],
      to_status: to,
      changed_by: agent.id,
      note: step === 0 ? 'Request opened' : null,
      created_at: new Date(openedAt.getTime() + step * 86_400_000),
    })),
  );

  const parties: { role: string; key: string | null }[] = [
    { role: 'buyer-agent', key: r.buyerAgent },
    { role: 'listing-agent', key: r.listingAgent },
    { role: 'seller', key: r.seller },
    { role: 'inspector', key: r.inspector },
  ];
  for (const party of parties) {
    if (!party.key) continue;
    const user = users.get(party.key)!;
    await knex('request_parties').insert({ request_id: requestId, role: party.role, email: user.email, user_id: user.id, invited_by: agent.id, joined_at: openedAt });
  }
  if (r.invitedSellerEmail) {
    await knex('request_parties').insert({
      request_id: requestId,
      role: 'seller',
      email: r.invitedSellerEmail,
      invite_token: randomBytes(24).toString('base64url'),
      invite_expires_at: new Date(Date.now() + 14 * 86_400_000),
      invited_by: agent.id,
    });
  }

  const itemStatus = ITEM_STATUS_FOR_REQUEST[status];
  if (itemStatus && r.items.length) {
    await knex('line_items').insert(
      r.items.map((item) => ({
        request_id: requestId,
        code: item.code,
        room: item.room,
        location: item.location,
        quantity: item.quantity,
        severity: item.severity,
        nec_refs: item.necRefs,
        status: itemStatus,
      })),
    );
  }
}
