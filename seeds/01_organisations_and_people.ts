import bcrypt from 'bcryptjs';
import type { Knex } from 'knex';
import { DEMO_PASSWORD, ORGANISATIONS, PEOPLE } from './data/demo-scenario';

// Resets everything people-related (and so, by cascade, every request) and creates the demo cast.
export async function seed(knex: Knex): Promise<void> {
  await knex.raw('TRUNCATE sessions, request_status_changes, request_parties, line_items, repair_requests, users, organisations RESTART IDENTITY CASCADE');

  const orgIds = new Map<string, number>();
  for (const { key, ...org } of ORGANISATIONS) {
    const [row] = await knex('organisations')
      .insert({
        name: org.name,
        kind: org.kind,
        phone: org.phone,
        address: org.address,
        licence_number: 'licenceNumber' in org ? org.licenceNumber : null,
        licence_state: 'licenceState' in org ? org.licenceState : null,
        licence_class: 'licenceClass' in org ? org.licenceClass : null,
      })
      .returning('id');
    orgIds.set(key, row.id);
  }

  // The server's cost (BCRYPT_ROUNDS, default 12): a cheaper seed hash would make sign-in to demo
  // accounts measurably faster than to unknown e-mails.
  const passwordHash = await bcrypt.hash(DEMO_PASSWORD, Number(process.env.BCRYPT_ROUNDS ?? 12));
  await knex('users').insert(
    PEOPLE.map((p) => ({
      email: p.email,
      name: p.name,
      role: p.role,
      organisation_id: p.org ? orgIds.get(p.org) : null,
      password_hash: passwordHash,
    })),
  );
}
