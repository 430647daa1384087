// Test data built through the same repositories the app uses, plus signed-in supertest agents.
import bcrypt from 'bcryptjs';
import type { Express } from 'express';
import request from 'supertest';
import type { CreateRepairRequest, CurrentUser, OrganisationKind, Role } from '@cc/shared';
import type { Db } from '../../server/src/db/knex';

export const PASSWORD = 'correct horse battery';

/** Empties every table the app writes (the schema stays). */
export async function resetDatabase(db: Db): Promise<void> {
  const { rows } = await db.raw<{ rows: { tablename: string }[] }>(
    "SELECT tablename FROM pg_tables WHERE schemaname = 'public' AND tablename NOT LIKE 'knex_%'",
  );
  if (rows.length) await db.raw(`TRUNCATE ${rows.map((r) => `"${r.tablename}"`).join(', ')} RESTART IDENTITY CASCADE`);
}

let counter = 0;
const unique = () => `${Date.now().toString(36)}${(counter++).toString(36)}`;

export async function createOrganisation(db: Db, kind: OrganisationKind, name = `Org ${unique()}`): Promise<number> {
  const [row] = await db('organisations')
    .insert({
      name,
      kind,
      licence_number: kind === 'contractor' ? `EC-${unique()}` : null,
      licence_state: kind === 'contractor' ? 'CO' : null,
      licence_class: kind === 'contractor' ? 'Electrical contractor' : null,
    })
    .returning('id');
  return row.id;
}

let passwordHash: Promise<string> | undefined;

export async function createUser(db: Db, role: Role, organisationId: number | null = null, email = `${role}-${unique()}@people.test`): Promise<CurrentUser> {
  passwordHash ??= bcrypt.hash(PASSWORD, 4);
  const [row] = await db('users')
    .insert({ email, name: `${role} ${unique()}`, role, organisation_id: organisationId, password_hash: await passwordHash })
    .returning('*');
  return { id: row.id, email: row.email, name: row.name, role: row.role, organisationId: row.organisation_id, organisationName: null };
}

/** A supertest agent holding a session cookie, and the CSRF token to send with writes. */
export interface SignedIn {
  agent: ReturnType<typeof request.agent>;
  csrfToken: string;
  user: CurrentUser;
}

export async function csrfTokenFor(agent: ReturnType<typeof request.agent>): Promise<string> {
  const res = await agent.get('/api/auth/csrf').expect(200);
  return res.body.csrfToken;
}

export async function signIn(app: Express, user: CurrentUser, password = PASSWORD): Promise<SignedIn> {
  const agent = request.agent(app);
  const token = await csrfTokenFor(agent);
  const res = await agent.post('/api/auth/sign-in').set('x-csrf-token', token).send({ email: user.email, password });
  if (res.status !== 200) throw new Error(`sign-in of ${user.email} failed: ${res.status} ${JSON.stringify(res.body)}`);
  return { agent, csrfToken: res.body.csrfToken, user };
}

export function validRequestBody(overrides: Partial<CreateRepairRequest> = {}): CreateRepairRequest {
  return {
    street: '14 Test Hollow Road',
    city: 'Marlow Springs',
    state: 'CO',
    zip: '81290',
    yearBuilt: 1978,
    closingDate: '2027-01-15',
    ...overrides,
  };
}
